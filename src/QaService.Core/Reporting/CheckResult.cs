using System.Text.Json.Serialization;

namespace QaService.Core.Reporting;

/// <summary>Outcome of one check.</summary>
[JsonConverter(typeof(JsonStringEnumConverter<CheckStatus>))]
public enum CheckStatus
{
    [JsonStringEnumMemberName("pass")] Pass,
    [JsonStringEnumMemberName("warn")] Warn,
    [JsonStringEnumMemberName("fail")] Fail,
}

/// <summary>
/// A finding about the data (api-v1 "checks"): data in the report, not an error of the request.
/// </summary>
/// <param name="Id">Stable check id, e.g. <c>min-points</c>.</param>
/// <param name="Status">pass, warn or fail.</param>
/// <param name="Message">What was found, in words a QA lead can act on.</param>
/// <param name="Measured">The measured quantity, when the check has one.</param>
/// <param name="Threshold">The limit it was compared with.</param>
/// <param name="Unit">Unit of <paramref name="Measured"/> and <paramref name="Threshold"/>.</param>
/// <param name="Items">Ids of the fixes or marks the finding is about, when it points at some.</param>
public sealed record CheckResult(
    string Id,
    CheckStatus Status,
    string Message,
    double? Measured = null,
    double? Threshold = null,
    string? Unit = null,
    IReadOnlyList<string>? Items = null);
