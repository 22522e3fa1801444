using MathNet.Numerics.Distributions;

namespace QaService.Core.Statistics;

/// <summary>Result of a one-sample test of a mean vector against zero.</summary>
/// <param name="N">Sample size.</param>
/// <param name="MeanE">Sample mean of the first component (east), in the data's unit.</param>
/// <param name="MeanN">Sample mean of the second component (north).</param>
/// <param name="TSquared">Hotelling's T² = n·x̄ᵀS⁻¹x̄ (S the sample covariance, divisor n − 1).</param>
/// <param name="F">F = (n − 2)/(2(n − 1))·T², distributed F(2, n − 2) under a zero mean.</param>
/// <param name="CriticalF">F(2, n − 2) quantile at 1 − α.</param>
/// <param name="PValue">P(F(2, n − 2) ≥ F).</param>
public sealed record HotellingResult(int N, double MeanE, double MeanN, double TSquared, double F, double CriticalF, double PValue)
{
    /// <summary>True when the mean differs from zero at the test's level.</summary>
    public bool Significant => F > CriticalF;
}

/// <summary>
/// Hotelling's one-sample T² test of a two-component mean against zero (Hotelling 1931, "The generalization of Student's
/// ratio", Annals of Mathematical Statistics 2(3):360–378, doi:10.1214/aoms/1177732979; NIST/SEMATECH e-Handbook §6.5.4.3):
/// T² = n·x̄ᵀS⁻¹x̄ and (n − p)/(p(n − 1))·T² ~ F(p, n − p) with p = 2. Tests the horizontal offset as one vector, so a
/// shift along a diagonal is not split into two weaker t tests. Needs n ≥ 3 and a non-singular S.
/// </summary>
public static class HotellingTest
{
    /// <summary>F(2, ν) quantile at 1 − α (MathNet FisherSnedecor), kept per (ν, α): it depends only on the count.</summary>
    private static readonly BoundedMemo<(int Freedom, double Alpha), double> CriticalF =
        new(key => new FisherSnedecor(2, key.Freedom).InverseCumulativeDistribution(1.0 - key.Alpha), mostEntries: 4096);

    /// <summary>Runs the test at significance <paramref name="alpha"/>; null when n &lt; 3 or S is singular.</summary>
    /// <param name="east">First components (e.g. dE, metres).</param>
    /// <param name="north">Second components (e.g. dN, metres), same length.</param>
    /// <param name="alpha">Significance level in (0, 1), e.g. 0.05.</param>
    public static HotellingResult? AgainstZero(ReadOnlySpan<double> east, ReadOnlySpan<double> north, double alpha)
    {
        int n = east.Length;
        if (n < 3 || north.Length != n)
            return null;
        double meanE = SampleMoments.Mean(east), meanN = SampleMoments.Mean(north);
        double see = 0, snn = 0, sen = 0;
        for (int i = 0; i < n; i++)
        {
            double de = east[i] - meanE, dn = north[i] - meanN;
            see += de * de;
            snn += dn * dn;
            sen += de * dn;
        }
        see /= n - 1;
        snn /= n - 1;
        sen /= n - 1;
        double det = (see * snn) - (sen * sen);
        if (!(det > 1e-300))
            return null;
        double quadratic = ((snn * meanE * meanE) - (2.0 * sen * meanE * meanN) + (see * meanN * meanN)) / det;
        double tSquared = n * quadratic;
        double f = (n - 2.0) / (2.0 * (n - 1.0)) * tSquared;
        var distribution = new FisherSnedecor(2, n - 2);
        return new HotellingResult(n, meanE, meanN, tSquared, f, CriticalF[(n - 2, alpha)], 1.0 - distribution.CumulativeDistribution(f));
    }
}
