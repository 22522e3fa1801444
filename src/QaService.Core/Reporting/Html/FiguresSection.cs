using System.Text;
using QaService.Core.Statistics;
using static QaService.Core.Reporting.Html.HtmlText;

namespace QaService.Core.Reporting.Html;

/// <summary>Every accuracy figure of the report, with its unit and what it means.</summary>
internal static class FiguresSection
{
    private const string Metre = "m";
    private const string Count = "count";

    public static void Render(StringBuilder html, AssessmentReport report)
    {
        html.Append("<section id=\"figures\" aria-labelledby=\"figures-h\"><h2 id=\"figures-h\"><span class=\"num\">2</span> The figures</h2>");
        if (report.Horizontal is { } h)
            Table(html, "Horizontal accuracy (fix − mark in east-north at the mark)", "fig-horizontal", Horizontal(h));
        else
            html.Append("<p class=\"none\">No paired fix counted, so there are no horizontal figures.</p>");
        if (report.Vertical is { } v)
            Table(html, "Vertical accuracy (fix − mark, up)", "fig-vertical", Vertical(v));
        else
            html.Append("<p class=\"none\">No vertical figures: one side has no heights, or heights were declared as none.</p>");
        html.Append("</section>");
    }

    private static IEnumerable<(string Name, string Value, string Unit, string Meaning)> Horizontal(HorizontalAccuracy h) =>
    [
        ("n", h.N.ToString(System.Globalization.CultureInfo.InvariantCulture), Count, "check points in the statistics"),
        ("meanE", Metres(h.MeanE), Metre, "mean east error; far from 0 means a systematic shift"),
        ("meanN", Metres(h.MeanN), Metre, "mean north error"),
        ("sdE", Metres(h.SdE), Metre, "standard deviation of the east errors about their mean (n − 1 divisor)"),
        ("sdN", Metres(h.SdN), Metre, "standard deviation of the north errors about their mean (n − 1 divisor)"),
        ("rmseE", Metres(h.RmseE), Metre, "root mean square of the east errors about zero, √(Σ dE² / n)"),
        ("rmseN", Metres(h.RmseN), Metre, "root mean square of the north errors about zero"),
        ("rmseR", Metres(h.RmseR), Metre, "radial RMSE, √(rmseE² + rmseN²)"),
        ("nssda95", Metres(h.Nssda95), Metre, h.NssdaMethod == "exact"
            ? "NSSDA horizontal accuracy at 95 % confidence; exact 95 % radius because rmseE and rmseN differ by more than the 0.6 ratio the standard's formula allows"
            : "NSSDA horizontal accuracy at 95 % confidence, 2.4477 × ½(rmseE + rmseN) (FGDC-STD-007.3-1998 appendix 3-A)"),
        ("cep50", Metres(h.Cep50), Metre, "radius holding 50 % of the fitted zero-mean normal (computed exactly)"),
        ("ce90", Metres(h.Ce90), Metre, "radius holding 90 % of the fitted zero-mean normal (exact)"),
        ("r95", Metres(h.R95), Metre, "radius holding 95 % of the fitted zero-mean normal (exact)"),
        ("drms", Metres(h.Drms), Metre, "distance root mean square; equals rmseR"),
        ("twoDrms", Metres(h.TwoDrms), Metre, "2 × drms, a common receiver-brochure figure (holds roughly 95–98 %)"),
        ("p50", Metres(h.P50), Metre, "median of the horizontal errors dH (empirical, linear interpolation)"),
        ("p90", Metres(h.P90), Metre, "90th percentile of dH (empirical)"),
        ("p95", Metres(h.P95), Metre, "95th percentile of dH (empirical); compare with nssda95 and r95"),
    ];

    private static IEnumerable<(string Name, string Value, string Unit, string Meaning)> Vertical(VerticalAccuracy v) =>
    [
        ("n", v.N.ToString(System.Globalization.CultureInfo.InvariantCulture), Count, "check points with heights on both sides"),
        ("mean", Metres(v.Mean), Metre, "mean up error; far from 0 hints at a height reference or antenna height mix-up"),
        ("sd", Metres(v.Sd), Metre, "standard deviation of dU about its mean (n − 1 divisor)"),
        ("rmse", Metres(v.Rmse), Metre, "root mean square of dU about zero"),
        ("nssda95", Metres(v.Nssda95), Metre, "NSSDA vertical accuracy at 95 % confidence, 1.9600 × rmse"),
        ("le90", Metres(v.Le90), Metre, "linear error at 90 %, 1.6449 × rmse"),
        ("p95", Metres(v.P95), Metre, "95th percentile of |dU| (empirical); compare with nssda95"),
    ];

    private static void Table(StringBuilder html, string caption, string id, IEnumerable<(string Name, string Value, string Unit, string Meaning)> rows)
    {
        html.Append($"<table id=\"{id}\" class=\"figures\"><caption>{Escape(caption)}</caption>")
            .Append("<thead><tr><th scope=\"col\">figure</th><th scope=\"col\" class=\"n\">value</th><th scope=\"col\">unit</th><th scope=\"col\">what it means</th></tr></thead><tbody>");
        foreach (var (name, value, unit, meaning) in rows)
            html.Append($"<tr><th scope=\"row\"><code>{Escape(name)}</code></th><td class=\"n\">{Escape(value)}</td><td>{Escape(unit)}</td><td>{Escape(meaning)}</td></tr>");
        html.Append("</tbody></table>");
    }
}
