using QaService.Core.Assessment;
using QaService.Core.Reporting;
using QaService.Core.Statistics;

namespace QaService.Core.Tests.Assessment;

/// <summary>api-v1 "verdict" definitions, case by case.</summary>
public sealed class VerdictRuleTests
{
    private static readonly HorizontalAccuracy Horizontal = HorizontalAccuracy.Compute([0.1, -0.1, 0.2], [0.1, 0.0, -0.1]);
    private static readonly VerticalAccuracy Vertical = VerticalAccuracy.Compute([0.1, -0.2, 0.1]);
    private static readonly CheckResult EnoughPoints = new("min-points", CheckStatus.Pass, "");
    private static readonly CheckResult TooFewPoints = new("min-points", CheckStatus.Fail, "");
    private static readonly CheckResult FailedOther = new("height-reference", CheckStatus.Fail, "");

    [Fact]
    public void Met_spec_passes() =>
        Assert.Equal(Verdict.Pass, VerdictRule.Decide(new RequiredAccuracy("nssda", 1.0, 1.0), Horizontal, Vertical, [EnoughPoints]).Verdict);

    [Fact]
    public void Exceeded_spec_fails() =>
        Assert.Equal(Verdict.Fail, VerdictRule.Decide(new RequiredAccuracy("nssda", 0.01, null), Horizontal, Vertical, [EnoughPoints]).Verdict);

    [Fact]
    public void Too_few_points_is_inconclusive_even_when_exceeded() =>
        Assert.Equal(Verdict.Inconclusive, VerdictRule.Decide(new RequiredAccuracy("nssda", 0.01, null), Horizontal, Vertical, [TooFewPoints]).Verdict);

    [Fact]
    public void No_spec_is_inconclusive() =>
        Assert.Equal(Verdict.Inconclusive, VerdictRule.Decide(null, Horizontal, Vertical, [EnoughPoints]).Verdict);

    [Fact]
    public void A_failed_check_stops_a_pass() =>
        Assert.Equal(Verdict.Inconclusive, VerdictRule.Decide(new RequiredAccuracy("nssda", 1.0, null), Horizontal, Vertical, [EnoughPoints, FailedOther]).Verdict);

    [Fact]
    public void A_vertical_spec_without_vertical_data_is_inconclusive() =>
        Assert.Equal(Verdict.Inconclusive, VerdictRule.Decide(new RequiredAccuracy("nssda", 1.0, 1.0), Horizontal, null, [EnoughPoints]).Verdict);

    private static QaService.Core.Standards.StandardResult Standard(bool met, bool? metAtConfidence) =>
        new("asprs-2023", "test", "test", 30,
            [new QaService.Core.Standards.StandardFigure("RMSE_H", "horizontal", 0.1, "m", 0.2, met, true, "") { UpperBound = 0.15, MetAtConfidence = metAtConfidence }], "", []);

    [Fact]
    public void Point_estimate_met_but_upper_bound_not_is_inconclusive() =>
        // Issue 5: with spec.confidence, pass only when the upper bound meets the spec; inconclusive when only the point estimate does.
        Assert.Equal(Verdict.Inconclusive, VerdictRule.Decide(new RequiredAccuracy("asprs-2023", 0.2, null, 0.9), Horizontal, Vertical, [EnoughPoints], Standard(true, false)).Verdict);

    [Fact]
    public void Upper_bound_met_passes() =>
        Assert.Equal(Verdict.Pass, VerdictRule.Decide(new RequiredAccuracy("asprs-2023", 0.2, null, 0.9), Horizontal, Vertical, [EnoughPoints], Standard(true, true)).Verdict);

    [Fact]
    public void Another_standard_is_judged_on_its_own_figures() =>
        Assert.Equal(Verdict.Fail, VerdictRule.Decide(new RequiredAccuracy("asprs-2023", 0.2, null), Horizontal, Vertical, [EnoughPoints], Standard(false, null)).Verdict);
}
