using System.Globalization;
using System.Text.RegularExpressions;

namespace QaService.Core.Ingest;

/// <summary>
/// Parses the text of one field value: numbers (decimal point or decimal comma), angles in decimal
/// degrees or degrees-minutes-seconds, and ISO 8601 times. Reading a notation, not converting units.
/// </summary>
public static partial class FieldText
{
    private const double MinutesPerDegree = 60.0, SecondsPerDegree = 3600.0;

    /// <summary>Longest number rewritten on the stack for a decimal comma; a longer one is rewritten on the heap.</summary>
    private const int StackCharacters = 128;

    /// <summary>A finite number; <paramref name="decimalComma"/> reads <c>12,5</c> as 12.5 (no thousands separators either way).</summary>
    public static bool TryNumber(string text, bool decimalComma, out double value) => TryNumber(text.AsSpan(), decimalComma, out value);

    /// <inheritdoc cref="TryNumber(string, bool, out double)"/>
    public static bool TryNumber(ReadOnlySpan<char> text, bool decimalComma, out double value)
    {
        var s = text.Trim();
        if (decimalComma)
        {
            if (s.Contains('.'))
            {
                value = double.NaN;
                return false;
            }
            var rewritten = s.Length <= StackCharacters ? stackalloc char[s.Length] : new char[s.Length];
            s.Replace(rewritten, ',', '.');
            return Parse(rewritten, out value);
        }
        return Parse(s, out value);
    }

    /// <summary>Plain decimals take the exact fast path; everything else the framework's invariant parser.</summary>
    private static bool Parse(ReadOnlySpan<char> s, out double value) =>
        ExactDecimal.TryRead(s, out value)
        || (double.TryParse(s, NumberStyles.AllowLeadingSign | NumberStyles.AllowDecimalPoint | NumberStyles.AllowExponent,
                CultureInfo.InvariantCulture, out value) && double.IsFinite(value));

    /// <summary>
    /// An angle in decimal degrees: a plain number, or degrees-minutes-seconds such as <c>48°45'04.44"N</c>,
    /// <c>48 45 4.44 N</c>, <c>-15:00:12.5</c> or <c>W 15d0m12.5s</c>. S and W (or a leading minus) are negative.
    /// Minutes and seconds must be below 60.
    /// </summary>
    public static bool TryAngle(ReadOnlySpan<char> text, bool decimalComma, out double degrees) =>
        TryNumber(text, decimalComma, out degrees) || TryAngle(text.ToString(), decimalComma, out degrees);

    /// <inheritdoc cref="TryAngle(ReadOnlySpan{char}, bool, out double)"/>
    public static bool TryAngle(string text, bool decimalComma, out double degrees)
    {
        if (TryNumber(text, decimalComma, out degrees))
            return true;
        var s = decimalComma ? text.Replace(',', '.') : text;
        var m = Dms().Match(s);
        if (!m.Success)
            return false;
        var d = double.Parse(m.Groups["d"].Value, CultureInfo.InvariantCulture);
        var min = m.Groups["m"].Success ? double.Parse(m.Groups["m"].Value, CultureInfo.InvariantCulture) : 0;
        var sec = m.Groups["s"].Success ? double.Parse(m.Groups["s"].Value, CultureInfo.InvariantCulture) : 0;
        if (min >= MinutesPerDegree || sec >= MinutesPerDegree)
            return false;
        var hemisphere = (m.Groups["h1"].Value + m.Groups["h2"].Value).ToUpperInvariant();
        if (hemisphere.Length > 1 || (hemisphere.Length == 1 && m.Groups["sign"].Success))
            return false;
        var negative = m.Groups["sign"].Success || hemisphere is "S" or "W";
        degrees = (d + min / MinutesPerDegree + sec / SecondsPerDegree) * (negative ? -1 : 1);
        return true;
    }

    /// <summary>An ISO 8601 date-time; without an offset it is taken as UTC (GNSS receivers log UTC).</summary>
    public static bool TryTime(ReadOnlySpan<char> text, out DateTimeOffset time) =>
        DateTimeOffset.TryParse(text.Trim(), CultureInfo.InvariantCulture,
            DateTimeStyles.AssumeUniversal | DateTimeStyles.AllowWhiteSpaces, out time);

    [GeneratedRegex("""^\s*(?<h1>[NSEWnsew])?\s*(?<sign>-)?(?<d>\d{1,3})(?:\s*[°d:\s]\s*(?<m>\d{1,2}(?:\.\d+)?))?(?:\s*['′m:\s]\s*(?<s>\d{1,2}(?:\.\d+)?))?\s*["″s']*\s*(?<h2>[NSEWnsew])?\s*$""")]
    private static partial Regex Dms();
}
