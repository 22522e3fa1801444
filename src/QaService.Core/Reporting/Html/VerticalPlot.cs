using System.Text;
using static QaService.Core.Reporting.Html.HtmlText;

namespace QaService.Core.Reporting.Html;

/// <summary>Vertical residual of each pair, in report order, with the mean and the ±NSSDA 95 % lines.</summary>
internal static class VerticalPlot
{
    private const int Width = 780;
    private const int Height = 280;

    /// <summary>Up to this many pairs carry their mark id under the axis; beyond, ids would overlap.</summary>
    private const int MaxLabelledPairs = 60;

    public static void Render(StringBuilder html, AssessmentReport report)
    {
        var v = report.Vertical!;
        var pairs = report.Residuals.Where(r => r.DU is not null).ToList();
        double reach = pairs.Where(r => r.Excluded is null).Select(r => Math.Abs(r.DU!.Value)).DefaultIfEmpty(0).Max();
        reach = Math.Max(reach, v.Nssda95) * 1.15;
        reach = reach > 0 ? reach : 0.01;
        bool labels = pairs.Count <= MaxLabelledPairs;
        var s = new PlotScale(56, 12, Width - 68, Height - (labels ? 84 : 48), -0.5, Math.Max(pairs.Count, 1) - 0.5, -reach, reach);

        Svg.Open(html, "plot-vertical", Width, Height, "Vertical residuals, fix minus mark",
            $"Up error dU of each of {pairs.Count} pairs in report order, metres. Dashed: mean {Metres(v.Mean)} m; dotted: ±NSSDA 95 % ({Metres(v.Nssda95)} m).");
        Svg.Axes(html, s, [], PlotScale.Ticks(-reach, reach, 6), "", "dU, up error (m)", _ => "", Metres);
        Svg.Line(html, s.Left, s.Y(v.Mean), s.Left + s.Width, s.Y(v.Mean), "mean");
        Svg.Line(html, s.Left, s.Y(v.Nssda95), s.Left + s.Width, s.Y(v.Nssda95), "level-95");
        Svg.Line(html, s.Left, s.Y(-v.Nssda95), s.Left + s.Width, s.Y(-v.Nssda95), "level-95");

        html.Append("<g class=\"points\">");
        for (int i = 0; i < pairs.Count; i++)
        {
            var r = pairs[i];
            double du = Math.Clamp(r.DU!.Value, -reach, reach);
            string cls = r.Excluded is null ? "pt" : "pt-x";
            Svg.Line(html, s.X(i), s.Y(0), s.X(i), s.Y(du), "stem");
            html.Append($"<circle class=\"{cls}\" cx=\"{Coord(s.X(i))}\" cy=\"{Coord(s.Y(du))}\" r=\"3\"><title>{Escape(r.Fix)} at {Escape(r.Mark)}: dU {Metres(r.DU)} m</title></circle>");
            if (labels)
                html.Append($"<text class=\"tick\" transform=\"translate({Coord(s.X(i) + 3)} {Coord(s.Top + s.Height + 8)}) rotate(-60)\" text-anchor=\"end\">{Escape(r.Mark)}</text>");
        }

        html.Append("</g>");
        Svg.Close(html);
    }
}
