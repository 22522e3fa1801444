using System.Text;
using static QaService.Core.Reporting.Html.HtmlText;

namespace QaService.Core.Reporting.Html;

/// <summary>Small SVG building blocks: an accessible root (title and desc), lines, text, axes.</summary>
internal static class Svg
{
    /// <summary>Opens an inline SVG plot with a &lt;title&gt; and &lt;desc&gt; read by assistive technology.</summary>
    public static void Open(StringBuilder html, string id, int width, int height, string title, string description)
    {
        html.Append($"<svg id=\"{id}\" class=\"plot\" viewBox=\"0 0 {width} {height}\" role=\"img\" aria-labelledby=\"{id}-t {id}-d\" xmlns=\"http://www.w3.org/2000/svg\">")
            .Append($"<title id=\"{id}-t\">{Escape(title)}</title><desc id=\"{id}-d\">{Escape(description)}</desc>");
    }

    public static void Close(StringBuilder html) => html.Append("</svg>");

    public static void Line(StringBuilder html, double x1, double y1, double x2, double y2, string cssClass) =>
        html.Append($"<line class=\"{cssClass}\" x1=\"{Coord(x1)}\" y1=\"{Coord(y1)}\" x2=\"{Coord(x2)}\" y2=\"{Coord(y2)}\"/>");

    public static void Text(StringBuilder html, double x, double y, string text, string cssClass, string anchor = "middle") =>
        html.Append($"<text class=\"{cssClass}\" x=\"{Coord(x)}\" y=\"{Coord(y)}\" text-anchor=\"{anchor}\">{Escape(text)}</text>");

    /// <summary>Grid lines and tick labels for both axes, with axis titles.</summary>
    public static void Axes(StringBuilder html, PlotScale s, IEnumerable<double> xTicks, IEnumerable<double> yTicks, string xTitle, string yTitle, Func<double, string> xLabel, Func<double, string> yLabel)
    {
        html.Append("<g class=\"axes\">");
        foreach (double t in xTicks)
        {
            Line(html, s.X(t), s.Top, s.X(t), s.Top + s.Height, t == 0.0 ? "zero" : "grid");
            Text(html, s.X(t), s.Top + s.Height + 13, xLabel(t), "tick");
        }

        foreach (double t in yTicks)
        {
            Line(html, s.Left, s.Y(t), s.Left + s.Width, s.Y(t), t == 0.0 ? "zero" : "grid");
            Text(html, s.Left - 5, s.Y(t) + 3, yLabel(t), "tick", "end");
        }

        html.Append($"<rect class=\"frame\" x=\"{Coord(s.Left)}\" y=\"{Coord(s.Top)}\" width=\"{Coord(s.Width)}\" height=\"{Coord(s.Height)}\"/>");
        Text(html, s.Left + (s.Width / 2), s.Top + s.Height + 30, xTitle, "axis-title");
        html.Append($"<text class=\"axis-title\" transform=\"translate({Coord(s.Left - 38)} {Coord(s.Top + (s.Height / 2))}) rotate(-90)\" text-anchor=\"middle\">{Escape(yTitle)}</text>");
        html.Append("</g>");
    }
}
