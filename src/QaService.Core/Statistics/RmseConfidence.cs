using MathNet.Numerics.Distributions;

namespace QaService.Core.Statistics;

/// <summary>
/// Chi-square confidence bounds for an RMSE about zero. For n independent N(0, σ²) residuals, n·RMSE²/σ² ~ χ²ₙ, so
/// σ lies in [RMSE·√(ν/χ²_{(1+c)/2,ν}), RMSE·√(ν/χ²_{(1−c)/2,ν})] with confidence c, ν = n (the textbook interval for a
/// normal variance, e.g. NIST/SEMATECH e-Handbook of Statistical Methods §7.2.3.1, with ν = n because the mean is
/// taken as zero, not estimated). The one-sided upper bound at confidence c is RMSE·√(ν/χ²_{1−c,ν}).
/// </summary>
/// <remarks>
/// Horizontal RMSE_r sums two axes: with unequal mean squares mE², mN² the degrees of freedom are taken by
/// Satterthwaite's approximation ν = n·(mE² + mN²)²/(mE⁴ + mN⁴) (Satterthwaite 1946, Biometrics Bulletin 2(6):110–114,
/// doi:10.2307/3002019), which is 2n for equal axes and n when one axis dominates. Valid for normal, unbiased,
/// independent errors; a bias or outliers make the interval too narrow (read it with the bias and outlier checks).
/// Quantiles: MathNet <c>ChiSquared.InvCDF</c>, relative accuracy ~1e-12 (checked against scipy 1.10 in the tests).
/// Every figure proportional to the RMSE (NSSDA 1.9600·RMSE_z, 2.4477·RMSE, CE90, LE90) scales by the same ratio.
/// </remarks>
public static class RmseConfidence
{
    /// <summary>Two-sided interval for σ at confidence <paramref name="level"/> (e.g. 0.95), in the RMSE's unit.</summary>
    /// <param name="rmse">RMSE about zero, ≥ 0, any length unit.</param>
    /// <param name="degreesOfFreedom">ν &gt; 0 (n, or Satterthwaite's ν for RMSE_r).</param>
    /// <param name="level">Confidence in (0, 1).</param>
    public static (double Lower, double Upper) Interval(double rmse, double degreesOfFreedom, double level)
    {
        Require(rmse, degreesOfFreedom, level);
        double tail = (1.0 - level) / 2.0;
        return (rmse * Math.Sqrt(degreesOfFreedom / ChiSquared.InvCDF(degreesOfFreedom, 1.0 - tail)),
                rmse * Math.Sqrt(degreesOfFreedom / ChiSquared.InvCDF(degreesOfFreedom, tail)));
    }

    /// <summary>One-sided upper bound for σ at confidence <paramref name="level"/>: RMSE·√(ν/χ²_{1−c,ν}).</summary>
    public static double UpperBound(double rmse, double degreesOfFreedom, double level)
    {
        Require(rmse, degreesOfFreedom, level);
        return rmse * Math.Sqrt(degreesOfFreedom / ChiSquared.InvCDF(degreesOfFreedom, 1.0 - level));
    }

    /// <summary>Satterthwaite's ν for RMSE_r from n points with mean squares <paramref name="meanSquareE"/>, <paramref name="meanSquareN"/> (m²).</summary>
    public static double HorizontalDegreesOfFreedom(int n, double meanSquareE, double meanSquareN)
    {
        double sum = meanSquareE + meanSquareN;
        double squares = (meanSquareE * meanSquareE) + (meanSquareN * meanSquareN);
        return squares > 0.0 ? n * sum * sum / squares : 2.0 * n;
    }

