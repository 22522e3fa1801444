using System.Globalization;
using System.Text;
using QaService.Api.Security;
using QaService.Api.Reports;
using QaService.Api.Storage;
using QaService.Core.Reporting.Html;
using static QaService.Core.Reporting.Html.HtmlText;

namespace QaService.Api.Home;

/// <summary>
/// The small web UI at <c>/</c>: recent assessments, the way into the guided upload (<see cref="Upload.GuidedUploadApi"/>)
/// and, for those who write JSON, an upload form whose parts are exactly the contract's multipart request
/// (<c>options</c>, <c>marks</c>, <c>fixes</c>). Server-rendered, no script.
/// </summary>
internal static class HomePage
{
    /// <summary>How many assessments the list shows.</summary>
    public const int RecentCount = 50;

    /// <summary>The options the form starts with: the contract's JSON request without points.</summary>
    public const string OptionsTemplate = """
        {
          "title": "Hydrant survey, batch 1",
          "marks": { "crs": "EPSG:32633", "heights": "ellipsoidal" },
          "fixes": { "crs": "EPSG:4979", "heights": "ellipsoidal" },
          "spec": { "standard": "nssda", "horizontal": 0.50, "vertical": 1.00 }
        }
        """;

    public static void MapHome(this IEndpointRouteBuilder routes)
    {
        routes.MapGet("/", ShowAsync).ExcludeFromDescription();
        routes.MapPost(UploadForm.Path, (HttpContext context, EndpointDataSource endpoints) => UploadForm.SubmitAsync(context, endpoints))
            .AddEndpointFilter(new UiAntiforgery(tokenInQuery: true)).ExcludeFromDescription();
        routes.MapSignIn();
    }

    private static async Task<IResult> ShowAsync(HttpContext context, IReportStore store, Microsoft.AspNetCore.Antiforgery.IAntiforgery antiforgery, CancellationToken cancellationToken)
    {
        // With API keys required a browser without a session is nobody's tenant: it is asked to sign in.
        if (context.Features.Get<TenantFeature>() is not { } tenant)
            return SignInPage.Form(context);
        var recent = await store.ListRecentAsync(tenant.TenantId, RecentCount, cancellationToken);
        var signOut = context.User.Identity?.IsAuthenticated == true ? SignInPage.SignOutForm(context) : "";
        return new HtmlPage(Render(recent, UiAntiforgery.Token(context), signOut));
    }

    /// <param name="antiforgeryToken">Request token for the upload form (<see cref="UiAntiforgery"/>).</param>
    /// <param name="signOutForm">Markup of the sign-out button of a signed-in browser, or empty.</param>
    internal static string Render(IReadOnlyList<ReportSummary> recent, string antiforgeryToken, string signOutForm = "")
    {
        var html = new StringBuilder();
        PageShell.Open(html, "QaService — accuracy tests", "Accuracy tests of GNSS field positions", "QaService");
        html.Append("<p>Test field fixes against surveyed check points: NSSDA, RMSE and exact circular-error figures, checks, a verdict and a report to sign.</p>")
            .Append(signOutForm);
        AppendList(html, recent);
        AppendForm(html, antiforgeryToken);

        html.Append("<section aria-labelledby=\"more-h\"><h2 id=\"more-h\"><span class=\"num\">3</span> More</h2><ul>")
            .Append($"<li><a href=\"{ReportListPage.Path}\">All assessments</a>: filter, page through, delete</li>")
            .Append("<li><a href=\"/swagger\">API explorer</a> and the <a href=\"/openapi/v1.json\">OpenAPI document</a></li>")
            .Append("<li><a href=\"/v1/assessments/demo/report.html\">the demo report</a> (invented data) · <a href=\"/healthz\">/healthz</a> · <a href=\"/readyz\">/readyz</a></li></ul></section>");
        PageShell.Close(html, "Reports are statistical accuracy tests of submitted positions, not survey certifications.");
        return html.ToString();
    }

