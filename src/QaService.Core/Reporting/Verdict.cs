using System.Text.Json.Serialization;

namespace QaService.Core.Reporting;

/// <summary>The report's overall answer (api-v1 "verdict").</summary>
[JsonConverter(typeof(JsonStringEnumConverter<Verdict>))]
public enum Verdict
{
    /// <summary>Every given spec figure is met and no check failed.</summary>
    [JsonStringEnumMemberName("pass")] Pass,
    /// <summary>A spec figure is exceeded.</summary>
    [JsonStringEnumMemberName("fail")] Fail,
    /// <summary>The data cannot support a claim (too few check points, no spec, a failed check).</summary>
    [JsonStringEnumMemberName("inconclusive")] Inconclusive,
}