    /// <summary>
    /// Sample-size advice: the fewest check points n for which the one-sided upper bound at <paramref name="level"/>
    /// would meet <paramref name="required"/>, if the RMSE stayed at its present value. The figure tested is
    /// proportional to the RMSE, so the condition is figure·√(ν/χ²_{1−c,ν}) ≤ required with ν = degreesPerPoint·n.
    /// </summary>
    /// <param name="figure">Point estimate of the judged figure (same unit as <paramref name="required"/>).</param>
    /// <param name="required">The spec figure, &gt; 0.</param>
    /// <param name="level">Confidence in (0, 1).</param>
    /// <param name="degreesPerPoint">ν per check point: 1 vertical, between 1 and 2 horizontal.</param>
    /// <param name="maximumPoints">Search limit.</param>
    /// <returns>n, or null when figure ≥ required (no sample size can show it) or n would exceed the limit.</returns>
    public static int? PointsNeeded(double figure, double required, double level, double degreesPerPoint, int maximumPoints = 100_000)
    {
        if (!(figure < required) || figure < 0.0)
            return null;
        if (figure == 0.0)
            return 1;
        double ratioSquared = (required / figure) * (required / figure);
        // ν/χ²_{1−c,ν} decreases towards 1 as ν grows. The search starts at the Wilson–Hilferty estimate of n and walks
        // out to a bracket in doubling steps, then bisects: the same smallest n as a search from 1 (the exact quantile
        // decides every step), in two or three quantiles instead of a dozen or more.
        bool Enough(int n)
        {
            double nu = degreesPerPoint * n;
            return nu / ChiSquared.InvCDF(nu, 1.0 - level) <= ratioSquared;
        }
        int guess = Math.Clamp(WilsonHilfertyPoints(ratioSquared, level, degreesPerPoint), 1, maximumPoints);
        int low, high; // invariant after the walk: low = 0 or not Enough(low); Enough(high)
        if (Enough(guess))
        {
            high = guess;
            low = guess - 1;
            for (int step = 1; low >= 1 && Enough(low); step *= 2)
            {
                high = low;
                low = Math.Max(0, high - (2 * step));
            }
        }
        else
        {
            low = guess;
            high = Math.Min(guess + 1, maximumPoints);
            for (int step = 1; !Enough(high); step *= 2)
            {
                if (high >= maximumPoints)
                    return null;
                low = high;
                high = (int)Math.Min((long)low + (2 * step), maximumPoints);
            }
        }
        while (high - low > 1)
        {
            int middle = low + ((high - low) / 2);
            if (Enough(middle)) high = middle; else low = middle;
        }
        return high;
    }

    /// <summary>
    /// n from the Wilson–Hilferty approximation χ²_{α,ν} ≈ ν(1 − 2/(9ν) + z_α√(2/(9ν)))³ (Wilson &amp; Hilferty 1931, PNAS
    /// 17(12):684–688; relative error of the quantile ~1e-3 for ν ≥ 3): the ν where ν/χ²_{1−c,ν} = ratio², rounded up. A
    /// starting point only.
    /// </summary>
    private static int WilsonHilfertyPoints(double ratioSquared, double level, double degreesPerPoint)
    {
        double z = Normal.InvCDF(0.0, 1.0, 1.0 - level);
        double gap = 1.0 - Math.Pow(ratioSquared, -1.0 / 3.0); // 1 − (required/figure)^(−2/3), in (0, 1)
        double t = (z + Math.Sqrt((z * z) + (4.0 * gap))) / 2.0; // √(2/(9ν)) at equality
        double nu = 2.0 / (9.0 * t * t);
        return double.IsFinite(nu) ? (int)Math.Min(Math.Ceiling(nu / degreesPerPoint), int.MaxValue) : int.MaxValue;
    }

    private static void Require(double rmse, double degreesOfFreedom, double level)
    {
        if (!(rmse >= 0.0 && double.IsFinite(rmse)))
            throw new ArgumentException($"RMSE {rmse} must be finite and ≥ 0.", nameof(rmse));
        if (!(degreesOfFreedom > 0.0 && double.IsFinite(degreesOfFreedom)))
            throw new ArgumentException($"Degrees of freedom {degreesOfFreedom} must be > 0.", nameof(degreesOfFreedom));
        if (!(level > 0.0 && level < 1.0))
            throw new ArgumentException($"Confidence {level} must be in (0, 1).", nameof(level));
    }
}
