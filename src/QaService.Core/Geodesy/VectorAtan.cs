using System.Runtime.Intrinsics;

namespace QaService.Core.Geodesy;

/// <summary>
/// Arctangent of four doubles at once, for non-negative arguments: the Cephes Math Library <c>atan.c</c> algorithm
/// (S. L. Moshier, Cephes Mathematical Library 2.8, 2000; also Moshier 1989, "Methods and Programs for Mathematical
/// Functions", Ellis Horwood): reduction to |x| ≤ 0.66 by atan x = π/2 − atan(1/x) (x &gt; tan 3π/8) or
/// π/4 + atan((x − 1)/(x + 1)) (0.66 &lt; x ≤ tan 3π/8), then x + x·z·P(z)/Q(z), z = x², a degree 4/5 rational whose
/// stated relative error is 1.8e-16 (IEEE double, over the reduced range), with π/2 and π/4 carried to extra bits.
/// </summary>
/// <remarks>Input: x ≥ 0, finite or +∞ (radians out in [0, π/2]). Used by the transverse Mercator batch kernel, where
/// it is checked end to end against PROJ 9.1.1 (tests/reference-data/tm-utm-proj.tsv).</remarks>
internal static class VectorAtan
{
    /// <summary>tan(3π/8) = 1 + √2 (Cephes T3P8).</summary>
    private const double TanThreeEighthsPi = 2.41421356237309504880;

    /// <summary>Boundary between the plain and the π/4-shifted reduction (Cephes).</summary>
    private const double ShiftThreshold = 0.66;

    /// <summary>Low-order bits of π/2 beyond the double nearest π/2 (Cephes MOREBITS).</summary>
    private const double HalfPiLowBits = 6.123233995736765886130E-17;

    // Cephes atan.c numerator P(z) (degree 4) and monic denominator Q(z) (degree 5), highest power first.
    private const double P0 = -8.750608600031904122785E-1, P1 = -1.615753718733365076637E1, P2 = -7.500855792314704667340E1,
        P3 = -1.228866684490136173410E2, P4 = -6.485021904942025371773E1;

    private const double Q0 = 2.485846490142306297962E1, Q1 = 1.650270098316988542046E2, Q2 = 4.328810604912902668951E2,
        Q3 = 4.853903996359136964868E2, Q4 = 1.945506571482613964425E2;

    /// <summary>atan x for each lane, x ≥ 0; radians.</summary>
    /// <param name="x">Arguments, ≥ 0 (dimensionless).</param>
    internal static Vector256<double> NonNegative(Vector256<double> x)
    {
        var one = Vector256.Create(1.0);
        var large = Vector256.GreaterThan(x, Vector256.Create(TanThreeEighthsPi));
        var middle = Vector256.AndNot(Vector256.GreaterThan(x, Vector256.Create(ShiftThreshold)), large);
        var reduced = Vector256.ConditionalSelect(large, -(one / x), Vector256.ConditionalSelect(middle, (x - one) / (x + one), x));
        var offset = Vector256.ConditionalSelect(large, Vector256.Create(Math.PI / 2),
            Vector256.ConditionalSelect(middle, Vector256.Create(Math.PI / 4), Vector256<double>.Zero));
        var lowBits = Vector256.ConditionalSelect(large, Vector256.Create(HalfPiLowBits),
            Vector256.ConditionalSelect(middle, Vector256.Create(0.5 * HalfPiLowBits), Vector256<double>.Zero));

        var z = reduced * reduced;
        var p = (((((Vector256.Create(P0) * z) + Vector256.Create(P1)) * z) + Vector256.Create(P2)) * z + Vector256.Create(P3)) * z + Vector256.Create(P4);
        var q = ((((((z + Vector256.Create(Q0)) * z) + Vector256.Create(Q1)) * z) + Vector256.Create(Q2)) * z + Vector256.Create(Q3)) * z + Vector256.Create(Q4);
        var ratio = z * p / q;
        return offset + ((reduced * ratio) + reduced + lowBits);
    }
}
