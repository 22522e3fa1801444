using System.Numerics;

namespace QaService.Core.Ingest;

/// <summary>
/// Clinger's fast path for decimal text: a number written as <c>[sign] digits [. digits]</c> whose digits,
/// read as one integer M, satisfy M ≤ 2^53, with k ≤ 22 digits after the point (here k ≤ 19, the most digits
/// taken). Then M and 10^k are both exact doubles and one IEEE 754 division is correctly rounded, so the result
/// is bit for bit what a correctly rounding parser (such as <see cref="double.TryParse(string, out double)"/>) returns. Source: W. D. Clinger,
/// "How to read floating point numbers accurately", PLDI 1990, §3 (doi:10.1145/93542.93557); the same test is
/// the first step of D. Lemire, "Number parsing at a gigabyte per second", Softw. Pract. Exp. 51(8), 2021
/// (doi:10.1002/spe.2984). Anything else (exponents, more digits, other characters) is left to the full parser.
/// </summary>
internal static class ExactDecimal
{
    /// <summary>2^53: every integer up to it is an exact double (IEEE 754 binary64, 53-bit significand).</summary>
    private const ulong LargestExactInteger = 1UL << 53;

    /// <summary>Most digits taken: 19 decimal digits always fit in 64 bits (10^19 − 1 &lt; 2^64).</summary>
    private const int MaximumDigits = 19;

    /// <summary>10^0 … 10^19: exact doubles, as every power of ten up to 10^22 is (5^22 &lt; 2^53).</summary>
    private static ReadOnlySpan<double> ExactPowersOfTen =>
    [
        1e0, 1e1, 1e2, 1e3, 1e4, 1e5, 1e6, 1e7, 1e8, 1e9,
        1e10, 1e11, 1e12, 1e13, 1e14, 1e15, 1e16, 1e17, 1e18, 1e19,
    ];

    /// <summary>True with the exact, correctly rounded value when <paramref name="text"/> is on the fast path.</summary>
    /// <param name="text">Trimmed text (UTF-16 characters, or UTF-8 bytes such as a JSON number token); sign <c>+</c> or <c>-</c>, decimal point <c>.</c> (invariant culture).</param>
    public static bool TryRead(ReadOnlySpan<char> text, out double value) => TryRead<char>(text, out value);

    /// <inheritdoc cref="TryRead(ReadOnlySpan{char}, out double)"/>
    public static bool TryRead(ReadOnlySpan<byte> utf8, out double value) => TryRead<byte>(utf8, out value);

    private static bool TryRead<TChar>(ReadOnlySpan<TChar> text, out double value) where TChar : unmanaged, IBinaryInteger<TChar>
    {
        value = 0;
        var i = 0;
        var negative = false;
        if (i < text.Length && Code(text[i]) is '-' or '+')
        {
            negative = Code(text[i]) == '-';
            i++;
        }
        ulong mantissa = 0;
        var integerDigits = ReadDigits(text, ref i, ref mantissa);
        var fractionDigits = 0;
        if (i < text.Length && Code(text[i]) == '.')
        {
            i++;
            fractionDigits = ReadDigits(text, ref i, ref mantissa);
        }
        var digits = integerDigits + fractionDigits;
        if (i < text.Length || digits == 0 || digits > MaximumDigits || mantissa > LargestExactInteger)
            return false;
        var magnitude = mantissa / ExactPowersOfTen[fractionDigits];
        value = negative ? -magnitude : magnitude;
        return true;
    }

    /// <summary>
    /// Appends the run of digits at <paramref name="i"/> to <paramref name="mantissa"/> and returns its length. The
    /// mantissa wraps only past 19 digits, and the caller refuses such numbers.
    /// </summary>
    private static int ReadDigits<TChar>(ReadOnlySpan<TChar> text, ref int i, ref ulong mantissa) where TChar : unmanaged, IBinaryInteger<TChar>
    {
        var start = i;
        for (; i < text.Length; i++)
        {
            var digit = unchecked(Code(text[i]) - '0');
            if (digit > 9)
                break;
            mantissa = unchecked(mantissa * 10 + digit);
        }
        return i - start;
    }

    /// <summary>The code unit as a number (an ASCII character has the same code as a UTF-16 char or a UTF-8 byte).</summary>
    private static uint Code<TChar>(TChar unit) where TChar : unmanaged, IBinaryInteger<TChar> => uint.CreateTruncating(unit);
}
