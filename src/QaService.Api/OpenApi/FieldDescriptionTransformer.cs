using Microsoft.AspNetCore.OpenApi;
using Microsoft.OpenApi;

namespace QaService.Api.OpenApi;

/// <summary>
/// Sets the glossary description (with units) on every schema property the glossary knows; the glossary
/// wins over XML doc text so every contract field reads the same way, with its unit.
/// </summary>
internal sealed class FieldDescriptionTransformer : IOpenApiSchemaTransformer
{
    public Task TransformAsync(OpenApiSchema schema, OpenApiSchemaTransformerContext context, CancellationToken cancellationToken)
    {
        if (schema.Properties is null)
            return Task.CompletedTask;
        foreach (var (name, property) in schema.Properties)
        {
            if (property is OpenApiSchema concrete
                && FieldGlossary.Descriptions.TryGetValue(name, out var description))
                concrete.Description = description;
        }
        return Task.CompletedTask;
    }
}
