using QaService.Core.Standards;
using QaService.Core.Statistics;

namespace QaService.Core.Tests.Statistics;

/// <summary>Confidence bounds, bootstrap and sample-size advice; reference numbers from scipy 1.10 (stats.chi2, stats.beta).</summary>
public sealed class ConfidenceTests
{
    [Fact]
    public void Chi_square_interval_matches_scipy()
    {
        // sqrt(20/chi2.ppf(0.975, 20)) = 0.765059, sqrt(20/chi2.ppf(0.025, 20)) = 1.444069.
        var (lower, upper) = RmseConfidence.Interval(1.0, 20, 0.95);
        Assert.Equal(0.765059137537, lower, 9);
        Assert.Equal(1.444069489985, upper, 9);
        // One-sided 90 %: sqrt(20/chi2.ppf(0.1, 20)) = 1.267825; ν = 40: 1.173419.
        Assert.Equal(1.267824871244, RmseConfidence.UpperBound(1.0, 20, 0.9), 9);
        Assert.Equal(1.173418736360, RmseConfidence.UpperBound(1.0, 40, 0.9), 9);
    }

    [Fact]
    public void Satterthwaite_degrees_of_freedom_run_from_n_to_2n()
    {
        Assert.Equal(40, RmseConfidence.HorizontalDegreesOfFreedom(20, 1.0, 1.0), 12);
        Assert.Equal(20, RmseConfidence.HorizontalDegreesOfFreedom(20, 1.0, 0.0), 12);
    }

    [Fact]
    public void Points_needed_matches_a_brute_force_search_with_scipy()
    {
        // Smallest n with 0.9·sqrt(n/chi2.ppf(0.1, n)) ≤ 1: 86; with ν = 2n, 0.8·sqrt(2n/chi2.ppf(0.05, 2n)) ≤ 1: 18.
        Assert.Equal(86, RmseConfidence.PointsNeeded(0.9, 1.0, 0.9, 1.0));
        Assert.Equal(18, RmseConfidence.PointsNeeded(0.8, 1.0, 0.95, 2.0));
        Assert.Null(RmseConfidence.PointsNeeded(1.1, 1.0, 0.9, 1.0));
    }

    /// <summary>
    /// The search that starts from an approximate n must land on the n a plain scan from 1 finds: the smallest n whose
    /// exact bound meets the requirement (MathNet's chi-square quantile in both), across figures near and far from the
    /// requirement, confidence levels, degrees per point and the search limit.
    /// </summary>
    [Fact]
    public void Points_needed_is_the_smallest_n_a_scan_from_one_finds()
    {
        static int? Scan(double figure, double required, double level, double degreesPerPoint, int limit)
        {
            for (var n = 1; n <= limit; n++)
            {
                double nu = degreesPerPoint * n;
                if (figure * Math.Sqrt(nu / MathNet.Numerics.Distributions.ChiSquared.InvCDF(nu, 1.0 - level)) <= required)
                    return n;
            }
            return null;
        }
        var checkedCases = 0;
        foreach (var ratio in new[] { 0.05, 0.3, 0.5, 0.7, 0.8, 0.9, 0.95, 0.97 })
        foreach (var level in new[] { 0.8, 0.9, 0.95, 0.99 })
        foreach (var degreesPerPoint in new[] { 1.0, 1.37, 2.0 })
        {
            const int limit = 2_000;
            Assert.Equal(Scan(ratio, 1.0, level, degreesPerPoint, limit), RmseConfidence.PointsNeeded(ratio, 1.0, level, degreesPerPoint, limit));
            checkedCases++;
        }
        Assert.Equal(96, checkedCases);
    }

    [Fact]
    public void Clopper_pearson_upper_bound_matches_scipy()
    {
        // beta.ppf(0.95, 4, 22) = 0.281723 for 3 of 25 points.
        Assert.Equal(0.281722507978, StandardConfidence.ShareUpperBound(3 / 25.0, 25, 0.95), 9);
        Assert.Equal(1.0, StandardConfidence.ShareUpperBound(1.0, 25, 0.95));
    }

    [Fact]
    public void Bootstrap_is_deterministic_and_brackets_the_estimate()
    {
        double[] radial = CheckValueVectors.SyntheticDE.Zip(CheckValueVectors.SyntheticDN, double.Hypot).ToArray();
        var first = BootstrapInterval.OfQuantile(radial, 0.95, 0.95);
        var second = BootstrapInterval.OfQuantile(radial, 0.95, 0.95);
        Assert.Equal(first, second);
        double estimate = Percentile.LinearInterpolation(radial, 0.95);
        Assert.InRange(estimate, first.Lower, first.Upper);
        Assert.True(first.Lower < first.Upper);
        Assert.True(first.Upper <= radial.Max());
        Assert.NotEqual(first, BootstrapInterval.OfQuantile(radial, 0.95, 0.95, seed: 7));
    }

    [Fact]
    public void Confidence_judgement_passes_only_when_the_upper_bound_meets_the_spec()
    {
        // nssda95 = 0.044141 m for the check-values vector (n = 20). At 90 %, ν ≈ 39.9 → upper ≈ 0.0518 m.
        var h = HorizontalAccuracy.Compute(CheckValueVectors.SyntheticDE, CheckValueVectors.SyntheticDN);
        var radial = CheckValueVectors.SyntheticDE.Zip(CheckValueVectors.SyntheticDN, double.Hypot).ToArray();
        StandardInput Input(double required) => new(h, null, radial, [], [], [], required, null, null, null, QaService.Core.Geodesy.Catalog.LinearUnit.Metre);
        double meanSquareE = SampleMoments.MeanSquareAboutZero(CheckValueVectors.SyntheticDE), meanSquareN = SampleMoments.MeanSquareAboutZero(CheckValueVectors.SyntheticDN);
        var (summaryClose, close) = StandardConfidence.Apply(NssdaProfile.Evaluate(Input(0.047)), Input(0.047), 0.9, true, meanSquareE, meanSquareN);
        Assert.True(close.Figures[0].Met);
        Assert.False(close.Figures[0].MetAtConfidence);
        Assert.NotNull(summaryClose.Horizontal!.PointsNeeded);
        Assert.True(summaryClose.Horizontal.PointsNeeded > 20);
        var (_, ample) = StandardConfidence.Apply(NssdaProfile.Evaluate(Input(0.06)), Input(0.06), 0.9, true, meanSquareE, meanSquareN);
        Assert.True(ample.Figures[0].MetAtConfidence);
    }
}
