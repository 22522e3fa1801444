using System.Runtime.Intrinsics;

namespace QaService.Core.Geodesy;

/// <summary>
/// sin, cos, ln, atanh and sinh of four doubles at once, on the ranges the transverse Mercator batch kernel needs,
/// built only from IEEE-exact operations (+, −, ×, ÷, bit moves) so that a lane's bits depend on nothing but its input.
/// .NET's own vector sin, cos, exp and ln are not used: their multiply-adds are fused in optimised code but not in the
/// precompiled code a method starts with, so the same point gave different bits (about 1e-9 m on the grid) before and
/// after the runtime recompiled them (seen in one process, and between a large transform and the same points sent in
/// small batches).
/// </summary>
/// <remarks>
/// Methods are truncated Taylor series summed by Horner's rule (Abramowitz &amp; Stegun, Handbook of Mathematical
/// Functions, 1964; section numbers from memory: 4.1.27 for ln, whose series with z = (1 + x)/(1 − x) is also atanh x;
/// 4.3.65–66 for sin and cos; 4.5.62 for sinh). Truncation is below 1e-17 relative on the stated ranges; with rounding the
/// results are within a few ulp of the correctly rounded value, checked against .NET's scalar <see cref="Math"/>
/// functions in VectorElementaryTests.
/// </remarks>
internal static class VectorElementary
{
    /// <summary>π/2 rounded to double.</summary>
    private const double HalfPiHigh = 1.5707963267948966;

    /// <summary>π/2 − <see cref="HalfPiHigh"/> (π/2 = 1.57079632679489661923132169…; the double is 1.57079632679489655799…).</summary>
    private const double HalfPiLow = 6.123233995736766e-17;

    /// <summary>ln 2 rounded to double, and the remainder (ln 2 = 0.693147180559945309417232121458…).</summary>
    private const double Ln2High = 0.6931471805599453, Ln2Low = 2.3190468138462996e-17;

    /// <summary>√2, the top of the mantissa range [√½, √2) used for ln.</summary>
    private const double Sqrt2 = 1.4142135623730951;

    private const long MantissaBits = 0x000F_FFFF_FFFF_FFFF;
    private const long ExponentOfOne = 0x3FF0_0000_0000_0000;
    private const int MantissaWidth = 52;
    private const int ExponentBias = 1023;

    /// <summary>sin x and cos x for 0 ≤ x ≤ π/2 (radians): the series on [0, π/4], and cos(π/2 − x), sin(π/2 − x) above it.</summary>
    /// <remarks>π/2 − x is exact for x in [π/4, π/2] (Sterbenz), and the low bits of π/2 are added after.</remarks>
    internal static (Vector256<double> Sin, Vector256<double> Cos) SinCosQuarterTurn(Vector256<double> x)
    {
        var upper = Vector256.GreaterThan(x, Vector256.Create(Math.PI / 4));
        var reduced = Vector256.ConditionalSelect(upper, (Vector256.Create(HalfPiHigh) - x) + Vector256.Create(HalfPiLow), x);
        var sin = SinEighthTurn(reduced);
        var cos = CosEighthTurn(reduced);
        return (Vector256.ConditionalSelect(upper, cos, sin), Vector256.ConditionalSelect(upper, sin, cos));
    }

    /// <summary>sin x = x − x³/3! + … − x¹⁹/19! for |x| ≤ π/4 (next term (π/4)²¹/21! ≈ 4e-22).</summary>
    private static Vector256<double> SinEighthTurn(Vector256<double> x)
    {
        var z = x * x;
        var p = Vector256.Create(-1.0 / 121_645_100_408_832_000);             // −1/19!
        p = (p * z) + Vector256.Create(1.0 / 355_687_428_096_000);            // 1/17!
        p = (p * z) - Vector256.Create(1.0 / 1_307_674_368_000);              // 1/15!
        p = (p * z) + Vector256.Create(1.0 / 6_227_020_800);                  // 1/13!
        p = (p * z) - Vector256.Create(1.0 / 39_916_800);                     // 1/11!
        p = (p * z) + Vector256.Create(1.0 / 362_880);                        // 1/9!
        p = (p * z) - Vector256.Create(1.0 / 5_040);                          // 1/7!
        p = (p * z) + Vector256.Create(1.0 / 120);                            // 1/5!
        p = (p * z) - Vector256.Create(1.0 / 6);                              // 1/3!
        return x + (x * z * p);
    }

