using System.Text;
using QaService.Core.Reporting.Plots;

namespace QaService.Core.Reporting.Html;

/// <summary>The four pictures of the error, each in a figure with a caption and a key.</summary>
internal static class PlotsSection
{
    public static void Render(StringBuilder html, AssessmentReport report, PlotData plots)
    {
        html.Append("<section id=\"plots\" aria-labelledby=\"plots-h\"><h2 id=\"plots-h\"><span class=\"num\">3</span> Where the errors fall</h2>");
        if (report.Horizontal is null || plots.Plan.Count == 0)
        {
            html.Append("<p class=\"none\">No paired fix counted, so there is nothing to plot horizontally.</p>");
        }
        else
        {
            html.Append("<div class=\"plot-grid\">");
            Figure(html, "fig-scatter", () => ScatterPlot.Render(html, report, plots),
                "Error of each fix around its mark.",
                [("k-pt", "fix"), ("k-ptx", "excluded fix"), ("k-50", "CEP 50 % circle"), ("k-95", "R95 circle"), ("k-ell", "95 % error ellipse")]);
            Figure(html, "fig-plan", () => PlanPlot.Render(html, report, plots),
                "Residual arrows on a plan of the marks (arrows exaggerated; see the key arrow).",
                [("k-mk", "mark"), ("k-vec", "residual, exaggerated")]);
            Figure(html, "fig-cdf", () => CdfPlot.Render(html, report, plots),
                "Share of fixes within a horizontal error, against the fitted model.",
                [("k-ecdf", "observed share"), ("k-model", "fitted zero-mean normal"), ("k-level", "50 % and 95 % levels")]);
            html.Append("<aside class=\"reading\" aria-labelledby=\"reading-h\"><h3 id=\"reading-h\">Reading these pictures</h3><ul>")
                .Append("<li><strong>Scatter:</strong> a cloud centred away from the cross is a systematic shift (see the <code>bias</code> check); an ellipse much longer than wide points at one direction of error.</li>")
                .Append("<li><strong>Plan:</strong> arrows that all point the same way are a datum or offset problem; long arrows in one corner point at local conditions there (cover, multipath).</li>")
                .Append("<li><strong>Distribution:</strong> steps far right of the smooth curve at the top are fixes worse than a normal model expects: possible blunders.</li>")
                .Append("<li><strong>Vertical:</strong> most stems on one side of zero means a height offset: antenna height, or ellipsoidal against orthometric heights.</li>")
                .Append("</ul></aside></div>");
        }

        if (report.Vertical is not null)
        {
            Figure(html, "fig-vertical", () => VerticalPlot.Render(html, report),
                "Vertical error of each pair.",
                [("k-pt", "fix"), ("k-ptx", "excluded fix"), ("k-mean", "mean"), ("k-v95", "± NSSDA 95 %")]);
        }
        else
        {
            html.Append("<p class=\"none\">No vertical comparison, so no vertical plot.</p>");
        }

        html.Append("</section>");
    }

    private static void Figure(StringBuilder html, string id, Action draw, string caption, (string Css, string Label)[] key)
    {
        html.Append($"<figure id=\"{id}\">");
        draw();
        html.Append($"<figcaption>{HtmlText.Escape(caption)}<span class=\"legend\">");
        foreach (var (css, label) in key)
            html.Append($"<span class=\"key {css}\" aria-hidden=\"true\"></span>{HtmlText.Escape(label)} ");
        html.Append("</span></figcaption></figure>");
    }
}
