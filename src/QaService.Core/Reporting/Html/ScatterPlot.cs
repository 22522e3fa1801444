using System.Text;
using QaService.Core.Reporting.Plots;
using static QaService.Core.Reporting.Html.HtmlText;

namespace QaService.Core.Reporting.Html;

/// <summary>dE against dN of every pair, with the CEP (50 %) and R95 circles and the 95 % error ellipse.</summary>
internal static class ScatterPlot
{
    private const int Size = 380;
    private const double Margin = 50;
    private const double Headroom = 1.12;

    public static void Render(StringBuilder html, AssessmentReport report, PlotData plots)
    {
        var h = report.Horizontal!;
        var included = report.Residuals.Where(r => r.Excluded is null).ToList();
        double reach = included.Select(r => Math.Max(Math.Abs(r.DE), Math.Abs(r.DN))).DefaultIfEmpty(0).Max();
        reach = Math.Max(reach, Math.Max(h.R95, plots.Ellipse?.SemiMajorMetres ?? 0.0)) * Headroom;
        reach = reach > 0 ? reach : 0.01;
        var s = new PlotScale(Margin, 12, Size - Margin - 12, Size - Margin - 12, -reach, reach, -reach, reach);
        var ticks = PlotScale.Ticks(-reach, reach, 6).ToList();

        Svg.Open(html, "plot-scatter", Size, Size, "Horizontal residuals, fix minus mark",
            $"{included.Count} residuals plotted as east error against north error, metres, centred on the mark. " +
            $"Dashed circle: CEP 50 % radius {Metres(h.Cep50)} m. Solid circle: R95 radius {Metres(h.R95)} m." +
            (plots.Ellipse is { } e ? $" Ellipse holding 95 %: semi-axes {Metres(e.SemiMajorMetres)} and {Metres(e.SemiMinorMetres)} m, major axis at {Number(e.MajorAxisAzimuthDegrees, 1)}° from north." : ""));
        Svg.Axes(html, s, ticks, ticks, "dE, east error (m)", "dN, north error (m)", Metres, Metres);

        double cx = s.X(0), cy = s.Y(0), unit = s.UnitsPerX;
        html.Append($"<circle class=\"ring-50\" cx=\"{Coord(cx)}\" cy=\"{Coord(cy)}\" r=\"{Coord(h.Cep50 * unit)}\"/>");
        html.Append($"<circle class=\"ring-95\" cx=\"{Coord(cx)}\" cy=\"{Coord(cy)}\" r=\"{Coord(h.R95 * unit)}\"/>");
        if (plots.Ellipse is { } ellipse)
        {
            // SVG rotates clockwise on screen; an unrotated ellipse has its major axis east (azimuth 90°).
            html.Append($"<ellipse class=\"ellipse-95\" cx=\"{Coord(cx)}\" cy=\"{Coord(cy)}\" rx=\"{Coord(ellipse.SemiMajorMetres * unit)}\" ry=\"{Coord(ellipse.SemiMinorMetres * unit)}\" transform=\"rotate({Coord(ellipse.MajorAxisAzimuthDegrees - 90.0)} {Coord(cx)} {Coord(cy)})\"/>");
        }

        html.Append("<g class=\"points\">");
        foreach (var r in report.Residuals)
        {
            if (Math.Abs(r.DE) > reach || Math.Abs(r.DN) > reach)
                continue;
            string cls = r.Excluded is null ? "pt" : "pt-x";
            html.Append($"<circle class=\"{cls}\" cx=\"{Coord(s.X(r.DE))}\" cy=\"{Coord(s.Y(r.DN))}\" r=\"3\"><title>{Escape(r.Fix)} at {Escape(r.Mark)}: dE {Metres(r.DE)} m, dN {Metres(r.DN)} m</title></circle>");
        }

        html.Append("</g>");
        Svg.Close(html);
    }
}
