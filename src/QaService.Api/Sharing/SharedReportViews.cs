using System.Text;
using QaService.Api.Problems;
using QaService.Api.Reports;
using QaService.Api.Storage;
using QaService.Core.Reporting;
using QaService.Core.Reporting.Exports;
using QaService.Core.Reporting.Html;
using static QaService.Core.Reporting.Html.HtmlText;

namespace QaService.Api.Sharing;

/// <summary>
/// <c>GET /shared/{token}/report.html</c>, <c>…/residuals.csv</c>, <c>…/residuals.geojson</c>: a report's views for
/// whoever holds a live share link, no credentials. Outside <c>/v1</c> on purpose (api-v1: every /v1 call needs a key).
/// An unknown, forged, revoked or expired link, or one whose report was deleted, is 404 alike.
/// </summary>
internal static class SharedReportViews
{
    public const string Root = "/shared";

    public static string PagePath(string token) => $"{Root}/{Uri.EscapeDataString(token)}/report.html";

    public static void MapSharedReports(this IEndpointRouteBuilder routes)
    {
        // Pages for people who got a link (like / and /ui/*), not API operations: kept out of the OpenAPI document,
        // where every 4xx is a problem body while an expired link's page is HTML.
        var group = routes.MapGroup(Root + "/{token}").WithTags("Share links").ExcludeFromDescription();
        group.MapGet("/report.html", PageAsync)
            .WithName("GetSharedReportHtml")
            .WithSummary("A shared report's HTML page (no credentials: the link is the permission)")
            .Produces<string>(StatusCodes.Status200OK, "text/html")
            .Produces<string>(StatusCodes.Status404NotFound, "text/html");
        group.MapGet("/residuals.csv", CsvAsync)
            .WithName("GetSharedResidualsCsv")
            .WithSummary("A shared report's residual table as CSV")
            .Produces<string>(StatusCodes.Status200OK, "text/csv")
            .ProducesProblem(StatusCodes.Status404NotFound);
        group.MapGet("/residuals.geojson", GeoJsonAsync)
            .WithName("GetSharedResidualsGeoJson")
            .WithSummary("A shared report's residual vectors as GeoJSON")
            .Produces<string>(StatusCodes.Status200OK, "application/geo+json")
            .ProducesProblem(StatusCodes.Status404NotFound);
    }

    internal static async Task<IResult> PageAsync(string token, ShareLinkSigning signing, IShareLinkStore links, IReportStore store, TimeProvider clock, HttpContext context)
    {
        var report = await LoadAsync(token, signing, links, store, clock, context);
        if (report is null)
            return new HtmlPage(GonePage(), StatusCodes.Status404NotFound);
        context.Response.Headers["X-Robots-Tag"] = "noindex, nofollow";
        // The page's download links point at /v1 (credentials); through a share link they point at the link's own views.
        var html = new StringBuilder(ReportPage.Render(report))
            .Replace($"href=\"{ReportLinks.Csv(report.Id)}\"", $"href=\"{Escape(ViewPath(token, "residuals.csv"))}\"")
            .Replace($"href=\"{ReportLinks.GeoJson(report.Id)}\"", $"href=\"{Escape(ViewPath(token, "residuals.geojson"))}\"");
        return new HtmlPage(html.ToString());
    }

    internal static async Task<IResult> CsvAsync(string token, ShareLinkSigning signing, IShareLinkStore links, IReportStore store, TimeProvider clock, HttpContext context) =>
        await LoadAsync(token, signing, links, store, clock, context) is { } report
            ? new DownloadResult(ResidualCsv.Write(report), ResidualCsv.MediaType, $"assessment-{report.Id}-residuals.csv")
            : NotFound();

    internal static async Task<IResult> GeoJsonAsync(string token, ShareLinkSigning signing, IShareLinkStore links, IReportStore store, TimeProvider clock, HttpContext context) =>
        await LoadAsync(token, signing, links, store, clock, context) is { } report
            ? new DownloadResult(ResidualGeoJson.Write(report), ResidualGeoJson.MediaType, $"assessment-{report.Id}-residuals.geojson")
            : NotFound();

    private static async Task<AssessmentReport?> LoadAsync(string token, ShareLinkSigning signing, IShareLinkStore links, IReportStore store, TimeProvider clock, HttpContext context)
    {
        var cancellationToken = context.RequestAborted;
        context.Response.Headers.CacheControl = "no-store";
        if (!await signing.IsAuthenticAsync(token, cancellationToken))
            return null;
        var link = await links.FindAsync(ShareLinkSigning.Hash(token), cancellationToken);
        if (link is null || link.ExpiresAt <= clock.GetUtcNow())
            return null;
        return await StoredReports.LoadAsync(store, link.Tenant, link.ReportId, cancellationToken);
    }

    private static string ViewPath(string token, string view) => $"{Root}/{Uri.EscapeDataString(token)}/{view}";

    private static IResult NotFound() =>
        InputProblems.Status(StatusCodes.Status404NotFound, "Share link not found", "this link does not exist, has expired or was revoked");

    private static string GonePage()
    {
        var html = new StringBuilder();
        PageShell.Open(html, "QaService — link not valid", "This link does not open a report", "QaService");
        html.Append("<p id=\"share-gone\">The link does not exist, has expired or was revoked, or its report was deleted. Ask whoever sent it for a new one.</p>");
        PageShell.Close(html, "Nothing is shown without a valid link.");
        return html.ToString();
    }
}
