using Microsoft.AspNetCore.OpenApi;
using Microsoft.Extensions.Options;
using Microsoft.OpenApi;
using QaService.Api.Security;

namespace QaService.Api.OpenApi;

/// <summary>The document's info, servers, tag descriptions and the two bearer security schemes.</summary>
internal sealed class DocumentTransformer(IOptions<AuthOptions> auth) : IOpenApiDocumentTransformer
{
    public Task TransformAsync(OpenApiDocument document, OpenApiDocumentTransformerContext context, CancellationToken cancellationToken)
    {
        var keys = auth.Value.KeysRequired;
        document.Info.Title = "QaService";
        document.Info.Description =
            "Positional accuracy testing of GNSS field positions against surveyed check points (NSSDA, RMSE, CEP). Lengths in metres unless a field says otherwise. " +
            "Errors are RFC 9457 problem details (application/problem+json) with traceId, and for bad input errors[] of JSON pointers. " +
            (keys
                ? "This instance runs with Auth:Mode=keys: every /v1 call needs \"Authorization: Bearer <key>\"."
                : "This instance runs with Auth:Mode=none (one local tenant): no key is needed, and a bearer header is ignored; with Auth:Mode=keys every /v1 call needs \"Authorization: Bearer <key>\".");
        // No licence file ships with the repository: stated as proprietary (SPDX LicenseRef) until the owner names one.
        document.Info.License = new OpenApiLicense { Name = "Proprietary", Identifier = "LicenseRef-QaService-Proprietary" };
        document.Info.Contact = new OpenApiContact { Name = "QaService operators (the team that runs this instance)" };

        // Relative to where the document was fetched (OpenAPI 3.1 §4.8.5): right behind any proxy or host name, whereas the
        // framework's "http://host:port/" names the host as this request saw it (localhost in development).
        document.Servers = [new OpenApiServer { Url = "/", Description = "The host that serves this document." }];

        foreach (var tag in document.Tags ?? new HashSet<OpenApiTag>())
        {
            if (tag.Name is not null && TagDescriptions.All.TryGetValue(tag.Name, out var description))
                tag.Description = description;
        }

        document.Components ??= new OpenApiComponents();
        document.Components.SecuritySchemes ??= new Dictionary<string, IOpenApiSecurityScheme>();
        document.Components.SecuritySchemes[SecurityTransformer.BearerScheme] = new OpenApiSecurityScheme
        {
            Type = SecuritySchemeType.Http,
            Scheme = "bearer",
            Description = "\"Authorization: Bearer <token>\": a tenant's API key (qak_…, from POST /v1/admin/tenants) or a JWT of the caller's organisation where the service accepts one. " +
                "Needed on every /v1 call when Auth:Mode=keys (missing or wrong: 401 with a WWW-Authenticate: Bearer challenge). " +
                "With Auth:Mode=none (the local default) no key is needed: every call acts as the one local tenant.",
        };
        document.Components.SecuritySchemes[SecurityTransformer.AdminScheme] = new OpenApiSecurityScheme
        {
            Type = SecuritySchemeType.Http,
            Scheme = "bearer",
            Description = "\"Authorization: Bearer <Auth:AdminToken>\": the operator's admin token (≥ 32 characters) for /v1/admin/* in every Auth:Mode. " +
                "A tenant key there gets 403; without Auth:AdminToken configured the admin paths answer 404.",
        };
        return Task.CompletedTask;
    }
}
