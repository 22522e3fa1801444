using System.Net.Mime;
using Microsoft.AspNetCore.OpenApi;
using Microsoft.OpenApi;

namespace QaService.Api.OpenApi;

/// <summary>
/// Documents the request bodies handlers read themselves: JSON (<see cref="JsonRequestBody"/>) and multipart
/// (<see cref="MultipartRequestBody"/>), with the multipart parts' encodings.
/// </summary>
internal sealed class RequestBodyTransformer : IOpenApiOperationTransformer
{
    /// <summary>Media types a field file part may declare; the service recognises the format from the content, not from this.</summary>
    public const string FieldFileMediaTypes = "text/csv, application/geo+json, application/gpx+xml, text/plain, application/octet-stream";

    public async Task TransformAsync(OpenApiOperation operation, OpenApiOperationTransformerContext context, CancellationToken cancellationToken)
    {
        var metadata = context.Description.ActionDescriptor.EndpointMetadata;
        var json = metadata.OfType<JsonRequestBody>().FirstOrDefault();
        var multipart = metadata.OfType<MultipartRequestBody>().FirstOrDefault();
        if (json is null && multipart is null)
            return;
        var content = new Dictionary<string, OpenApiMediaType>();
        if (json is not null)
            content[MediaTypeNames.Application.Json] = new() { Schema = await context.GetOrCreateSchemaAsync(json.BodyType, null, cancellationToken) };
        if (multipart is not null)
            content[MediaTypeNames.Multipart.FormData] = await MultipartAsync(multipart, context, cancellationToken);
        operation.RequestBody = new OpenApiRequestBody { Required = true, Content = content };
    }

    private static async Task<OpenApiMediaType> MultipartAsync(MultipartRequestBody body, OpenApiOperationTransformerContext context, CancellationToken cancellationToken)
    {
        var options = await context.GetOrCreateSchemaAsync(body.OptionsType, null, cancellationToken);
        var properties = new Dictionary<string, IOpenApiSchema> { [body.OptionsPart] = options };
        var encoding = new Dictionary<string, OpenApiEncoding> { [body.OptionsPart] = new() { ContentType = MediaTypeNames.Application.Json } };
        foreach (var part in body.FileParts)
        {
            properties[part] = new OpenApiSchema { Type = JsonSchemaType.String, Format = "binary", Description = body.FileDescription };
            encoding[part] = new OpenApiEncoding { ContentType = FieldFileMediaTypes };
        }
        return new OpenApiMediaType
        {
            Schema = new OpenApiSchema
            {
                Type = JsonSchemaType.Object,
                Description = $"Part \"{body.OptionsPart}\": the JSON request without points (optional); file parts: {string.Join(", ", body.FileParts.Select(p => $"\"{p}\""))} (required).",
                Required = new HashSet<string>(body.FileParts),
                Properties = properties,
            },
            Encoding = encoding,
        };
    }
}
