using Microsoft.AspNetCore.Mvc;
using Microsoft.AspNetCore.OpenApi;
using Microsoft.OpenApi;

namespace QaService.Api.OpenApi;

/// <summary>
/// Describes the one error shape (RFC 9457 problem details as <c>InputProblems</c> and the ProblemDetails service
/// write them): the standard members plus <c>traceId</c> and, for bad input, <c>errors[{pointer, message}]</c>.
/// Replaces the framework's reflection of <see cref="ProblemDetails"/>, which knows nothing of the extensions.
/// </summary>
internal sealed class ProblemSchemaTransformer : IOpenApiSchemaTransformer
{
    public Task TransformAsync(OpenApiSchema schema, OpenApiSchemaTransformerContext context, CancellationToken cancellationToken)
    {
        if (context.JsonTypeInfo.Type != typeof(ProblemDetails))
            return Task.CompletedTask;
        schema.Description = "RFC 9457 problem details. Bad input (400) lists every offending item in errors, each with a JSON pointer into the request (or into a file part: /fixes/line/17/lat).";
        schema.Type = JsonSchemaType.Object;
        schema.Required = new HashSet<string> { "status", "title", "detail", "traceId" };
        schema.Properties = new Dictionary<string, IOpenApiSchema>
        {
            ["type"] = Text("URI reference that identifies the problem type."),
            ["title"] = Text("Short summary of the problem type."),
            ["status"] = new OpenApiSchema { Type = JsonSchemaType.Integer, Format = "int32", Description = "HTTP status code of this response." },
            ["detail"] = Text("What went wrong and what to do about it, for a person."),
            ["instance"] = Text("URI reference of this occurrence, when given."),
            ["traceId"] = Text("Correlation id of the request (X-Correlation-Id); quote it to find the request in the service's logs."),
            ["errors"] = new OpenApiSchema
            {
                Type = JsonSchemaType.Array,
                Description = "Bad input only: each offending item (at most 100; errorsNotListed counts the rest).",
                Items = new OpenApiSchema
                {
                    Type = JsonSchemaType.Object,
                    Required = new HashSet<string> { "pointer", "message" },
                    Properties = new Dictionary<string, IOpenApiSchema>
                    {
                        ["pointer"] = Text("JSON pointer (RFC 6901) to the item in the request, e.g. /fixes/points/17/lat; empty for the whole body."),
                        ["message"] = Text("What is wrong with it and how to fix it."),
                    },
                },
            },
            ["errorsNotListed"] = new OpenApiSchema { Type = JsonSchemaType.Integer, Format = "int32", Description = "How many further errors were found but not listed." },
        };
        return Task.CompletedTask;
    }

    private static OpenApiSchema Text(string description) => new() { Type = JsonSchemaType.String, Description = description };
}
