using System.Text.Json;
using QaService.Core.Assessment;

namespace QaService.Core.Projects;

/// <summary>
/// A project (a contract whose deliveries are tested against one spec) as sent to <c>POST /v1/projects</c>.
/// <paramref name="Spec"/> is kept as the client's JSON and read into the assessment request's own
/// <see cref="AccuracySpec"/> wherever it is used, so every field that type knows is validated and applied alike.
/// </summary>
/// <param name="Name">The project's name, e.g. the contract.</param>
/// <param name="Spec">Required accuracy, the same object as an assessment request's <c>spec</c>.</param>
public sealed record ProjectRequest(string? Name = null, JsonElement? Spec = null);

/// <summary>Checks a project's name (its spec goes through <see cref="RequestValidator.ValidateSpec"/>).</summary>
public static class ProjectNames
{
    /// <summary>Longest name, characters (as a report title).</summary>
    public const int MaximumLength = RequestValidator.MaximumTextLength;

    /// <summary>The trimmed name, or an error pointing at <c>/name</c>.</summary>
    public static (string? Name, InputError? Error) Read(string? name)
    {
        var trimmed = name?.Trim();
        if (string.IsNullOrEmpty(trimmed))
            return (null, new InputError("/name", "\"name\" is required: what the project (contract) is called"));
        if (trimmed.Length > MaximumLength)
            return (null, new InputError("/name", $"\"name\" is longer than {MaximumLength} characters"));
        if (trimmed.Any(char.IsControl))
            return (null, new InputError("/name", "\"name\" must be one line of text without control characters"));
        return (trimmed, null);
    }
}
