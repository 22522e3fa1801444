namespace QaService.Api.OpenApi;

/// <summary>
/// Endpoint metadata: the handler also reads <c>multipart/form-data</c> itself (streaming the file parts to disk),
/// so the OpenAPI document is told its parts here: one JSON part of <paramref name="OptionsType"/> and the file parts.
/// </summary>
/// <param name="OptionsPart">Name of the JSON part (optional in the request).</param>
/// <param name="FileParts">Names of the required file parts.</param>
/// <param name="FileDescription">What the file parts may hold.</param>
internal sealed record MultipartRequestBody(string OptionsPart, Type OptionsType, IReadOnlyList<string> FileParts, string FileDescription);
