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

    /// <summary>Digits of the largest units value (below 2^53, 16 digits), rounded up to whole pairs.</summary>
    private const int MostDigits = 16;

    /// <summary>"00", "01", …, "99" as ASCII, two bytes a pair.</summary>
    private static ReadOnlySpan<byte> DigitPairs =>
        "00010203040506070809101112131415161718192021222324252627282930313233343536373839404142434445464748495051525354555657585960616263646566676869707172737475767778798081828384858687888990919293949596979899"u8;

    private static readonly long[] PowersOfTen = [.. Enumerable.Range(0, MaximumDecimals + 1).Select(d => (long)Math.Pow(10, d))];

    public static bool TryFormat(double value, int decimals, Span<byte> destination, out int bytesWritten)
    {
        ArgumentOutOfRangeException.ThrowIfNegative(decimals);
        ArgumentOutOfRangeException.ThrowIfGreaterThan(decimals, MaximumDecimals);
        bytesWritten = 0;
        var scaled = Math.Round(value * PowersOfTen[decimals], MidpointRounding.AwayFromZero);
        if (!(Math.Abs(scaled) < LargestExactInteger) || destination.Length < MaximumBytes)
            return false;
        var units = (ulong)Math.Abs(scaled);
        var position = 0;
        if (units != 0 && scaled < 0)
            destination[position++] = (byte)'-';

        // All digits of the units, right to left, two at a time (a division by the constant 100 is a multiplication);
        // then at least decimals + 1 of them, so that 0.000123 has its leading zeros.
        Span<byte> digits = stackalloc byte[MostDigits];
        var first = MostDigits;
        do
        {
            var pair = (int)(units % 100);
            units /= 100;
            first -= 2;
            digits[first] = DigitPairs[2 * pair];
            digits[first + 1] = DigitPairs[(2 * pair) + 1];
        }
        while (units != 0);
        if (digits[first] == (byte)'0' && first < MostDigits - 1)
            first++;
        while (MostDigits - first <= decimals)
            digits[--first] = (byte)'0';

        var point = MostDigits - decimals;
        digits[first..point].CopyTo(destination[position..]);
        position += point - first;
        var last = MostDigits;
        while (last > point && digits[last - 1] == (byte)'0')
            last--;
        if (last > point)
        {
            destination[position++] = (byte)'.';
            digits[point..last].CopyTo(destination[position..]);
            position += last - point;
        }
        bytesWritten = position;
        return true;
    }
}
