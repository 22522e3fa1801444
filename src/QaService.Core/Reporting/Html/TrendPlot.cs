using System.Text;
using static QaService.Core.Reporting.Html.HtmlText;

namespace QaService.Core.Reporting.Html;

/// <summary>
/// A project's figures per delivery in creation order: NSSDA 95 % and RMSE, horizontal and vertical, with the spec's
/// limits as dotted lines. A missing figure (no vertical block) breaks its line rather than being drawn as zero.
/// </summary>
internal static class TrendPlot
{
    private const int Width = 780;
    private const int Height = 300;

    /// <summary>Up to this many deliveries carry a tick label each; beyond, every k-th.</summary>
    private const int MaxLabelledDeliveries = 24;

    private static readonly (string Css, string Name, Func<ProjectDelivery, double?> Value)[] Series =
    [
        ("s-nh", "NSSDA horizontal 95 %", d => d.Figures.HorizontalNssda95),
        ("s-rh", "RMSE_H", d => d.Figures.RmseH),
        ("s-nv", "NSSDA vertical 95 %", d => d.Figures.VerticalNssda95),
        ("s-rv", "RMSE_V", d => d.Figures.RmseV),
    ];

    public static void Render(StringBuilder html, ProjectPageModel project)
    {
        var deliveries = project.Deliveries;
        int n = deliveries.Count;
        double top = Series.SelectMany(s => deliveries.Select(s.Value)).Append(project.Horizontal).Append(project.Vertical)
            .OfType<double>().Where(double.IsFinite).DefaultIfEmpty(0).Max() * 1.15;
        top = top > 0 ? top : 0.01;
        var s = new PlotScale(56, 12, Width - 68, Height - 56, 0.5, n + 0.5, 0, top);
        int every = Math.Max(1, (int)Math.Ceiling(n / (double)MaxLabelledDeliveries));

        Svg.Open(html, "plot-trend", Width, Height, "Figures per delivery, in the order received",
            $"{n} deliveries from first to latest on the x axis; metres on the y axis. Lines: NSSDA horizontal 95 %, RMSE_H, NSSDA vertical 95 %, RMSE_V. " +
            $"Dotted: the spec (horizontal {Limit(project.Horizontal)}, vertical {Limit(project.Vertical)}). The table after the plot lists every value.");
        Svg.Axes(html, s, Enumerable.Range(1, n).Where(i => (i - 1) % every == 0).Select(i => (double)i), PlotScale.Ticks(0, top, 6),
            "Delivery, in the order received", "Metres", x => "#" + Coord(x), Metres);
        foreach (var (limit, label) in new[] { (project.Horizontal, "spec H"), (project.Vertical, "spec V") })
        {
            if (limit is not { } m || !(m > 0))
                continue;
            Svg.Line(html, s.Left, s.Y(m), s.Left + s.Width, s.Y(m), "level");
            Svg.Text(html, s.Left + s.Width - 4, s.Y(m) - 3, $"{label} {Metres(m)} m", "tick", "end");
        }

        foreach (var (css, name, value) in Series)
        {
            html.Append($"<g class=\"series {css}\">");
            var run = new List<string>();
            for (int i = 0; i < n; i++)
            {
                if (value(deliveries[i]) is { } v && double.IsFinite(v))
                {
                    run.Add($"{Coord(s.X(i + 1))},{Coord(s.Y(v))}");
                    html.Append($"<circle cx=\"{Coord(s.X(i + 1))}\" cy=\"{Coord(s.Y(v))}\" r=\"3\"><title>#{i + 1} {Escape(name)}: {Metres(v)} m</title></circle>");
                }
                else
                {
                    Flush(html, run);
                }
            }

            Flush(html, run);
            html.Append("</g>");
        }

        Svg.Close(html);
    }

    private static void Flush(StringBuilder html, List<string> run)
    {
        if (run.Count > 1)
            html.Append($"<polyline points=\"{string.Join(' ', run)}\"/>");
        run.Clear();
    }

    private static string Limit(double? metres) => metres is { } m ? $"{Metres(m)} m" : "none";
}
