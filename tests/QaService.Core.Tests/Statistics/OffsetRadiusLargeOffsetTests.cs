using QaService.Core.Statistics;

namespace QaService.Core.Tests.Statistics;

/// <summary>
/// Radii when the offset dwarfs the spread (identical residuals up to rounding, |μ|/σ ≥ 1e4): the Rice
/// distribution of |X| tends to N(|μ|, σ²) as |μ|/σ grows (a standard limit of the Rice distribution, from
/// memory: Rice 1945; the first correction is σ²/(2|μ|)), so r_p → |μ| + σ·Φ⁻¹(p).
/// </summary>
public sealed class OffsetRadiusLargeOffsetTests
{
    [Theory]
    [InlineData(0.50, 0.0)]
    [InlineData(0.90, 1.2815515655446004)]
    [InlineData(0.95, 1.6448536269514722)]
    public void Circular_with_a_huge_offset_is_the_offset_plus_a_normal_quantile(double probability, double quantile)
    {
        const double sigma = 1e-7; // |μ|/σ = 1.44e5, the shape of identical residuals with rounding noise
        var distribution = new BivariateNormal(0.012, -0.008, sigma * sigma, sigma * sigma, 0.0);
        var radius = OffsetErrorRadius.Circular(probability, distribution);
        // Tolerance: the neglected curvature term σ²/(2|μ|)·χ² is below 1e-11 m here.
        Assert.Equal(Math.Sqrt(0.012 * 0.012 + 0.008 * 0.008) + sigma * quantile, radius, 1e-10);
    }

    [Fact]
    public void Circular_with_no_spread_is_the_offset() =>
        Assert.Equal(Math.Sqrt(0.012 * 0.012 + 0.008 * 0.008), OffsetErrorRadius.Circular(0.95, new BivariateNormal(0.012, -0.008, 1e-40, 1e-40, 0.0)), 1e-15);
}

/// <summary>The offset model is given only where its quadrature is validated (σmin/σmax ≥ 1e-3, or singular, or offset-dominated).</summary>
public sealed class OffsetRadiiRangeTests
{
    private static (double[] E, double[] N) Thin(double ratio)
    {
        var e = new double[20];
        var n = new double[20];
        for (var i = 0; i < 20; i++)
        {
            e[i] = (i - 9.5) * 0.01;
            n[i] = ((i * 7) % 20 - 9.5) * 0.01 * ratio;
        }
        return (e, n);
    }

    [Theory]
    [InlineData(1e-4, false)]
    [InlineData(5e-4, false)]
    [InlineData(2e-3, true)]
    [InlineData(0.5, true)]
    public void Given_only_in_the_validated_range(double ratio, bool given)
    {
        var (e, n) = Thin(ratio);
        Assert.Equal(given, OffsetRadii.Compute(e, n, []) is not null);
    }
}
