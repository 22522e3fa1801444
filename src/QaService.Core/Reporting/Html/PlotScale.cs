namespace QaService.Core.Reporting.Html;

/// <summary>
/// Maps data units onto an SVG plot area (layout, not statistics): x grows right, data y grows up.
/// </summary>
/// <param name="Left">Plot area left edge, SVG user units.</param>
/// <param name="Top">Plot area top edge.</param>
/// <param name="Width">Plot area width.</param>
/// <param name="Height">Plot area height.</param>
/// <param name="MinX">Data value at the left edge.</param>
/// <param name="MaxX">Data value at the right edge.</param>
/// <param name="MinY">Data value at the bottom edge.</param>
/// <param name="MaxY">Data value at the top edge.</param>
internal sealed record PlotScale(double Left, double Top, double Width, double Height, double MinX, double MaxX, double MinY, double MaxY)
{
    public double X(double value) => Left + ((value - MinX) / (MaxX - MinX) * Width);

    public double Y(double value) => Top + Height - ((value - MinY) / (MaxY - MinY) * Height);

    /// <summary>SVG units per data unit along x (equal axes use the same on y).</summary>
    public double UnitsPerX => Width / (MaxX - MinX);

    /// <summary>Tick values from <paramref name="min"/> to <paramref name="max"/> at a 1-2-5 step giving about <paramref name="count"/> ticks.</summary>
    public static IEnumerable<double> Ticks(double min, double max, int count)
    {
        double step = NiceStep((max - min) / Math.Max(count, 1));
        for (double t = Math.Ceiling(min / step) * step; t <= max + (step * 1e-9); t += step)
            yield return Math.Abs(t) < step * 1e-9 ? 0.0 : t;
    }

    /// <summary>The 1-2-5 × 10ᵏ value nearest above <paramref name="rough"/> (axis ticks, scale bars).</summary>
    public static double NiceStep(double rough)
    {
        if (!(rough > 0.0) || !double.IsFinite(rough))
            return 1.0;
        double power = Math.Pow(10.0, Math.Floor(Math.Log10(rough)));
        double fraction = rough / power;
        double nice = fraction <= 1.0 ? 1.0 : fraction <= 2.0 ? 2.0 : fraction <= 5.0 ? 5.0 : 10.0;
        return nice * power;
    }

    /// <summary>The 1-2-5 × 10ᵏ value at or below <paramref name="rough"/> (a scale bar that fits).</summary>
    public static double NiceFloor(double rough)
    {
        if (!(rough > 0.0) || !double.IsFinite(rough))
            return 1.0;
        double power = Math.Pow(10.0, Math.Floor(Math.Log10(rough)));
        double fraction = rough / power;
        double nice = fraction >= 5.0 ? 5.0 : fraction >= 2.0 ? 2.0 : 1.0;
        return nice * power;
    }
}
