namespace QaService.Core.Reporting.Html;

/// <summary>Paths of a report's own views (api-v1), escaped for URLs and for markup.</summary>
public static class ReportLinks
{
    public static string Page(string id) => Path(id, "report.html");

    public static string Csv(string id) => Path(id, "residuals.csv");

    public static string GeoJson(string id) => Path(id, "residuals.geojson");

    public static string Json(string id) => HtmlText.Escape($"/v1/assessments/{Uri.EscapeDataString(id)}");

    private static string Path(string id, string view) => HtmlText.Escape($"/v1/assessments/{Uri.EscapeDataString(id)}/{view}");
}
