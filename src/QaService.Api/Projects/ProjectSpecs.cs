using System.Text.Json;
using QaService.Api.Assessments;
using QaService.Core.Assessment;
using QaService.Core.Reporting;

namespace QaService.Api.Projects;

/// <summary>
/// A project's spec is kept as the JSON the client sent and read into the assessment request's own
/// <see cref="AccuracySpec"/> (strictly, as a request is read) whenever it is checked or applied, so whatever that type
/// and <see cref="RequestValidator.ValidateSpec"/> know (every field, every rule) holds for projects too.
/// </summary>
internal static class ProjectSpecs
{
    /// <summary>The spec, or an error pointing under <paramref name="pointer"/>.</summary>
    public static (AccuracySpec? Spec, InputError? Error) Parse(JsonElement json, string pointer)
    {
        if (json.ValueKind != JsonValueKind.Object)
            return (null, new InputError(pointer, "\"spec\" must be an object, as an assessment request's spec: {\"standard\": \"nssda\", \"horizontal\": 0.5}"));
        try
        {
            var spec = json.Deserialize<AccuracySpec>(ReportJson.Read)!;
            return (spec, null);
        }
        catch (JsonException exception)
        {
            var where = pointer + JsonBodyReader<AccuracySpec>.ToPointer(exception.Path);
            var message = exception.Message.Contains("could not be mapped", StringComparison.Ordinal)
                ? "not a field of spec: the fields are those of an assessment request's spec"
                : "the value has the wrong type: requirements are JSON numbers (metres), the standard a string";
            return (null, new InputError(where, message));
        }
    }

    /// <summary>A stored spec (checked when it was stored).</summary>
    public static AccuracySpec Read(string storedJson)
    {
        using var document = JsonDocument.Parse(storedJson);
        var (spec, error) = Parse(document.RootElement, "/spec");
        return spec ?? throw new InvalidOperationException($"a stored project spec no longer reads: {error!.Pointer} {error.Message}");
    }
}
