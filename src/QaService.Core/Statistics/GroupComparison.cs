using MathNet.Numerics;

namespace QaService.Core.Statistics;

/// <summary>The outcome of a test that several groups share a parameter.</summary>
/// <param name="Statistic">The F statistic.</param>
/// <param name="DegreesOfFreedom1">Numerator degrees of freedom (k − 1).</param>
/// <param name="DegreesOfFreedom2">Denominator degrees of freedom (N − k; Welch: his approximate ν₂, not an integer).</param>
/// <param name="PValue">Upper tail of F(ν₁, ν₂) at the statistic: the chance of so large a value if the groups share the parameter.</param>
public readonly record struct GroupTestResult(double Statistic, double DegreesOfFreedom1, double DegreesOfFreedom2, double PValue);

/// <summary>
/// Tests whether k groups of values differ, on plain arrays (one array per group). Tails of F from MathNet.Numerics'
/// regularised incomplete beta (the function behind its FisherSnedecor distribution).
/// </summary>
public static class GroupComparison
{
    /// <summary>
    /// Equality of spreads by Levene's test centred on the group medians, i.e. the Brown–Forsythe test (Levene, H. 1960,
    /// "Robust tests for equality of variances", in Olkin (ed.) Contributions to Probability and Statistics, 278–292;
    /// Brown, M. B. &amp; Forsythe, A. B. 1974, JASA 69(346):364–367, doi:10.1080/01621459.1974.10482955):
    /// z_ij = |x_ij − median_i|, W = (N − k)/(k − 1) · Σ n_i (z̄_i − z̄)² / Σ_i Σ_j (z_ij − z̄_i)², W ~ F(k − 1, N − k) under
    /// equal spreads. Robust to non-normal (e.g. radial, Rayleigh-like) errors. Same definition as scipy.stats.levene(center='median').
    /// Needs k ≥ 2 groups and N &gt; k; null when every z is equal to its group mean (no spread to compare).
    /// </summary>
    public static GroupTestResult? BrownForsythe(IReadOnlyList<double[]> groups)
    {
        var k = groups.Count;
        var total = groups.Sum(g => g.Length);
        if (k < 2 || total <= k)
            return null;
        var means = new double[k];
        var grandSum = 0.0;
        var deviations = new double[k][];
        for (var i = 0; i < k; i++)
        {
            var g = groups[i];
            // Type-7 at p = ½ is the median (mean of the two middle values for even n), by selection: O(n).
            var median = Percentile.LinearInterpolation(g, 0.5);
            var z = new double[g.Length];
            var sum = 0.0;
            for (var j = 0; j < g.Length; j++)
            {
                z[j] = Math.Abs(g[j] - median);
                sum += z[j];
            }
            deviations[i] = z;
            means[i] = sum / g.Length;
            grandSum += sum;
        }
        var grandMean = grandSum / total;
        double between = 0, within = 0;
        for (var i = 0; i < k; i++)
        {
            between += groups[i].Length * (means[i] - grandMean) * (means[i] - grandMean);
            foreach (var z in deviations[i])
                within += (z - means[i]) * (z - means[i]);
        }
        if (!(within > 0))
            return null;
        double df1 = k - 1, df2 = total - k;
        var w = df2 / df1 * between / within;
        return new GroupTestResult(w, df1, df2, UpperTail(w, df1, df2));
    }

    /// <summary>
    /// Equality of means without assuming equal variances: Welch's one-way test (Welch, B. L. 1951, "On the comparison of
    /// several mean values: an alternative approach", Biometrika 38(3/4):330–336, doi:10.2307/2332579). With w_i = n_i / s_i²
    /// (s_i² the n − 1 sample variance), x̄_w = Σ w_i x̄_i / Σ w_i, λ = Σ (1 − w_i/Σw)² / (n_i − 1):
    /// F = [Σ w_i (x̄_i − x̄_w)² / (k − 1)] / [1 + 2 (k − 2) λ / (k² − 1)], ν₁ = k − 1, ν₂ = (k² − 1) / (3 λ).
    /// Needs k ≥ 2 groups, each with n_i ≥ 2 and s_i &gt; 0; null otherwise.
    /// </summary>
    public static GroupTestResult? Welch(IReadOnlyList<double[]> groups)
    {
        var k = groups.Count;
        if (k < 2 || groups.Any(g => g.Length < 2))
            return null;
        var weights = new double[k];
        var means = new double[k];
        double weightSum = 0;
        for (var i = 0; i < k; i++)
        {
            var sd = SampleMoments.SampleStandardDeviation(groups[i]);
            var variance = sd * sd;
            if (!(variance > 0))
                return null;
            means[i] = SampleMoments.Mean(groups[i]);
            weights[i] = groups[i].Length / variance;
            weightSum += weights[i];
        }
        var weightedMean = 0.0;
        for (var i = 0; i < k; i++)
            weightedMean += weights[i] * means[i];
        weightedMean /= weightSum;
        double between = 0, lambda = 0;
        for (var i = 0; i < k; i++)
        {
            between += weights[i] * (means[i] - weightedMean) * (means[i] - weightedMean);
            var share = 1 - weights[i] / weightSum;
            lambda += share * share / (groups[i].Length - 1);
        }
        double df1 = k - 1, kk = (double)k * k - 1;
        var f = between / df1 / (1 + 2.0 * (k - 2) * lambda / kk);
        var df2 = kk / (3 * lambda);
        return new GroupTestResult(f, df1, df2, UpperTail(f, df1, df2));
    }

    /// <summary>
    /// P(F(ν₁, ν₂) ≥ x) = I_{ν₂/(ν₂ + ν₁x)}(ν₂/2, ν₁/2) (Abramowitz &amp; Stegun 26.6.2 with the incomplete beta's symmetry), from
    /// MathNet's regularised incomplete beta directly, so small p-values keep their relative accuracy (1 − CDF would not).
    /// </summary>
    internal static double UpperTail(double x, double df1, double df2) =>
        x <= 0 ? 1.0 : Math.Clamp(SpecialFunctions.BetaRegularized(df2 / 2, df1 / 2, df2 / (df2 + df1 * x)), 0.0, 1.0);
}
