using System.Text;
using QaService.Core.Reporting.Plots;
using static QaService.Core.Reporting.Html.HtmlText;

namespace QaService.Core.Reporting.Html;

/// <summary>Every pair: ids, how it was paired, the residual components and the findings that name it.</summary>
internal static class ResidualTable
{
    public static void Render(StringBuilder html, AssessmentReport report, PlotData plots)
    {
        html.Append("<section id=\"pairs\" aria-labelledby=\"pairs-h\"><h2 id=\"pairs-h\"><span class=\"num\">5</span> Every pair</h2>")
            .Append($"<p class=\"small\">Download as <a href=\"{ReportLinks.Csv(report.Id)}\">CSV</a> or <a href=\"{ReportLinks.GeoJson(report.Id)}\">GeoJSON</a> (mark positions in WGS 84).</p>")
            .Append("<table class=\"residuals\" id=\"residual-table\"><caption>Residuals, fix − mark in east-north-up at the mark, metres</caption><thead><tr>")
            .Append("<th scope=\"col\">mark</th><th scope=\"col\">fix</th><th scope=\"col\">paired by</th><th scope=\"col\" class=\"n\">dE</th><th scope=\"col\" class=\"n\">dN</th><th scope=\"col\" class=\"n\">dH</th><th scope=\"col\" class=\"n\">dU</th><th scope=\"col\">flags</th>")
            .Append("</tr></thead><tbody>");
        for (int i = 0; i < report.Residuals.Count; i++)
        {
            var r = report.Residuals[i];
            var flags = plots.Flags[i];
            string rowClass = r.Excluded is not null ? " class=\"excluded\"" : flags.Count > 0 ? " class=\"flagged\"" : "";
            string flagText = flags.Count == 0 ? "" : string.Join(", ", flags.Select(Escape));
            if (r.Excluded is not null)
                flagText += $" <span class=\"why\">({Escape(r.Excluded)})</span>";
            html.Append($"<tr{rowClass}><th scope=\"row\">{Escape(r.Mark)}</th><td>{Escape(r.Fix)}</td><td>{Escape(r.PairedBy)}</td>")
                .Append($"<td class=\"n\">{Metres(r.DE)}</td><td class=\"n\">{Metres(r.DN)}</td><td class=\"n\">{Metres(r.DH)}</td><td class=\"n\">{Metres(r.DU)}</td><td>{flagText}</td></tr>");
        }

        html.Append("</tbody></table></section>");
    }
}
