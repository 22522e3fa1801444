namespace QaService.Api.OpenApi;

/// <summary>The OpenAPI document (/openapi/v1.json) and its transformers, registered in one place.</summary>
internal static class OpenApiSetup
{
    public static IServiceCollection AddQaServiceOpenApi(this IServiceCollection services) =>
        services.AddOpenApi(options =>
        {
            options.AddSchemaTransformer<FieldDescriptionTransformer>();
            options.AddSchemaTransformer<ProblemSchemaTransformer>();
            options.AddOperationTransformer<RequestBodyTransformer>();
            options.AddOperationTransformer<SecurityTransformer>();
            options.AddDocumentTransformer<DocumentTransformer>();
        });
}
