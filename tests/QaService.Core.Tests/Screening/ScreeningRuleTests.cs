using QaService.Core.Screening;

namespace QaService.Core.Tests.Screening;

/// <summary>
/// Each screening rule with a fix that makes it fire and one that leaves it silent (invented scenario:
/// Harlow Fen District's asset app). Rules marked "common practice" have no standard behind their numbers;
/// the four-satellite floor follows from four unknowns (x, y, z, clock), and the expected autonomous error
/// from 2DRMS ≈ 2·HDOP·UERE(1σ) with the 15.7 m (95 %) C/A budget of GPS User Equipment Introduction Table 3-1.
/// </summary>
public sealed class ScreeningRuleTests
{
    private static readonly ScreeningThresholds Asset = ScreeningProfiles.Find("asset-inventory-sbas")!.Thresholds;
    private static readonly ScreeningThresholds Utility = ScreeningProfiles.Find("utility-locating-rtk")!.Thresholds;

    /// <summary>A fix every rule of the asset profile is silent on.</summary>
    private static readonly ScreeningFix Good = new("HF-1", "sbas", 12, 1.8, 0.9, 1.5, 0.6, 1.0, 8, 10);

    private static ScreeningResult Assess(ScreeningFix fix, ScreeningThresholds? t = null) => ScreeningRules.Evaluate(0, fix, t ?? Asset);

    [Fact]
    public void A_good_fix_is_accepted_with_no_reason_and_every_rule_checked()
    {
        var result = Assess(Good);
        Assert.Equal(ScreeningDecision.Accept, result.Decision);
        Assert.Empty(result.Reasons);
        Assert.Empty(result.NotChecked);
    }

    [Fact]
    public void Fewer_than_four_satellites_is_rejected_as_common_knowledge_of_the_3d_fix()
    {
        var result = Assess(Good with { Satellites = 3 });
        var reason = Assert.Single(result.Reasons);
        Assert.Equal(("satellites", ScreeningDecision.Reject), (reason.Rule, reason.Decision));
        Assert.Contains("3-D", reason.Message);
        Assert.Equal(ScreeningDecision.Reject, result.Decision);
    }

    [Fact]
    public void Few_satellites_above_four_are_flagged_as_common_practice()
    {
        var reason = Assert.Single(Assess(Good with { Satellites = 5 }).Reasons);
        Assert.Equal((ScreeningDecision.Flag, ScreeningRules.CommonPractice), (reason.Decision, reason.Basis));
    }

    [Fact]
    public void A_request_cannot_lower_the_floor_below_four() =>
        Assert.Equal(ScreeningDecision.Reject, Assess(Good with { Satellites = 3 }, ScreeningProfiles.Merge(Asset, new(MinimumSatellites: 2))).Decision);

    [Fact]
    public void Autonomous_fix_is_flagged_with_its_expected_error()
    {
        var result = Assess(Good with { Quality = "autonomous", Hdop = 1.0, CorrectionAge = null });
        Assert.Contains(result.Reasons, r => r.Rule == "quality" && r.Decision == ScreeningDecision.Flag && r.Message.Contains("5–10 m"));
        // 2 · 1.0 · 15.7 / 1.959964 = 16.02 m (hand arithmetic), above the 1 m flag limit.
        Assert.Equal(16.02, result.ExpectedHorizontalError!.Value, 0.01);
        Assert.Contains(result.Reasons, r => r.Rule == "expected-error" && r.Basis.Contains("common practice"));
    }

    [Fact]
    public void Expected_error_is_silent_when_within_the_profile()
    {
        var mapping = ScreeningProfiles.Find("mapping-autonomous")!.Thresholds;
        var result = ScreeningRules.Evaluate(0, Good with { Quality = "autonomous", Hdop = 0.6, CorrectionAge = null }, mapping);
        Assert.Equal(9.61, result.ExpectedHorizontalError!.Value, 0.01);
        Assert.DoesNotContain(result.Reasons, r => r.Rule == "expected-error");
    }

