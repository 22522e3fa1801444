using System.Globalization;

namespace QaService.Core.Standards;

/// <summary>
/// A length typed by a person in a chosen unit, converted to metres by the exact definitions: centimetre 1/100 m (SI),
/// international foot exactly 0.3048 m (1959 international yard and pound agreement; NIST SP 811 appendix B),
/// US survey foot exactly 1200/3937 m (US Metric Law of 1866, Federal Register 1959; deprecated by NIST and NOAA
/// from 2023-01-01, still found in older state plane data). The typed decimal is multiplied in <see cref="decimal"/>
/// (exact for m, cm and ft up to 28 significant digits; the 1200/3937 quotient to 28 digits) and rounded once to the
/// nearest <see cref="double"/> by the correctly rounded parser, so "0.5 ft" becomes the double nearest 0.1524.
/// </summary>
public static class LengthEntry
{
    public const string Metre = "m", Centimetre = "cm", Foot = "ft", UsSurveyFoot = "us-ft";

    /// <summary>Unit ids and their labels, in the order a form offers them.</summary>
    public static IReadOnlyList<(string Id, string Label)> Units { get; } =
    [
        (Metre, "metres (m)"),
        (Centimetre, "centimetres (cm)"),
        (Foot, "international feet (ft, 0.3048 m)"),
        (UsSurveyFoot, "US survey feet (1200/3937 m)"),
    ];

    /// <summary>Largest magnitude accepted, in the unit typed: far beyond any accuracy, well inside decimal's range.</summary>
    private const decimal MaximumMagnitude = 1e12m;

    /// <summary>The typed length in metres, or the reason it is not one (empty text is not a length).</summary>
    /// <param name="text">Decimal number with a point or a comma as decimal separator, no thousands separators.</param>
    /// <param name="unit">One of the ids of <see cref="Units"/>.</param>
    public static (double? Metres, string? Problem) ToMetres(string? text, string? unit)
    {
        var typed = (text ?? "").Trim();
        if (typed.Length == 0)
            return (null, "enter a number");
        if (typed.Contains(',', StringComparison.Ordinal) && !typed.Contains('.', StringComparison.Ordinal))
            typed = typed.Replace(',', '.');
        if (!decimal.TryParse(typed, NumberStyles.AllowLeadingSign | NumberStyles.AllowDecimalPoint | NumberStyles.AllowExponent, CultureInfo.InvariantCulture, out var value)
            || Math.Abs(value) > MaximumMagnitude)
            return (null, $"\"{Shorten(typed)}\" is not a number (write e.g. 0.25)");
        if (value <= 0)
            return (null, "must be greater than zero");
        decimal? metres = unit switch
        {
            Metre => value,
            Centimetre => value / 100m,
            Foot => value * 0.3048m,
            UsSurveyFoot => value * 1200m / 3937m,
            _ => null,
        };
        if (metres is null)
            return (null, $"unit \"{Shorten(unit ?? "")}\" is not one of m, cm, ft, us-ft");
        return (double.Parse(metres.Value.ToString(CultureInfo.InvariantCulture), CultureInfo.InvariantCulture), null);
    }

    private static string Shorten(string text) => text.Length <= 40 ? text : text[..40] + "…";
}
