using Microsoft.AspNetCore.OpenApi;
using Microsoft.OpenApi;

namespace QaService.Api.OpenApi;

/// <summary>Adds the glossary description (with units) to every schema property that has none.</summary>
internal sealed class FieldDescriptionTransformer : IOpenApiSchemaTransformer
{
    public Task TransformAsync(OpenApiSchema schema, OpenApiSchemaTransformerContext context, CancellationToken cancellationToken)
    {
        if (schema.Properties is null)
            return Task.CompletedTask;
        foreach (var (name, property) in schema.Properties)
        {
            if (property is OpenApiSchema concrete && string.IsNullOrEmpty(concrete.Description)
                && FieldGlossary.Descriptions.TryGetValue(name, out var description))
                concrete.Description = description;
        }
        return Task.CompletedTask;
    }
}
