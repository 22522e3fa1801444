using System.Globalization;
using System.Text;
using static QaService.Core.Reporting.Html.HtmlText;

namespace QaService.Core.Reporting.Html;

/// <summary>The report's groups side by side: one table per attribute (a column per value), then the tests of difference.</summary>
internal static class GroupsSection
{
    public static void Render(StringBuilder html, AssessmentReport report)
    {
        if (report.Groups is not { Count: > 0 } attributes)
            return;
        html.Append("<section id=\"groups\" aria-labelledby=\"groups-h\"><h2 id=\"groups-h\">Groups by fix attribute</h2>")
            .Append("<p>The counted pairs split by each attribute the fixes carry; every figure is defined and computed as in the figures above. ")
            .Append("Feature classes named in the spec are judged against their own required accuracy, other groups against the top-level spec.</p>");
        foreach (var attribute in attributes)
            Table(html, attribute);
        html.Append("</section>");
    }

    private static void Table(StringBuilder html, AttributeGroups attribute)
    {
        var groups = attribute.Groups;
        html.Append($"<table id=\"groups-{Escape(attribute.Attribute)}\" class=\"figures\"><caption>By <code>{Escape(attribute.Attribute)}</code>")
            .Append(attribute.WithoutValue > 0 ? Escape(Invariant($" ({attribute.WithoutValue} counted pairs carry no value)")) : "")
            .Append("</caption><thead><tr><th scope=\"col\">figure</th>");
        foreach (var g in groups)
            html.Append($"<th scope=\"col\" class=\"n\">{Escape(g.Value)}</th>");
        html.Append("</tr></thead><tbody>");
        Row(html, "n", groups, g => g.N.ToString(CultureInfo.InvariantCulture));
        Row(html, "rmseR (m)", groups, g => Metres(g.Horizontal.RmseR));
        Row(html, "horizontal nssda95 (m)", groups, g => Metres(g.Horizontal.Nssda95));
        Row(html, "ce90 (m)", groups, g => Metres(g.Horizontal.Ce90));
        Row(html, "meanE / meanN (m)", groups, g => $"{Metres(g.Horizontal.MeanE)} / {Metres(g.Horizontal.MeanN)}");
        Row(html, "vertical rmse (m)", groups, g => Metres(g.Vertical?.Rmse));
        Row(html, "vertical nssda95 (m)", groups, g => Metres(g.Vertical?.Nssda95));
        Row(html, "required h / v (m)", groups, g => g.Spec is null ? "–" : $"{Metres(g.Spec.Horizontal)} / {Metres(g.Spec.Vertical)}");
        Row(html, "spec from", groups, g => g.SpecSource);
        Row(html, "verdict", groups, g => g.Verdict.ToString().ToLowerInvariant());
        html.Append("</tbody></table>");
        if (attribute.Tests.Count == 0)
        {
            html.Append("<p class=\"none\">No test of difference: fewer than two groups with at least two pairs (and some spread).</p>");
            return;
        }
        html.Append("<ul class=\"group-tests\">");
        foreach (var t in attribute.Tests)
        {
            var differ = t.PValue < 0.05 ? "differ at the 5 % level" : "no difference shown at the 5 % level";
            html.Append("<li>").Append(Escape(Invariant(
                $"{t.Hypothesis} of {t.Quantity} across {t.Groups} groups: F = {t.Statistic:0.###} (ν₁ = {t.DegreesOfFreedom1:0.##}, ν₂ = {t.DegreesOfFreedom2:0.##}), p = {t.PValue:0.####} — {differ}. {t.Method}.")))
                .Append("</li>");
        }
        html.Append("</ul>");
    }

    private static void Row(StringBuilder html, string name, IReadOnlyList<AttributeGroup> groups, Func<AttributeGroup, string> value)
    {
        html.Append($"<tr><th scope=\"row\">{Escape(name)}</th>");
        foreach (var g in groups)
            html.Append($"<td class=\"n\">{Escape(value(g))}</td>");
        html.Append("</tr>");
    }

    private static string Invariant(FormattableString text) => text.ToString(CultureInfo.InvariantCulture);
}
