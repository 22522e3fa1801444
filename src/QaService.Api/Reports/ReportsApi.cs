using QaService.Api.Problems;
using QaService.Api.Security;
using QaService.Api.SignOff;
using QaService.Api.Storage;
using QaService.Core.Reporting;
using QaService.Core.Reporting.Exports;
using QaService.Core.Reporting.Html;

namespace QaService.Api.Reports;

/// <summary>The views of a stored report (api-v1): a self-contained HTML page, the residuals as CSV and as GeoJSON.</summary>
internal static class ReportsApi
{
    public static RouteGroupBuilder MapReports(this IEndpointRouteBuilder routes)
    {
        var group = routes.MapGroup("/v1/assessments/{id}").WithTags("Reports");

        group.MapGet("/report.html", HtmlAsync)
            .WithName("GetAssessmentReportHtml")
            .WithSummary("The report as one self-contained HTML page (inline CSS and SVG plots, no script)")
            .Produces<string>(StatusCodes.Status200OK, "text/html")
            .ProducesProblem(StatusCodes.Status404NotFound);

        group.MapGet("/residuals.csv", CsvAsync)
            .WithName("GetAssessmentResidualsCsv")
            .WithSummary("The residual table as CSV (RFC 4180; text cells neutralised against spreadsheet formulas)")
            .Produces<string>(StatusCodes.Status200OK, "text/csv")
            .ProducesProblem(StatusCodes.Status404NotFound);

        group.MapGet("/residuals.geojson", GeoJsonAsync)
            .WithName("GetAssessmentResidualsGeoJson")
            .WithSummary("The residual vectors as a GeoJSON FeatureCollection (marks in WGS 84 lon/lat, residuals in metres)")
            .Produces<string>(StatusCodes.Status200OK, "application/geo+json")
            .ProducesProblem(StatusCodes.Status404NotFound);

        return group;
    }

    /// <summary>The page, with the decisions and the hash of the stored bytes beside the report (never inside its JSON).</summary>
    internal static async Task<IResult> HtmlAsync(string id, HttpContext context, IReportStore store, ITenantContext tenant, CancellationToken cancellationToken)
    {
        var (report, sha256) = await StoredReports.LoadHashedAsync(store, tenant.TenantId, id, cancellationToken);
        if (report is null)
            return NotFound(id);
        var signOff = await SignOffPanels.ForAsync(context, tenant.TenantId, report.Id, sha256!, cancellationToken);
        return new HtmlPage(ReportPage.Render(report, signOff));
    }

    internal static Task<IResult> CsvAsync(string id, IReportStore store, ITenantContext tenant, CancellationToken cancellationToken) =>
        WithReportAsync(id, store, tenant, cancellationToken, report => new DownloadResult(ResidualCsv.Write(report), ResidualCsv.MediaType, $"assessment-{report.Id}-residuals.csv"));

    internal static Task<IResult> GeoJsonAsync(string id, IReportStore store, ITenantContext tenant, CancellationToken cancellationToken) =>
        WithReportAsync(id, store, tenant, cancellationToken, report => new DownloadResult(ResidualGeoJson.Write(report), ResidualGeoJson.MediaType, $"assessment-{report.Id}-residuals.geojson"));

    private static async Task<IResult> WithReportAsync(string id, IReportStore store, ITenantContext tenant, CancellationToken cancellationToken, Func<AssessmentReport, IResult> view)
    {
        var report = await StoredReports.LoadAsync(store, tenant.TenantId, id, cancellationToken);
        return report is null ? NotFound(id) : view(report);
    }

    private static IResult NotFound(string id) =>
        InputProblems.Status(StatusCodes.Status404NotFound, "Assessment not found", $"there is no assessment with id \"{(id.Length <= 64 ? id : id[..64] + "…")}\"");
}
