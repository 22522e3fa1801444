using System.Text;
using static QaService.Core.Reporting.Html.HtmlText;

namespace QaService.Core.Reporting.Html;

/// <summary>Each finding about the data with its evidence: measured value, limit, unit and the points it names.</summary>
internal static class ChecksSection
{
    public static void Render(StringBuilder html, AssessmentReport report)
    {
        html.Append("<section id=\"checks\" aria-labelledby=\"checks-h\"><h2 id=\"checks-h\"><span class=\"num\">4</span> Findings about the data</h2>")
            .Append("<table class=\"checks\"><caption>Checks run on the paired points</caption><thead><tr>")
            .Append("<th scope=\"col\">check</th><th scope=\"col\">status</th><th scope=\"col\">finding</th><th scope=\"col\" class=\"n\">measured</th><th scope=\"col\" class=\"n\">limit</th><th scope=\"col\">points named</th>")
            .Append("</tr></thead><tbody>");
        foreach (var c in report.Checks)
        {
            var (tag, label) = c.Status switch
            {
                CheckStatus.Pass => ("t-pass", "✓ pass"),
                CheckStatus.Warn => ("t-warn", "! warn"),
                _ => ("t-fail", "✗ fail"),
            };
            string unit = string.IsNullOrEmpty(c.Unit) ? "" : " " + Escape(c.Unit);
            string measured = c.Measured is { } m ? Number(m, 4) + unit : "–";
            string limit = c.Threshold is { } t ? Number(t, 4) + unit : "–";
            string items = c.Items is { Count: > 0 } list ? string.Join(", ", list.Select(Escape)) : "–";
            html.Append($"<tr><th scope=\"row\"><code>{Escape(c.Id)}</code></th><td><span class=\"tag {tag}\">{label}</span></td><td>{Escape(c.Message)}</td>")
                .Append($"<td class=\"n\">{measured}</td><td class=\"n\">{limit}</td><td class=\"items\">{items}</td></tr>");
        }

        html.Append("</tbody></table></section>");
    }
}
