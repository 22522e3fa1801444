using Microsoft.AspNetCore.Mvc;
using Microsoft.AspNetCore.OpenApi;
using Microsoft.Extensions.Options;
using Microsoft.OpenApi;
using QaService.Api.Security;

namespace QaService.Api.OpenApi;

/// <summary>
/// What the middleware does to every <c>/v1</c> path, said once here rather than on each endpoint:
/// <c>TenantResolutionMiddleware</c> asks for a bearer key (401) or, under <c>/v1/admin</c>, the admin token
/// (401, and 403 for a tenant key); the rate limiter answers 429; the request timeout answers 503 (everywhere).
/// Paths outside <c>/v1</c> pass the middleware without a key and are marked public (<c>security: []</c>).
/// </summary>
internal sealed class SecurityTransformer(IOptions<AuthOptions> auth) : IOpenApiOperationTransformer
{
    public const string BearerScheme = "bearer", AdminScheme = "adminToken", ProblemSchema = "ProblemDetails";

    public async Task TransformAsync(OpenApiOperation operation, OpenApiOperationTransformerContext context, CancellationToken cancellationToken)
    {
        var path = "/" + (context.Description.RelativePath ?? "").TrimStart('/');
        var document = context.Document;
        // Registers the problem schema as a component even for an operation that declares no problem itself.
        await context.GetOrCreateSchemaAsync(typeof(ProblemDetails), null, cancellationToken);
        operation.Responses ??= new OpenApiResponses();
        operation.Security = [];
        if (IsUnder(path, "/v1/admin"))
        {
            operation.Security.Add(Requirement(AdminScheme, document));
            AddProblem(operation, document, StatusCodes.Status401Unauthorized, "Missing or wrong admin token (WWW-Authenticate: Bearer challenge).");
            AddProblem(operation, document, StatusCodes.Status403Forbidden, "A tenant key was sent: tenants cannot manage tenants.");
            AddProblem(operation, document, StatusCodes.Status404NotFound, "Admin paths are disabled (Auth:AdminToken not set).");
        }
        else if (IsUnder(path, "/v1"))
        {
            operation.Security.Add(Requirement(BearerScheme, document));
            if (!auth.Value.KeysRequired)
                operation.Security.Add(new OpenApiSecurityRequirement()); // Auth:Mode=none: calling without a key is allowed too.
            AddProblem(operation, document, StatusCodes.Status401Unauthorized, "Auth:Mode=keys: the bearer key is missing or not valid (WWW-Authenticate: Bearer challenge).");
        }
        if (IsUnder(path, "/v1"))
            AddProblem(operation, document, StatusCodes.Status429TooManyRequests, "More requests in the window than Limits:RateLimitPermits for this key (or client address); see Retry-After.");
        AddProblem(operation, document, StatusCodes.Status503ServiceUnavailable, "The request ran longer than Limits:RequestTimeoutSeconds and was cancelled.");
    }

    private static bool IsUnder(string path, string root) =>
        path.Equals(root, StringComparison.OrdinalIgnoreCase) || path.StartsWith(root + "/", StringComparison.OrdinalIgnoreCase);

    private static OpenApiSecurityRequirement Requirement(string scheme, OpenApiDocument? document) =>
        new() { [new OpenApiSecuritySchemeReference(scheme, document)] = [] };

    /// <summary>Adds a problem response unless the endpoint declared that status itself (its own declaration wins).</summary>
    public static void AddProblem(OpenApiOperation operation, OpenApiDocument? document, int status, string description)
    {
        var key = status.ToString(System.Globalization.CultureInfo.InvariantCulture);
        if (operation.Responses!.ContainsKey(key))
            return;
        operation.Responses[key] = new OpenApiResponse
        {
            Description = description,
            Content = new Dictionary<string, OpenApiMediaType>
            {
                ["application/problem+json"] = new() { Schema = new OpenApiSchemaReference(ProblemSchema, document) },
            },
        };
    }
}
