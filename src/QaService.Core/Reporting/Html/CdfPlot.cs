using System.Text;
using QaService.Core.Reporting.Plots;
using static QaService.Core.Reporting.Html.HtmlText;

namespace QaService.Core.Reporting.Html;

/// <summary>Share of fixes within each horizontal error (empirical steps) against the fitted zero-mean normal.</summary>
internal static class CdfPlot
{
    private const int Width = 380;
    private const int Height = 300;

    public static void Render(StringBuilder html, AssessmentReport report, PlotData plots)
    {
        var h = report.Horizontal!;
        var errors = plots.SortedHorizontalErrors;
        double reach = plots.ModelCdf.Count > 0 ? plots.ModelCdf[^1].RadiusMetres : Math.Max(errors.DefaultIfEmpty(0).Max(), 0.01);
        var s = new PlotScale(50, 12, Width - 62, Height - 62, 0, reach, 0, 1);

        Svg.Open(html, "plot-cdf", Width, Height, "Cumulative distribution of horizontal error",
            $"Share of the {errors.Count} fixes whose horizontal error dH is at most r (steps), against the fitted zero-mean normal model (smooth curve). " +
            $"Empirical 95th percentile {Metres(h.P95)} m; model R95 {Metres(h.R95)} m.");
        Svg.Axes(html, s, PlotScale.Ticks(0, reach, 5), PlotScale.Ticks(0, 1, 5), "r, horizontal error (m)", "share within r", Metres, p => Percent(p));

        foreach (double level in new[] { 0.5, 0.95 })
            Svg.Line(html, s.Left, s.Y(level), s.Left + s.Width, s.Y(level), "level");

        if (plots.ModelCdf.Count > 0)
        {
            html.Append("<polyline class=\"model\" points=\"");
            foreach (var p in plots.ModelCdf)
                html.Append($"{Coord(s.X(p.RadiusMetres))},{Coord(s.Y(p.Probability))} ");
            html.Append("\"/>");
        }

        // Empirical distribution: the share steps up by 1/n at each sorted error.
        html.Append($"<path class=\"ecdf\" d=\"M{Coord(s.X(0))},{Coord(s.Y(0))}");
        for (int i = 0; i < errors.Count; i++)
        {
            html.Append($" H{Coord(s.X(errors[i]))} V{Coord(s.Y((i + 1.0) / errors.Count))}");
        }

        html.Append($" H{Coord(s.X(reach))}\"/><g class=\"points\">");
        for (int i = 0; i < errors.Count; i++)
        {
            html.Append($"<circle class=\"pt\" cx=\"{Coord(s.X(errors[i]))}\" cy=\"{Coord(s.Y((i + 1.0) / errors.Count))}\" r=\"2.5\"><title>{Metres(errors[i])} m: {i + 1} of {errors.Count}</title></circle>");
        }

        html.Append("</g>");
        Svg.Close(html);
    }
}
