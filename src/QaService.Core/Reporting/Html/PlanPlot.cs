using System.Text;
using QaService.Core.Reporting.Plots;
using static QaService.Core.Reporting.Html.HtmlText;

namespace QaService.Core.Reporting.Html;

/// <summary>
/// The marks on a local plan with each residual drawn as an arrow from its mark, exaggerated so that errors of
/// centimetres show on a plan of kilometres; a scale bar for the plan, a key arrow for the residuals, north up.
/// </summary>
internal static class PlanPlot
{
    private const int Size = 380;
    private const double Pad = 34;

    /// <summary>The longest residual arrow is drawn at about this share of the plan's span.</summary>
    private const double LongestArrowShare = 0.16;

    /// <summary>Up to this many marks carry their id as a label; beyond, labels would overlap.</summary>
    private const int MaxLabelledMarks = 40;

    public static void Render(StringBuilder html, AssessmentReport report, PlotData plots)
    {
        var positions = plots.Plan.ToDictionary(p => p.Mark, StringComparer.Ordinal);
        double minE = plots.Plan.Min(p => p.EastMetres), maxE = plots.Plan.Max(p => p.EastMetres);
        double minN = plots.Plan.Min(p => p.NorthMetres), maxN = plots.Plan.Max(p => p.NorthMetres);
        double span = Math.Max(Math.Max(maxE - minE, maxN - minN), 1.0);
        double midE = (minE + maxE) / 2, midN = (minN + maxN) / 2, half = span * 0.62;
        var s = new PlotScale(Pad, Pad, Size - (2 * Pad), Size - (2 * Pad), midE - half, midE + half, midN - half, midN + half);

        double longest = report.Residuals.Where(r => r.Excluded is null).Select(r => r.DH).DefaultIfEmpty(0).Max();
        double exaggeration = longest > 0 ? PlotScale.NiceStep(span * LongestArrowShare / longest) : 1.0;
        double unit = s.UnitsPerX;

        Svg.Open(html, "plot-plan", Size, Size, "Residual vectors on a plan of the marks",
            $"{plots.Plan.Count} marks on a local plan, north up; each of {report.Residuals.Count} residuals is an arrow from its mark, " +
            $"drawn {Number(exaggeration, 0)} times longer than on the plan's scale.");
        html.Append("<defs><marker id=\"arrowhead\" viewBox=\"0 0 8 8\" refX=\"7\" refY=\"4\" markerWidth=\"6\" markerHeight=\"6\" orient=\"auto-start-reverse\"><path class=\"arrowhead\" d=\"M0,0 L8,4 L0,8 z\"/></marker></defs>");
        html.Append($"<rect class=\"frame\" x=\"{Coord(s.Left)}\" y=\"{Coord(s.Top)}\" width=\"{Coord(s.Width)}\" height=\"{Coord(s.Height)}\"/>");

        html.Append("<g class=\"vectors\">");
        foreach (var r in report.Residuals)
        {
            var p = positions[r.Mark];
            double x = s.X(p.EastMetres), y = s.Y(p.NorthMetres);
            string cls = r.Excluded is null ? "vec" : "vec vec-x";
            html.Append($"<line class=\"{cls}\" x1=\"{Coord(x)}\" y1=\"{Coord(y)}\" x2=\"{Coord(x + (r.DE * exaggeration * unit))}\" y2=\"{Coord(y - (r.DN * exaggeration * unit))}\" marker-end=\"url(#arrowhead)\"><title>{Escape(r.Fix)} at {Escape(r.Mark)}: {Metres(r.DH)} m</title></line>");
        }

        html.Append("</g><g class=\"marks\">");
        bool labels = plots.Plan.Count <= MaxLabelledMarks;
        foreach (var p in plots.Plan)
        {
            double x = s.X(p.EastMetres), y = s.Y(p.NorthMetres);
            html.Append($"<rect class=\"mk\" x=\"{Coord(x - 3)}\" y=\"{Coord(y - 3)}\" width=\"6\" height=\"6\"><title>{Escape(p.Mark)}</title></rect>");
            if (labels)
                Svg.Text(html, x + 5, y - 5, p.Mark, "mk-label", "start");
        }

        html.Append("</g>");
        ScaleBar(html, s, span, unit);
        KeyArrow(html, s, longest, exaggeration, unit);
        NorthArrow(html, s.Left + s.Width - 16, s.Top + 8);
        Svg.Close(html);
    }

    private static void ScaleBar(StringBuilder html, PlotScale s, double span, double unit)
    {
        double length = PlotScale.NiceFloor(span / 4);
        double x = s.Left + 10, y = s.Top + s.Height - 12, w = length * unit;
        html.Append("<g class=\"scalebar\">");
        html.Append($"<rect class=\"bar-a\" x=\"{Coord(x)}\" y=\"{Coord(y)}\" width=\"{Coord(w / 2)}\" height=\"4\"/><rect class=\"bar-b\" x=\"{Coord(x + (w / 2))}\" y=\"{Coord(y)}\" width=\"{Coord(w / 2)}\" height=\"4\"/>");
        Svg.Text(html, x, y - 3, "0", "tick", "start");
        Svg.Text(html, x + w, y - 3, $"{Number(length, 3)} m (plan)", "tick", "middle");
        html.Append("</g>");
    }

    private static void KeyArrow(StringBuilder html, PlotScale s, double longest, double exaggeration, double unit)
    {
        double keyLength = PlotScale.NiceFloor(longest > 0 ? longest : 0.01);
        double x = s.Left + s.Width - 10 - (keyLength * exaggeration * unit), y = s.Top + s.Height + 18;
        html.Append("<g class=\"key\">");
        html.Append($"<line class=\"vec\" x1=\"{Coord(x)}\" y1=\"{Coord(y)}\" x2=\"{Coord(x + (keyLength * exaggeration * unit))}\" y2=\"{Coord(y)}\" marker-end=\"url(#arrowhead)\"/>");
        Svg.Text(html, x - 6, y + 3, $"residual {Metres(keyLength)} m (×{Number(exaggeration, 0)})", "tick", "end");
        html.Append("</g>");
    }

    private static void NorthArrow(StringBuilder html, double x, double y)
    {
        html.Append($"<g class=\"north\" transform=\"translate({Coord(x)} {Coord(y)})\"><path d=\"M0,0 L6,18 L0,14 L-6,18 z\"/>");
        Svg.Text(html, 0, 30, "N", "north-label");
        html.Append("</g>");
    }
}
