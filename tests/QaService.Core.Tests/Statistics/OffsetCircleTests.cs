using System.Globalization;
using QaService.Core.Statistics;

namespace QaService.Core.Tests.Statistics;

/// <summary>Circle probabilities and radii with a systematic offset (noncentral case).</summary>
public sealed class OffsetCircleTests
{
    /// <summary>Half a unit in the 6th decimal: printed precision of check-values.md §5.</summary>
    private const double SixDecimals = 0.5e-6;

    /// <summary>Half a unit in the 4th decimal: printed precision of the §5 radii.</summary>
    private const double FourDecimals = 0.5e-4;

    [Theory]
    [InlineData(1.0, 1.0, 0.0, 1.0, 0.0, 2.0, 0.730988)]   // circular sigma 1, mu 1, r 2
    [InlineData(1.0, 1.0, 0.0, 2.0, 0.0, 2.0, 0.396499)]   // circular sigma 1, mu 2, r 2
    [InlineData(1.0, 0.5, 0.0, 0.0, 0.0, 1.0, 0.590095)]   // unequal axes, zero mean
    [InlineData(1.0, 1.0, 0.5, 0.0, 0.0, 1.5, 0.693863)]   // correlated
    [InlineData(1.0, 0.5, 0.0, 0.5, 0.5, 1.5, 0.735328)]   // unequal axes with an offset
    public void Probabilities_match_check_values_section_5(double se, double sn, double rho, double me, double mn, double r, double expected)
    {
        // check-values.md §5, status C (two independent integrations).
        Assert.Equal(expected, OffsetCircleProbability.Probability(r, BivariateNormal.FromSigmas(se, sn, rho, me, mn)), SixDecimals);
    }

    [Theory]
    [InlineData(0.5, 1.2516, 2.2746, 2.5917, 1.8388, 2.1815)]
    [InlineData(1.0, 1.4755, 2.6019, 2.9398, 2.2845, 2.6461)]
    [InlineData(2.0, 2.2458, 3.4734, 3.8263, 3.2816, 3.6449)]
    public void Radii_with_an_offset_match_check_values_section_5(double mu, double cep, double ce90, double r95, double le90, double le95)
    {
        // check-values.md §5, status C: circular and one-dimensional bias mu/sigma.
        var circular = BivariateNormal.FromSigmas(1.0, 1.0, 0.0, mu, 0.0);
        Assert.Equal(cep, OffsetErrorRadius.Circular(0.5, circular), FourDecimals);
        Assert.Equal(ce90, OffsetErrorRadius.Circular(0.9, circular), FourDecimals);
        Assert.Equal(r95, OffsetErrorRadius.Circular(0.95, circular), FourDecimals);
        Assert.Equal(le90, OffsetErrorRadius.Linear(0.9, mu, 1.0), FourDecimals);
        Assert.Equal(le95, OffsetErrorRadius.Linear(0.95, mu, 1.0), FourDecimals);
    }

    [Fact]
    public void Every_scipy_row_agrees()
    {
        // tests/reference-data/offset-circle-scipy.tsv (scipy 1.10 dblquad / ncx2 / brentq; header names versions).
        string path = ReferenceFiles.PathOf("offset-circle-scipy.tsv");
        int rows = 0;
        foreach (string line in File.ReadLines(path).Where(l => l.Length > 0 && !l.StartsWith('#')))
        {
            string[] f = line.Split('\t');
            double V(int i) => double.Parse(f[i], NumberStyles.Float, CultureInfo.InvariantCulture);
            var (se, sn, rho, me, mn, argument, expected) = (V(1), V(2), V(3), V(4), V(5), V(6), V(7));
            double actual;
            if (sn == 0.0)
                actual = f[0] == "prob" ? OffsetErrorRadius.LinearProbability(argument, me, se) : OffsetErrorRadius.Linear(argument, me, se);
            else
            {
                var distribution = BivariateNormal.FromSigmas(se, sn, rho, me, mn);
                actual = f[0] == "prob" ? OffsetCircleProbability.Probability(argument, distribution) : OffsetErrorRadius.Circular(argument, distribution);
            }
            // scipy's values are good to ~1e-10; 1e-9 relative leaves room for both quadratures.
            Assert.True(Math.Abs(actual - expected) <= 1e-9 * Math.Max(Math.Abs(expected), 1e-3), $"{line}: got {actual:R}");
            rows++;
        }
        Assert.True(rows >= 40, $"only {rows} rows read");
    }

    [Theory]
    [InlineData(0.5, 0.3)]
    [InlineData(1.0, 0.05)]
    [InlineData(2.0, 0.9)]
    public void Zero_mean_agrees_with_the_zero_mean_integral(double radius, double q)
    {
        // Same distribution, two different quadratures (CircleProbability uses a sinh-substituted angle).
        Assert.Equal(CircleProbability.ZeroMean(radius, 1.0, q),
            OffsetCircleProbability.Probability(radius, BivariateNormal.FromSigmas(1.0, q)), 1e-12);
    }

    [Fact]
    public void Singular_covariance_falls_back_to_the_line()
    {
        // sigmaN = 0, offset (0.5, 0.3): mass on the line N = 0.3, |E| <= sqrt(r^2 - 0.09); closed form by Phi.
        double r = 1.0, h = Math.Sqrt(1.0 - 0.09);
        double expected = MathNet.Numerics.Distributions.Normal.CDF(0, 1, h - 0.5) - MathNet.Numerics.Distributions.Normal.CDF(0, 1, -h - 0.5);
        Assert.Equal(expected, OffsetCircleProbability.Probability(r, new BivariateNormal(0.5, 0.3, 1.0, 0.0, 0.0)), 1e-14);
    }

    /// <summary>
    /// Newton's method converges quadratically from its start (Press et al., Numerical Recipes, 3rd ed., §9.4), so a
    /// handful of quadratures find each radius. A step that rounded onto the point just evaluated was once taken as
    /// leaving the bracket and sent the search into about twenty bisections (25 quadratures for CEP of μ = (0.3, 0.15) m,
    /// σ = (1, 0.8) m, ρ = 0.2). The search starts from a two-moment chi-square fit (Patnaik 1949) and ends on a Newton
    /// step below 1e-7 σ. Over a sweep of offsets, axis ratios and correlations: at most 6 quadratures and 3.5 on average
    /// (measured: 4 and 3.11; from the circular-normal start 7 and 4.97), and the radius still holds p.
    /// </summary>
    [Fact]
    public void Each_offset_radius_takes_a_handful_of_quadratures()
    {
        int most = 0, total = 0, count = 0;
        foreach (double mu in new[] { 0.0, 0.05, 0.3, 1.0, 3.0 })
            foreach (double q in new[] { 0.1, 0.5, 0.8, 1.0 })
                foreach (double rho in new[] { -0.6, 0.0, 0.2 })
                    foreach (double p in new[] { 0.5, 0.9, 0.95 })
                    {
                        var distribution = BivariateNormal.FromSigmas(1.0, q, rho, mu, mu / 2.0);
                        double radius = OffsetErrorRadius.Circular(p, distribution, out int evaluations);
                        most = Math.Max(most, evaluations);
                        total += evaluations;
                        count++;
                        Assert.Equal(p, OffsetCircleProbability.Probability(radius, distribution), 1e-9);
                    }
        Assert.InRange(most, 1, 6);
        Assert.InRange((double)total / count, 1.0, 3.5);
    }
}
