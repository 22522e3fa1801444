using System.Globalization;
using System.Text;
using QaService.Core.Reporting.Plots;
using static QaService.Core.Reporting.Html.HtmlText;

namespace QaService.Core.Reporting.Html;

/// <summary>
/// Renders a stored report as one self-contained HTML page (api-v1 "report.html"): inline CSS and SVG, no
/// script, no external resource. Lays out what the report model and <see cref="PlotData"/> hold; computes no figure.
/// </summary>
public static class ReportPage
{
    public static string Render(AssessmentReport report) => Render(report, PlotDataBuilder.Build(report));

    /// <summary>The page with the sign-off section (decisions and hash are extra data: the stored report is not touched).</summary>
    public static string Render(AssessmentReport report, SignOffPanel? signOff) => Render(report, PlotDataBuilder.Build(report), signOff);

    public static string Render(AssessmentReport report, PlotData plots, SignOffPanel? signOff = null)
    {
        var html = new StringBuilder(64 * 1024);
        string title = string.IsNullOrWhiteSpace(report.Title) ? "Untitled assessment" : report.Title;
        PageShell.Open(html, $"{title} — accuracy report", title, "QaService · positional accuracy report");
        html.Append($"<p class=\"meta\">Report <code>{Escape(report.Id)}</code> · made {Escape(report.CreatedAt.UtcDateTime.ToString("yyyy-MM-dd HH:mm 'UTC'", CultureInfo.InvariantCulture))}")
            .Append($" · <a class=\"no-print\" href=\"{ReportLinks.Json(report.Id)}\">JSON</a> <a class=\"no-print\" href=\"/\">all assessments</a></p>");

        AnswerSection.Render(html, report);
        FiguresSection.Render(html, report);
        GroupsSection.Render(html, report);
        PlotsSection.Render(html, report, plots);
        ChecksSection.Render(html, report);
        ResidualTable.Render(html, report, plots);
        MethodNotes.Render(html, report);
        CautionsSection.Render(html, report);
        if (signOff is not null)
            SignOffSection.Render(html, report.Id, signOff);

        PageShell.Close(html, $"Report {Escape(report.Id)}. A statistical accuracy test of the submitted positions against the submitted check points; not a survey certification.");
        return html.ToString();
    }
}
