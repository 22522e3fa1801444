using System.Text.Json.Serialization;

namespace QaService.Api.OpenApi;

/// <summary>The OpenAPI document (/openapi/v1.json) and its transformers, registered in one place.</summary>
internal static class OpenApiSetup
{
    public static IServiceCollection AddQaServiceOpenApi(this IServiceCollection services)
    {
        // The schema generator reflects these options. Requests are read with ReportJson.Read (numbers must be JSON
        // numbers) and responses write numbers, so the web default "number or numeric string" would mislead clients.
        services.ConfigureHttpJsonOptions(options => options.SerializerOptions.NumberHandling = JsonNumberHandling.Strict);
        return services.AddOpenApi(options =>
        {
            options.AddSchemaTransformer<FieldDescriptionTransformer>();
            options.AddSchemaTransformer<ProblemSchemaTransformer>();
            options.AddOperationTransformer<RequestBodyTransformer>();
            options.AddOperationTransformer<SecurityTransformer>();
            options.AddDocumentTransformer<DocumentTransformer>();
        });
    }
}
