using MathNet.Numerics;
using QaService.Core.Statistics;

namespace QaService.Core.Tests.Statistics;

public class CircleProbabilityTests
{
    /// <summary>Half a unit in the 6th decimal: printed precision of check-values.md §5.</summary>
    private const double SixDecimals = 0.5e-6;

    [Fact]
    public void Unequal_axes_unit_radius_matches_check_values()
    {
        // check-values.md §5, status C: sigma = (1, 0.5), mu = 0, r = 1 -> 0.590095.
        Assert.Equal(0.590095, CircleProbability.ZeroMean(1.0, 1.0, 0.5), SixDecimals);
        Assert.Equal(0.590095, CircleProbability.ZeroMean(1.0, 0.5, 1.0), SixDecimals);
    }

    [Fact]
    public void Correlated_case_matches_check_values_through_principal_axes()
    {
        // check-values.md §5, status C: sigma_x = sigma_y = 1, rho = 0.5, r = 1.5 -> 0.693863.
        (double major, double minor) = PrincipalAxes.FromSecondMoments(1.0, 1.0, 0.5);
        Assert.Equal(Math.Sqrt(1.5), major, 1e-15);
        Assert.Equal(Math.Sqrt(0.5), minor, 1e-15);
        Assert.Equal(0.693863, CircleProbability.ZeroMean(1.5, major, minor), SixDecimals);
    }

    [Theory]
    [InlineData(0.3)]
    [InlineData(1.0)]
    [InlineData(2.5)]
    public void Closed_forms_hold_at_the_degenerate_shapes(double radius)
    {
        // Rayleigh CDF 1 - exp(-r^2/2) for equal axes; erf(r/sqrt2) for a zero minor axis (textbook identities).
        Assert.Equal(1.0 - Math.Exp(-radius * radius / 2.0), CircleProbability.ZeroMean(radius, 1.0, 1.0), 1e-15);
        Assert.Equal(SpecialFunctions.Erf(radius / Math.Sqrt(2.0)), CircleProbability.ZeroMean(radius, 1.0, 0.0), 1e-15);
        // The quadrature path must reach the same limits (q -> 1 exactly; q -> 0 to O(q^2)).
        Assert.Equal(1.0 - Math.Exp(-radius * radius / 2.0), CircleProbability.ByQuadrature(radius, 1.0 - 1e-15, complement: false), 1e-13);
        Assert.Equal(SpecialFunctions.Erf(radius / Math.Sqrt(2.0)), CircleProbability.ByQuadrature(radius, 1e-9, complement: false), 1e-13);
    }

    [Theory]
    [InlineData(1e-4, 1e-6)]
    [InlineData(0.5, 0.1)]
    [InlineData(3.0, 0.7)]
    [InlineData(6.0, 0.3)]
    public void Probability_and_complement_add_to_one(double rho, double q)
    {
        // Two integrals of different integrands (1 - e^-x vs e^-x); agreement to 1e-14 bounds their error.
        double p = CircleProbability.ByQuadrature(rho, q, complement: false);
        double complement = CircleProbability.ByQuadrature(rho, q, complement: true);
        Assert.Equal(1.0, p + complement, 1e-14);
    }

    [Fact]
    public void Degenerate_and_invalid_inputs()
    {
        Assert.Equal(1.0, CircleProbability.ZeroMean(0.0, 0.0, 0.0));
        Assert.Equal(0.0, CircleProbability.ZeroMean(0.0, 1.0, 0.5));
        Assert.Equal(1.0, CircleProbability.ZeroMean(double.PositiveInfinity, 1.0, 0.5));
        Assert.Throws<ArgumentException>(() => CircleProbability.ZeroMean(double.NaN, 1.0, 0.5));
        Assert.Throws<ArgumentException>(() => CircleProbability.ZeroMean(1.0, double.NaN, 0.5));
        Assert.Throws<ArgumentException>(() => CircleProbability.ZeroMean(1.0, 1.0, -0.5));
        Assert.Throws<ArgumentException>(() => CircleProbability.ZeroMean(-1.0, 1.0, 0.5));
    }
}
