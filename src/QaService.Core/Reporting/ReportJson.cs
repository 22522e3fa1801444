using System.Text.Json;
using System.Text.Json.Serialization;
using System.Text.Json.Serialization.Metadata;

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
        // Report types from generated code (same output, no reflection); anything else as before.
        TypeInfoResolver = JsonTypeInfoResolver.Combine(ReportJsonContext.Default, new DefaultJsonTypeInfoResolver()),
        // Here, not as an attribute on Residual: the OpenAPI documents describe Residual's fields from its properties.
        Converters = { new ResidualJsonConverter() },
    });

    /// <summary>For reading stored reports back: lenient (fields from other builds are skipped), residuals in any number form.</summary>
    public static JsonSerializerOptions StoredReport { get; } = Freeze(new JsonSerializerOptions(JsonSerializerDefaults.Web)
    {
        Converters = { new ResidualJsonConverter() },
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
        MaxDepth = MaximumRequestDepth,
        // The points of a transform batch and of an assessment by hand (same strictness; see the converters), the rest by the serializer.
        Converters = { new Transform.TransformPointJsonConverter(), new Assessment.PointRecordJsonConverter() },
    });

    /// <summary>
    /// Deepest nesting a request may have. The deepest real field (<c>/fixes/points/0/lat</c>) is 4 levels
    /// down, multipart options a few more; 16 leaves room and stops deeply nested bodies early (System.Text.Json's default is 64).
    /// </summary>
    public const int MaximumRequestDepth = 16;

    private static JsonSerializerOptions Freeze(JsonSerializerOptions options)
    {
        options.MakeReadOnly(populateMissingResolver: true);
        return options;
    }
}