    /// <summary>cos x = 1 − x²/2! + … + x²⁰/20! for |x| ≤ π/4 (next term (π/4)²²/22! ≈ 1.6e-23).</summary>
    private static Vector256<double> CosEighthTurn(Vector256<double> x)
    {
        var z = x * x;
        var p = Vector256.Create(1.0 / 2_432_902_008_176_640_000);            // 1/20!
        p = (p * z) - Vector256.Create(1.0 / 6_402_373_705_728_000);          // 1/18!
        p = (p * z) + Vector256.Create(1.0 / 20_922_789_888_000);             // 1/16!
        p = (p * z) - Vector256.Create(1.0 / 87_178_291_200);                 // 1/14!
        p = (p * z) + Vector256.Create(1.0 / 479_001_600);                    // 1/12!
        p = (p * z) - Vector256.Create(1.0 / 3_628_800);                      // 1/10!
        p = (p * z) + Vector256.Create(1.0 / 40_320);                         // 1/8!
        p = (p * z) - Vector256.Create(1.0 / 720);                            // 1/6!
        p = (p * z) + Vector256.Create(1.0 / 24);                             // 1/4!
        // 1 − z/2 + z²·p, with 1 − z/2 formed last so its rounding is the final one.
        var half = Vector256.Create(0.5) * z;
        return (Vector256.Create(1.0) - half) + (z * z * p);
    }

    /// <summary>
    /// ln z for positive normal z: z = 2ᵏ·m with m in [√½, √2), ln m = 2 atanh s with s = (m − 1)/(m + 1), |s| ≤ 0.1716
    /// (A&amp;S 4.1.27), then k·ln 2 with ln 2 in two parts.
    /// </summary>
    internal static Vector256<double> LogPositive(Vector256<double> z)
    {
        var bits = z.AsInt64();
        var exponent = Vector256.ShiftRightLogical(bits, MantissaWidth) - Vector256.Create((long)ExponentBias);
        var m = ((bits & Vector256.Create(MantissaBits)) | Vector256.Create(ExponentOfOne)).AsDouble(); // in [1, 2)
        var high = Vector256.GreaterThanOrEqual(m, Vector256.Create(Sqrt2));
        m = Vector256.ConditionalSelect(high, m * Vector256.Create(0.5), m);
        exponent += Vector256.ConditionalSelect(high.AsInt64(), Vector256.Create(1L), Vector256<long>.Zero);
        var k = Vector256.ConvertToDouble(exponent);

        var one = Vector256.Create(1.0);
        var s = (m - one) / (m + one);
        var lnM = Vector256.Create(2.0) * AtanhSeries(s);
        return (k * Vector256.Create(Ln2High)) + ((k * Vector256.Create(Ln2Low)) + lnM);
    }

    /// <summary>atanh x for |x| ≤ 0.1716 (so also for the eccentricity terms, |x| ≤ 0.1).</summary>
    internal static Vector256<double> AtanhSmall(Vector256<double> x) => AtanhSeries(x);

    /// <summary>
    /// atanh x = x + x³/3 + x⁵/5 + … + x²³/23 for |x| ≤ 0.1716 = (√2 − 1)/(√2 + 1): next term ≤ 2e-20·x.
    /// </summary>
    private static Vector256<double> AtanhSeries(Vector256<double> x)
    {
        var z = x * x;
        var p = Vector256.Create(1.0 / 23);
        p = (p * z) + Vector256.Create(1.0 / 21);
        p = (p * z) + Vector256.Create(1.0 / 19);
        p = (p * z) + Vector256.Create(1.0 / 17);
        p = (p * z) + Vector256.Create(1.0 / 15);
        p = (p * z) + Vector256.Create(1.0 / 13);
        p = (p * z) + Vector256.Create(1.0 / 11);
        p = (p * z) + Vector256.Create(1.0 / 9);
        p = (p * z) + Vector256.Create(1.0 / 7);
        p = (p * z) + Vector256.Create(1.0 / 5);
        p = (p * z) + Vector256.Create(1.0 / 3);
        return x + (x * z * p);
    }

    /// <summary>sinh y = y + y³/3! + y⁵/5! + y⁷/7! for |y| ≤ 0.011 (A&amp;S 4.5.62; next term y⁹/9! ≈ 6e-24).</summary>
    internal static Vector256<double> SinhSmall(Vector256<double> y)
    {
        var z = y * y;
        var p = Vector256.Create(1.0 / 5_040);
        p = (p * z) + Vector256.Create(1.0 / 120);
        p = (p * z) + Vector256.Create(1.0 / 6);
        return y + (y * z * p);
    }
}
