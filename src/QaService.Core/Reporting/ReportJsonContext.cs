using System.Text.Json;
using System.Text.Json.Serialization;

namespace QaService.Core.Reporting;

/// <summary>
/// Compile-time JSON metadata and writers for the report (System.Text.Json source generation), so writing a
/// 400,000-residual report neither builds its metadata by reflection on a fresh service nor goes through the
/// generic converters per residual. The options here must equal <see cref="ReportJson.Write"/>'s (web defaults:
/// camelCase; nulls written), or the serializer falls back to the slower path; the output is the same bytes either way.
/// </summary>
[JsonSourceGenerationOptions(JsonSerializerDefaults.Web, DefaultIgnoreCondition = JsonIgnoreCondition.Never)]
[JsonSerializable(typeof(AssessmentReport))]
[JsonSerializable(typeof(Verdict))]
internal sealed partial class ReportJsonContext : JsonSerializerContext;
