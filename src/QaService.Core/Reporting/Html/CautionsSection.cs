using System.Text;
using static QaService.Core.Reporting.Html.HtmlText;

namespace QaService.Core.Reporting.Html;

/// <summary>What the report is not, and what to watch before signing it.</summary>
internal static class CautionsSection
{
    public static void Render(StringBuilder html, AssessmentReport report)
    {
        html.Append("<section id=\"cautions\" aria-labelledby=\"cautions-h\"><h2 id=\"cautions-h\"><span class=\"num\">7</span> Before you sign</h2><ul class=\"cautions\">");
        foreach (var caution in report.Cautions)
            html.Append($"<li>{Escape(caution)}</li>");
        html.Append("</ul></section>");
    }
}
