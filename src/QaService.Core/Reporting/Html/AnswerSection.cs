using System.Globalization;
using System.Text;
using static QaService.Core.Reporting.Html.HtmlText;

namespace QaService.Core.Reporting.Html;

/// <summary>The verdict, the NSSDA statement, required against tested, and how many points took part.</summary>
internal static class AnswerSection
{
    public static void Render(StringBuilder html, AssessmentReport report)
    {
        var (word, cls, gloss) = report.Verdict switch
        {
            Verdict.Pass => ("PASS", "v-pass", "every required figure is met and no check failed"),
            Verdict.Fail => ("FAIL", "v-fail", "a required figure is exceeded"),
            _ => ("INCONCLUSIVE", "v-open", "the data cannot support a conformance claim"),
        };
        html.Append("<section id=\"answer\" aria-labelledby=\"answer-h\"><h2 id=\"answer-h\"><span class=\"num\">1</span> The answer</h2>")
            .Append($"<div class=\"verdict {cls}\"><p class=\"verdict-word\" id=\"verdict\">{word}</p><p class=\"verdict-gloss\">{Escape(gloss)}</p></div>")
            .Append($"<blockquote class=\"statement\" id=\"statement\"><p>{Escape(report.Statement)}</p></blockquote>");

        html.Append("<table class=\"spec\" id=\"spec\"><caption>Required against tested, 95 % confidence</caption>")
            .Append("<thead><tr><th scope=\"col\">component</th><th scope=\"col\" class=\"n\">required (m)</th><th scope=\"col\" class=\"n\">tested nssda95 (m)</th><th scope=\"col\">outcome</th></tr></thead><tbody>");
        Row(html, "horizontal", report.Spec?.Horizontal, report.Horizontal?.Nssda95, report.Spec?.HorizontalMet);
        Row(html, "vertical", report.Spec?.Vertical, report.Vertical?.Nssda95, report.Spec?.VerticalMet);
        html.Append("</tbody></table>");
        if (report.Spec is { } spec)
            html.Append($"<p class=\"small\">Judged against the <strong>{Escape(spec.Standard.ToUpperInvariant())}</strong> procedure.</p>");

        var c = report.Counts;
        html.Append("<dl class=\"counts\">");
        foreach (var (label, value) in new[] { ("marks", c.Marks), ("fixes", c.Fixes), ("paired", c.Paired), ("unpaired", c.Unpaired), ("excluded", c.Excluded) })
            html.Append($"<div><dt>{label}</dt><dd>{value.ToString(CultureInfo.InvariantCulture)}</dd></div>");
        html.Append("</dl></section>");
    }

    private static void Row(StringBuilder html, string component, double? required, double? tested, bool? met)
    {
        string outcome = met switch
        {
            true => "<span class=\"tag t-pass\">✓ met</span>",
            false => "<span class=\"tag t-fail\">✗ exceeded</span>",
            null => "<span class=\"tag t-none\">not judged</span>",
        };
        html.Append($"<tr><th scope=\"row\">{component}</th><td class=\"n\">{Metres(required)}</td><td class=\"n\">{Metres(tested)}</td><td>{outcome}</td></tr>");
    }
}
