using Microsoft.Extensions.Options;
using QaService.Api.Problems;
using QaService.Api.Storage;
using Serilog.Context;

namespace QaService.Api.Security;

/// <summary>
/// Decides who calls (api-v1 "Tenants and keys"): with <c>Auth:Mode</c> = <c>none</c> every request
/// is the local tenant; with <c>keys</c> every <c>/v1/*</c> call needs a tenant's Bearer key (401
/// otherwise), and <c>/v1/admin/*</c> needs the admin token (a tenant key there gets 403; without an
/// admin token configured the admin paths do not exist).
/// </summary>
internal sealed class TenantResolutionMiddleware(RequestDelegate next, IOptions<AuthOptions> options, ITenantStore tenants)
{
    private static readonly PathString ApiRoot = "/v1";
    private static readonly PathString AdminRoot = "/v1/admin";

    public async Task InvokeAsync(HttpContext context)
    {
        var auth = options.Value;
        var path = context.Request.Path;
        if (path.StartsWithSegments(AdminRoot))
        {
            await AdminAsync(context, auth);
            return;
        }
        if (!auth.KeysRequired)
        {
            await ContinueAsAsync(context, new TenantFeature(Tenants.Local, IsAdmin: false));
            return;
        }
        if (!path.StartsWithSegments(ApiRoot))
        {
            await next(context);
            return;
        }

        var key = ApiKeys.BearerToken(context.Request);
        if (key is null)
        {
            await RejectAsync(context, StatusCodes.Status401Unauthorized, "Authentication required",
                "send the tenant's API key as \"Authorization: Bearer <key>\" (Auth:Mode is keys)", "");
            return;
        }
        var tenant = await FindTenantAsync(key, context.RequestAborted);
        if (tenant is null)
        {
            await RejectAsync(context, StatusCodes.Status401Unauthorized, "Authentication failed",
                "the API key is not valid; ask the service's administrator for a key", ", error=\"invalid_token\"");
            return;
        }
        await ContinueAsAsync(context, new TenantFeature(tenant.Id, IsAdmin: false));
    }

    private async Task AdminAsync(HttpContext context, AuthOptions auth)
    {
        if (!auth.AdminEnabled)
        {
            await RejectAsync(context, StatusCodes.Status404NotFound, "Not found",
                "the admin paths are disabled: set Auth:AdminToken to enable them", null);
            return;
        }
        var token = ApiKeys.BearerToken(context.Request);
        if (token is not null && ApiKeys.SecretEquals(token, auth.AdminToken!))
        {
            await ContinueAsAsync(context, new TenantFeature("admin", IsAdmin: true));
            return;
        }
        if (token is not null && await FindTenantAsync(token, context.RequestAborted) is not null)
        {
            await RejectAsync(context, StatusCodes.Status403Forbidden, "Forbidden",
                "a tenant key cannot manage tenants; use the admin token (Auth:AdminToken)", null);
            return;
        }
        await RejectAsync(context, StatusCodes.Status401Unauthorized, "Authentication required",
            "send the admin token (Auth:AdminToken) as \"Authorization: Bearer <token>\"", token is null ? "" : ", error=\"invalid_token\"");
    }

    private async Task<StoredTenant?> FindTenantAsync(string key, CancellationToken cancellationToken)
    {
        var hash = ApiKeys.Hash(key);
        var tenant = await tenants.FindByKeyHashAsync(hash, cancellationToken);
        // The lookup is by hash; the stored hash is compared again in constant time before it counts.
        return tenant is not null && ApiKeys.HashEquals(hash, tenant.KeyHash) ? tenant : null;
    }

    private async Task ContinueAsAsync(HttpContext context, TenantFeature tenant)
    {
        context.Features.Set(tenant);
        using (LogContext.PushProperty("Tenant", tenant.TenantId))
            await next(context);
    }

    /// <param name="challengeSuffix">null: no WWW-Authenticate header; otherwise appended to the Bearer challenge (RFC 6750 §3).</param>
    private static Task RejectAsync(HttpContext context, int status, string title, string detail, string? challengeSuffix)
    {
        if (challengeSuffix is not null)
            context.Response.Headers.WWWAuthenticate = $"Bearer realm=\"qaservice\"{challengeSuffix}";
        return InputProblems.Status(status, title, detail).ExecuteAsync(context);
    }
}