    [Fact]
    public void Utility_profile_rejects_sbas_flags_float_and_accepts_fixed()
    {
        var rtk = new ScreeningFix("U1", "rtk-fixed", 16, 1.6, 0.8, 1.3, 0.012, 0.02, 1.0, 15);
        Assert.Equal(ScreeningDecision.Accept, Assess(rtk, Utility).Decision);
        Assert.Equal(ScreeningDecision.Flag, Assess(rtk with { Quality = "rtk-float" }, Utility).Decision);
        Assert.Equal(ScreeningDecision.Reject, Assess(rtk with { Quality = "sbas" }, Utility).Decision);
    }

    [Theory]
    [InlineData("pdop")]
    [InlineData("hdop")]
    [InlineData("vdop")]
    public void Dops_above_the_profile_are_flagged(string rule)
    {
        var fix = rule switch { "pdop" => Good with { Pdop = 7 }, "hdop" => Good with { Hdop = 4.5 }, _ => Good with { Vdop = 6.5 } };
        var reason = Assert.Single(Assess(fix).Reasons);
        Assert.Equal((rule, ScreeningDecision.Flag), (reason.Rule, reason.Decision));
    }

    [Fact]
    public void Reported_errors_flag_then_reject()
    {
        Assert.Equal(ScreeningDecision.Flag, Assert.Single(Assess(Good with { HorizontalError = 1.5 }).Reasons).Decision);
        Assert.Equal(ScreeningDecision.Reject, Assert.Single(Assess(Good with { HorizontalError = 6 }).Reasons).Decision);
        Assert.Equal("vertical-error", Assert.Single(Assess(Good with { VerticalError = 2.5 }).Reasons).Rule);
    }

    [Fact]
    public void Old_corrections_flag_then_reject()
    {
        Assert.Equal(ScreeningDecision.Flag, Assert.Single(Assess(Good with { CorrectionAge = 90 }).Reasons).Decision);
        Assert.Equal(ScreeningDecision.Reject, Assert.Single(Assess(Good with { CorrectionAge = 400 }).Reasons).Decision);
    }

    [Fact]
    public void A_low_elevation_mask_is_flagged_for_atmospheric_delay()
    {
        var reason = Assert.Single(Assess(Good with { ElevationMask = 2 }).Reasons);
        Assert.Contains("ionospheric", reason.Message);
        Assert.Equal(ScreeningRules.CommonPractice, reason.Basis);
    }

    [Fact]
    public void Every_reason_is_listed_and_the_worst_decides()
    {
        var result = Assess(Good with { Satellites = 3, Hdop = 9, HorizontalError = 2 });
        Assert.Equal(3, result.Reasons.Count);
        Assert.Equal(ScreeningDecision.Reject, result.Decision);
    }

    [Fact]
    public void Missing_metadata_is_listed_as_not_checked()
    {
        var result = Assess(new ScreeningFix("bare"));
        Assert.Equal(ScreeningDecision.Accept, result.Decision);
        Assert.Contains("satellites", result.NotChecked);
        Assert.Contains("hdop", result.NotChecked);
    }

    [Fact]
    public void Request_overrides_replace_profile_values()
    {
        var strict = ScreeningProfiles.Merge(Asset, new(FlagHorizontalError: 0.5));
        Assert.Equal(ScreeningDecision.Flag, Assess(Good, strict).Decision);
    }

    [Fact]
    public void Bad_requests_are_errors_with_pointers()
    {
        var (report, errors) = FixScreening.Screen(new ScreeningRequest("no-such", new(MinimumSatellites: 2), [new ScreeningFix(Quality: "rtk"), new ScreeningFix(Hdop: -1)]));
        Assert.Null(report);
        Assert.Contains(errors, e => e.Pointer == "/profile");
        Assert.Contains(errors, e => e.Pointer == "/thresholds/minimumSatellites");
        Assert.Contains(errors, e => e.Pointer == "/fixes/0/quality");
        Assert.Contains(errors, e => e.Pointer == "/fixes/1/hdop");
    }
}
