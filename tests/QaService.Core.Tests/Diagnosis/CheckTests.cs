using QaService.Core.Assessment;
using QaService.Core.Diagnosis;
using QaService.Core.Reporting;

namespace QaService.Core.Tests.Diagnosis;

/// <summary>Each check on data built to trip it, and on data that must not.</summary>
public sealed class CheckTests
{
    private static CheckResult Run(IDataCheck check, CheckContext context) => check.Evaluate(context);

    [Theory]
    [InlineData(19, CheckStatus.Fail)]
    [InlineData(20, CheckStatus.Pass)]
    public void Min_points_follows_the_nssda_minimum_of_20(int count, CheckStatus expected)
    {
        // FGDC-STD-007.3-1998 §3.2.2: at least 20 check points (check-values.md §1, status M).
        var result = Run(new MinPointsCheck(), CheckContexts.From(CheckContexts.Normal(count, 0.02, 1)));
        Assert.Equal(expected, result.Status);
        Assert.Equal(count, result.Measured);
        Assert.Equal(20, result.Threshold);
    }

    [Fact]
    public void Bias_names_a_frame_mismatch_for_a_tight_metre_shift()
    {
        var result = Run(new BiasCheck(), CheckContexts.From(CheckContexts.Normal(24, 0.05, 2, offsetE: 0.9, offsetN: -1.2)));
        Assert.Equal(CheckStatus.Warn, result.Status);
        Assert.Contains("datum or frame mismatch", result.Message);
    }

    [Fact]
    public void Bias_is_quiet_on_zero_mean_data()
    {
        // Seeded data whose sample means are small against their standard errors: the t test must not fire.
        var data = CheckContexts.Normal(40, 0.05, 3);
        var centred = data.Select(r => (r.DE - data.Average(d => d.DE), r.DN - data.Average(d => d.DN), (double?)(r.DU!.Value - data.Average(d => d.DU!.Value)))).ToList();
        Assert.Equal(CheckStatus.Pass, Run(new BiasCheck(), CheckContexts.From(centred)).Status);
    }


    [Fact]
    public void Outliers_flags_a_planted_blunder_and_only_it()
    {
        // 25 clean residuals (largest |z| = Φ⁻¹(0.98) = 2.05) plus one blunder of 0.45 m east.
        var data = CheckContexts.Quantiles(25, 0.02);
        data[7] = (0.45, -0.30, 0.01);
        var result = Run(new OutlierCheck(), CheckContexts.From(data));
        Assert.Equal(CheckStatus.Warn, result.Status);
        Assert.Equal(["F07"], result.Items!);
    }

    [Fact]
    public void Outliers_is_quiet_on_clean_normal_data() =>
        Assert.Equal(CheckStatus.Pass, Run(new OutlierCheck(), CheckContexts.From(CheckContexts.Quantiles(25, 0.02))).Status);

    [Fact]
    public void Height_reference_fails_on_a_geoid_sized_offset() =>
        Assert.Equal(CheckStatus.Fail, Run(new HeightReferenceCheck(), CheckContexts.From(CheckContexts.Normal(20, 0.03, 7, offsetU: -47.3))).Status);

    [Fact]
    public void Height_reference_warns_on_an_antenna_sized_offset()
    {
        var result = Run(new HeightReferenceCheck(), CheckContexts.From(CheckContexts.Normal(20, 0.03, 8, offsetU: 2.0)));
        Assert.Equal(CheckStatus.Warn, result.Status);
        Assert.Contains("antenna height", result.Message);
    }

    [Fact]
    public void Height_reference_warns_when_heights_were_not_stated() =>
        Assert.Equal(CheckStatus.Warn, Run(new HeightReferenceCheck(), CheckContexts.From(CheckContexts.Normal(20, 0.03, 9), heightsStated: false)).Status);

    [Theory]
    [InlineData(0.005, CheckStatus.Pass)]
    [InlineData(0.05, CheckStatus.Warn)]
    public void Reference_accuracy_wants_marks_three_times_better(double sigmaMetres, CheckStatus expected)
    {
        // ASPRS Ed.1 (2014): check points at least 3× more accurate than the required accuracy (check-values.md §2, V).
        // Spec 0.10 m: 2.4477·0.005 = 0.012 m ≤ 0.033 m passes; 2.4477·0.05 = 0.122 m does not.
        var context = CheckContexts.From(CheckContexts.Normal(20, 0.02, 10), new RequiredAccuracy("nssda", 0.10, null), sigmaMetres);
        Assert.Equal(expected, Run(new ReferenceAccuracyCheck(), context).Status);
    }

    [Fact]
    public void Distribution_passes_on_a_grid_and_warns_on_a_cluster()
    {
        Assert.Equal(CheckStatus.Pass, Run(new DistributionCheck(), CheckContexts.From(CheckContexts.Normal(25, 0.02, 11))).Status);
        var clustered = CheckContexts.From(CheckContexts.Normal(3, 0.02, 12));
        Assert.Equal(CheckStatus.Warn, Run(new DistributionCheck(), clustered).Status);
    }
}
