using System.Text.Json;
using System.Text.Json.Serialization;

namespace QaService.Core.Reporting;

/// <summary>
/// The one JSON shape of requests and reports (api-v1: camelCase, metres). Reading is strict:
/// unknown fields and repeated fields are errors, so a typo ("lng") is reported, never ignored.
/// </summary>
public static class ReportJson
{
    /// <summary>For writing reports: camelCase, nulls kept (a null <c>dU</c> means "no height").</summary>
    public static JsonSerializerOptions Write { get; } = Freeze(new JsonSerializerOptions(JsonSerializerDefaults.Web)
    {
        DefaultIgnoreCondition = JsonIgnoreCondition.Never,
    });

    /// <summary>For reading requests: case-sensitive camelCase, no unknown or duplicate properties, no comments.</summary>
    public static JsonSerializerOptions Read { get; } = Freeze(new JsonSerializerOptions(JsonSerializerDefaults.Web)
    {
        PropertyNameCaseInsensitive = false,
        UnmappedMemberHandling = JsonUnmappedMemberHandling.Disallow,
        AllowDuplicateProperties = false,
        NumberHandling = JsonNumberHandling.Strict,
        ReadCommentHandling = JsonCommentHandling.Disallow,
        AllowTrailingCommas = false,
    });

    private static JsonSerializerOptions Freeze(JsonSerializerOptions options)
    {
        options.MakeReadOnly(populateMissingResolver: true);
        return options;
    }
}
