using System.Text.Json.Serialization;

namespace QaService.Core.Screening;

/// <summary>What to do with a fix.</summary>
[JsonConverter(typeof(JsonStringEnumConverter<ScreeningDecision>))]
public enum ScreeningDecision
{
    [JsonStringEnumMemberName("accept")] Accept,
    [JsonStringEnumMemberName("flag")] Flag,
    [JsonStringEnumMemberName("reject")] Reject,
}

/// <summary>One rule that fired on a fix.</summary>
/// <param name="Rule">Rule id, e.g. <c>satellites</c>.</param>
/// <param name="Decision">flag or reject.</param>
/// <param name="Message">What was found, in words a field crew can act on.</param>
/// <param name="Measured">The fix's value.</param>
/// <param name="Threshold">The limit it crossed.</param>
/// <param name="Unit">Unit of measured and threshold.</param>
/// <param name="Basis">Where the rule comes from: a cited source, or "common practice".</param>
public sealed record ScreeningReason(string Rule, ScreeningDecision Decision, string Message, double? Measured, double? Threshold, string? Unit, string Basis);

/// <summary>The decision on one fix with every reason.</summary>
/// <param name="Index">Position in the request's fixes array.</param>
/// <param name="Id">The fix id, when given.</param>
/// <param name="Decision">Worst decision of its reasons; accept when none fired.</param>
/// <param name="Reasons">Every rule that fired.</param>
/// <param name="ExpectedHorizontalError">Autonomous fixes: expected 2DRMS horizontal error from HDOP and the UERE budget, metres.</param>
/// <param name="NotChecked">Rules that could not run because the fix lacks their input.</param>
/// <param name="Calibration">With a calibration: which entry the expected error used (receiver, fix type, ratio, pairs), or why the profile's rule was used instead.</param>
public sealed record ScreeningResult(int Index, string? Id, ScreeningDecision Decision, IReadOnlyList<ScreeningReason> Reasons, double? ExpectedHorizontalError,
    IReadOnlyList<string> NotChecked,
    [property: JsonIgnore(Condition = JsonIgnoreCondition.WhenWritingNull)] string? Calibration = null);

/// <summary>The response: the profile used (after overrides), counts and a result per fix in request order.</summary>
/// <param name="Calibration">The calibration the expected-error rule used; left out without one.</param>
public sealed record ScreeningReport(string Profile, ScreeningThresholds Thresholds, int Accepted, int Flagged, int Rejected, IReadOnlyList<ScreeningResult> Results,
    [property: JsonIgnore(Condition = JsonIgnoreCondition.WhenWritingNull)] ReceiverCalibration? Calibration = null);
