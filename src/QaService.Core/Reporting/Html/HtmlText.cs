using System.Globalization;
using System.Net;

namespace QaService.Core.Reporting.Html;

/// <summary>
/// The one place text enters markup: every id, title and message goes through <see cref="Escape"/>
/// (&lt; &gt; &amp; " ' become entities, so text can stand in element content and quoted attributes alike).
/// Numbers are formatted invariantly so a report reads the same on every server.
/// </summary>
public static class HtmlText
{
    /// <summary>Text made safe for element content and double- or single-quoted attribute values.</summary>
    public static string Escape(string? text) => WebUtility.HtmlEncode(text ?? string.Empty);

    /// <summary>A length in metres to the millimetre, e.g. <c>0.012</c> (a minus sign for negatives).</summary>
    public static string Metres(double metres) => metres.ToString("0.000", CultureInfo.InvariantCulture);

    /// <summary>As <see cref="Metres(double)"/>, or an en dash when there is no value.</summary>
    public static string Metres(double? metres) => metres is { } m ? Metres(m) : "–";

    /// <summary>A plain number for markup and SVG coordinates (up to 2 decimals, invariant).</summary>
    public static string Coord(double value) => value.ToString("0.##", CultureInfo.InvariantCulture);

    /// <summary>A general number with up to <paramref name="decimals"/> decimals, invariant.</summary>
    public static string Number(double value, int decimals) =>
        value.ToString("0." + new string('#', Math.Max(decimals, 1)), CultureInfo.InvariantCulture);

    /// <summary>A probability as a percentage, e.g. <c>95 %</c>.</summary>
    public static string Percent(double probability) =>
        (probability * 100.0).ToString("0.#", CultureInfo.InvariantCulture) + " %";

    /// <summary>Degrees of latitude or longitude to 1e-8° (about a millimetre).</summary>
    public static string Degrees(double degrees) => degrees.ToString("0.00000000", CultureInfo.InvariantCulture);
}
