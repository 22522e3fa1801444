using System.Text;
using static QaService.Core.Reporting.Html.HtmlText;

namespace QaService.Core.Reporting.Html;

/// <summary>How the figures were made: frames of both sides, transformation steps, standard, formulas and sources.</summary>
internal static class MethodNotes
{
    /// <summary>Formulas behind the figures, each with its source (shown to the reader).</summary>
    private static readonly (string Figure, string Formula, string Source)[] Formulas =
    [
        ("residual", "fix − mark as geocentric vectors rotated into east-north-up at the mark; dH = √(dE² + dN²)", "EPSG Guidance Note 7-2 (IOGP 373-7-2) §4.1.2, method 9836"),
        ("RMSE", "rmseE = √(Σ dE² / n), likewise N and up; rmseR = √(rmseE² + rmseN²)", "FGDC-STD-007.3-1998 appendix 3-A"),
        ("NSSDA horizontal", "2.4477 × ½(rmseE + rmseN) when min/max of rmseE, rmseN ≥ 0.6; otherwise the exact 95 % radius", "FGDC-STD-007.3-1998 §3.2.1 and appendix 3-A"),
        ("NSSDA vertical", "1.9600 × rmse of dU", "FGDC-STD-007.3-1998 §3.2.1 and appendix 3-A"),
        ("CEP, CE90, R95", "radius r with P(|X| ≤ r) = 0.50, 0.90, 0.95 for X ~ N(0, M), M = (1/n) Σ [dE dN]ᵀ[dE dN], by numerical integration", "polar-angle integral; Imhof (1961), Biometrika 48:419–426, doi:10.1093/biomet/48.3-4.419"),
        ("error ellipse", "semi-axes k·√λ of M, k = √(−2 ln 0.05) = 2.4477 for 95 % (χ² with 2 degrees of freedom)", "bivariate normal confidence region"),
        ("LE90", "1.6449 × rmse of dU", "normal distribution two-sided 90 % quantile"),
        ("percentiles", "linear interpolation between order statistics, h = (n − 1)p", "Hyndman & Fan (1996), The American Statistician 50:361–365, definition 7"),
    ];

    public static void Render(StringBuilder html, AssessmentReport report)
    {
        var f = report.Frames;
        html.Append("<section id=\"method\" aria-labelledby=\"method-h\"><h2 id=\"method-h\"><span class=\"num\">6</span> How it was computed</h2>")
            .Append("<dl class=\"frames\">")
            .Append($"<div><dt>marks (reference) CRS</dt><dd>{Escape(f.Marks)}</dd></div>")
            .Append($"<div><dt>fixes (tested) CRS</dt><dd>{Escape(f.Fixes)}</dd></div>")
            .Append($"<div><dt>heights</dt><dd>{Escape(f.Heights)}</dd></div>")
            .Append("</dl><h3>Steps and their accuracy</h3><ol class=\"steps\">");
        foreach (var step in f.Operation.Split("; ", StringSplitOptions.RemoveEmptyEntries))
            html.Append($"<li>{Escape(step)}</li>");
        html.Append("</ol>");

        string standard = report.Spec?.Standard is { } s && !s.Equals("nssda", StringComparison.OrdinalIgnoreCase)
            ? Escape(s)
            : "National Standard for Spatial Data Accuracy (NSSDA), FGDC-STD-007.3-1998, Geospatial Positioning Accuracy Standards Part 3";
        html.Append($"<h3>Standard</h3><p>{standard}. Horizontal method used here: <code>{Escape(report.Horizontal?.NssdaMethod ?? "–")}</code>.</p>")
            .Append("<h3>Formulas</h3><table class=\"formulas\"><caption>Definitions behind the figures</caption><thead><tr><th scope=\"col\">figure</th><th scope=\"col\">formula</th><th scope=\"col\">source</th></tr></thead><tbody>");
        foreach (var (figure, formula, source) in Formulas)
            html.Append($"<tr><th scope=\"row\">{Escape(figure)}</th><td>{Escape(formula)}</td><td>{Escape(source)}</td></tr>");
        html.Append("</tbody></table></section>");
    }
}
