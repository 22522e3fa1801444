using System.Buffers.Text;

namespace QaService.Core.Reporting;

/// <summary>
/// Writes a number as plain decimal UTF-8 text with at most a given number of decimals, trailing zeros dropped
/// (<c>-0.031038</c>, <c>0.681</c>, <c>15</c>): valid JSON numbers (RFC 8259 §6). Several times faster than the
/// shortest round-trip form, and shorter for values that only mean something to a fixed resolution.
/// Accuracy: the text differs from the value by at most half a unit in the last decimal plus one rounding of
/// <c>value × 10^decimals</c> (under 1e-16 relative). Range: |value × 10^decimals| &lt; 2^53, where every integer
/// is a double; outside it, and for NaN or infinities, <see cref="TryFormat"/> returns false and the caller
/// writes the number another way.
/// </summary>
public static class FixedDecimalUtf8
{
    /// <summary>Most decimals supported: 10^12 keeps a whole part up to ~9,000 within 2^53.</summary>
    public const int MaximumDecimals = 12;

    /// <summary>Longest text: sign, 16 digits, point, and the decimals never exceed this.</summary>
    public const int MaximumBytes = 32;

    /// <summary>2^53: above it not every integer is a double, so the scaled value would not be exact.</summary>
    private const double LargestExactInteger = 9_007_199_254_740_992.0;

    private static readonly long[] PowersOfTen = [.. Enumerable.Range(0, MaximumDecimals + 1).Select(d => (long)Math.Pow(10, d))];

    public static bool TryFormat(double value, int decimals, Span<byte> destination, out int bytesWritten)
    {
        ArgumentOutOfRangeException.ThrowIfNegative(decimals);
        ArgumentOutOfRangeException.ThrowIfGreaterThan(decimals, MaximumDecimals);
        bytesWritten = 0;
        var scaled = Math.Round(value * PowersOfTen[decimals], MidpointRounding.AwayFromZero);
        if (!(Math.Abs(scaled) < LargestExactInteger) || destination.Length < MaximumBytes)
            return false;
        var units = (long)scaled;
        var position = 0;
        if (units < 0)
        {
            destination[position++] = (byte)'-';
            units = -units;
        }
        var whole = units / PowersOfTen[decimals];
        var fraction = units % PowersOfTen[decimals];
        Utf8Formatter.TryFormat(whole, destination[position..], out var wholeBytes);
        position += wholeBytes;
        if (fraction != 0)
        {
            var digits = decimals;
            while (fraction % 10 == 0)
            {
                fraction /= 10;
                digits--;
            }
            destination[position++] = (byte)'.';
            // Leading zeros of the fraction (0.000123): a fixed width of `digits`.
            for (var i = position + digits - 1; i >= position; i--)
            {
                destination[i] = (byte)('0' + fraction % 10);
                fraction /= 10;
            }
            position += digits;
        }
        bytesWritten = position;
        return true;
    }
}