    private static void AppendList(StringBuilder html, IReadOnlyList<ReportSummary> recent)
    {
        html.Append("<section aria-labelledby=\"recent-h\"><h2 id=\"recent-h\"><span class=\"num\">1</span> Recent assessments</h2>");
        if (recent.Count == 0)
        {
            html.Append("<p class=\"none\">None yet. Upload a pair of files below.</p>");
        }
        else
        {
            html.Append("<table id=\"recent\"><caption>Newest first</caption><thead><tr><th scope=\"col\">made (UTC)</th><th scope=\"col\">title</th><th scope=\"col\">verdict</th><th scope=\"col\">views</th></tr></thead><tbody>");
            foreach (var r in recent)
            {
                string tag = r.Verdict switch { "pass" => "t-pass", "fail" => "t-fail", _ => "t-warn" };
                html.Append($"<tr><td class=\"n\">{Escape(r.CreatedAt.UtcDateTime.ToString("yyyy-MM-dd HH:mm", CultureInfo.InvariantCulture))}</td>")
                    .Append($"<th scope=\"row\"><a href=\"{ReportLinks.Page(r.Id)}\">{Escape(string.IsNullOrWhiteSpace(r.Title) ? "(untitled)" : r.Title)}</a></th>")
                    .Append($"<td><span class=\"tag {tag}\">{Escape(r.Verdict)}</span></td>")
                    .Append($"<td><a href=\"{ReportLinks.Json(r.Id)}\">JSON</a> · <a href=\"{ReportLinks.Csv(r.Id)}\">CSV</a> · <a href=\"{ReportLinks.GeoJson(r.Id)}\">GeoJSON</a></td></tr>");
            }

            html.Append("</tbody></table>");
        }

        html.Append("</section>");
    }

    private static void AppendForm(StringBuilder html, string antiforgeryToken)
    {
        html.Append("<section aria-labelledby=\"upload-h\"><h2 id=\"upload-h\"><span class=\"num\">2</span> Test a new batch</h2>")
            .Append($"<p class=\"start\"><a id=\"start-guided\" class=\"button\" href=\"{Upload.GuidedUploadApi.Root}/new\">Start a guided upload</a></p>")
            .Append("<p>Choose each side's coordinate system from the catalog, the standard and the required accuracy, send the two files, check how their first rows are read, then run the test. No JSON to write.</p>")
            .Append("<h3 id=\"json-h\">Or send the options as JSON</h3>")
            .Append($"<form id=\"upload\" class=\"upload\" method=\"post\" action=\"{UploadForm.Path}?{UiAntiforgery.QueryField}={Escape(Uri.EscapeDataString(antiforgeryToken))}\" enctype=\"multipart/form-data\" aria-labelledby=\"json-h\">")
            .Append("<p><label for=\"options\">Options (JSON): title, each side's <code>crs</code> and <code>heights</code>, the required accuracy in <code>spec</code>; for CSV files also <code>columns</code>.</label>")
            .Append($"<textarea id=\"options\" name=\"options\" rows=\"9\" spellcheck=\"false\">{Escape(OptionsTemplate)}</textarea></p>")
            .Append("<p><label for=\"marks\">Marks file (the surveyed check points)</label> <input id=\"marks\" name=\"marks\" type=\"file\" required accept=\".csv,.txt,.geojson,.json,.gpx,.nmea,.nma,.log\"></p>")
            .Append("<p><label for=\"fixes\">Fixes file (the field positions to test)</label> <input id=\"fixes\" name=\"fixes\" type=\"file\" required accept=\".csv,.txt,.geojson,.json,.gpx,.nmea,.nma,.log\"></p>")
            .Append("<p class=\"small\">Files: CSV with a header row, GeoJSON points, GPX 1.1 or NMEA 0183 (GGA); the format is recognised from the content.</p>")
            .Append("<p><button type=\"submit\">Run the test</button></p></form></section>");
    }
}
