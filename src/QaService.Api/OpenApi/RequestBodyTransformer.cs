using System.Net.Mime;
using Microsoft.AspNetCore.OpenApi;
using Microsoft.OpenApi;

namespace QaService.Api.OpenApi;

/// <summary>Documents the JSON request body of endpoints that carry <see cref="JsonRequestBody"/> metadata.</summary>
internal sealed class RequestBodyTransformer : IOpenApiOperationTransformer
{
    public async Task TransformAsync(OpenApiOperation operation, OpenApiOperationTransformerContext context, CancellationToken cancellationToken)
    {
        var body = context.Description.ActionDescriptor.EndpointMetadata.OfType<JsonRequestBody>().FirstOrDefault();
        if (body is null)
            return;
        var schema = await context.GetOrCreateSchemaAsync(body.BodyType, null, cancellationToken);
        operation.RequestBody = new OpenApiRequestBody
        {
            Required = true,
            Content = new Dictionary<string, OpenApiMediaType> { [MediaTypeNames.Application.Json] = new() { Schema = schema } },
        };
    }
}
