using System.Security.Claims;
using Microsoft.AspNetCore.Antiforgery;
using Microsoft.AspNetCore.Authentication;
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
/// A bearer value is an API key, or with <c>Auth:Jwt:Authority</c> set a JWT whose <c>Auth:Jwt:TenantClaim</c> names
/// an existing tenant. Without a bearer value a signed-in browser's session cookie counts: on every page outside
/// <c>/v1</c> and on safe (GET/HEAD) <c>/v1</c> calls; a state-changing <c>/v1</c> call made with the cookie also
/// needs the antiforgery token in <see cref="PeopleAuthentication.AntiforgeryHeader"/>, so a page on another site
/// cannot act with a visitor's session.
/// </summary>
internal sealed class TenantResolutionMiddleware(RequestDelegate next, IOptions<AuthOptions> options, ITenantStore tenants, IAntiforgery antiforgery)
{
    private static readonly PathString ApiRoot = "/v1";
    private static readonly PathString AdminRoot = "/v1/admin";
    private static readonly PathString GuidedUploadRoot = Upload.GuidedUploadApi.Root;

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
            // Pages (/, /ui/*): a signed-in browser is its tenant; anyone else gets pages without tenant data.
            if (await PeopleAuthentication.SessionAsync(context) is { } page)
            {
                context.User = page.Principal;
                await ContinueAsAsync(context, new TenantFeature(page.TenantId, IsAdmin: false));
                return;
            }
            await next(context);
            return;
        }

        var token = ApiKeys.BearerToken(context.Request, auth.Jwt.Enabled ? ApiKeys.MaximumJwtLength : ApiKeys.MaximumPresentedLength);
        if (token is null)
        {
            await SessionOrRejectAsync(context);
            return;
        }
        var tenant = auth.Jwt.Enabled && ApiKeys.LooksLikeJwt(token)
            ? await FromJwtAsync(context, auth.Jwt)
            : await ApiKeys.FindTenantAsync(tenants, token, context.RequestAborted);
        if (tenant is null)
        {
            await RejectAsync(context, StatusCodes.Status401Unauthorized, "Authentication failed",
                auth.Jwt.Enabled
                    ? "the API key or token is not valid (a token must be signed by Auth:Jwt:Authority, be for Auth:Jwt:Audience, be unexpired and name an existing tenant in its tenant claim)"
                    : "the API key is not valid; ask the service's administrator for a key", ", error=\"invalid_token\"");
            return;
        }
        await ContinueAsAsync(context, new TenantFeature(tenant.Id, IsAdmin: false));
    }

    /// <summary>No bearer value on /v1: a session cookie counts for reading, and for changing only with the antiforgery header.</summary>
    private async Task SessionOrRejectAsync(HttpContext context)
    {
        var session = await PeopleAuthentication.SessionAsync(context);
        if (session is { } signedIn)
        {
            context.User = signedIn.Principal;
            var method = context.Request.Method;
            bool safe = HttpMethods.IsGet(method) || HttpMethods.IsHead(method) || HttpMethods.IsOptions(method);
            // Header checked first: without it antiforgery would read a form body, which this must never do here. The
            // guided upload's pages post ordinary forms and check their token themselves (GuidedUploadApi.Refused).
            if (safe || context.Request.Path.StartsWithSegments(GuidedUploadRoot)
                || (context.Request.Headers.ContainsKey(PeopleAuthentication.AntiforgeryHeader) && await antiforgery.IsRequestValidAsync(context)))
            {
                await ContinueAsAsync(context, new TenantFeature(signedIn.TenantId, IsAdmin: false));
                return;
            }
            await RejectAsync(context, StatusCodes.Status401Unauthorized, "Authentication required",
                $"a browser session may change data under /v1 only with a valid antiforgery token in {PeopleAuthentication.AntiforgeryHeader}; API clients send \"Authorization: Bearer <key>\"", "");
            return;
        }
        await RejectAsync(context, StatusCodes.Status401Unauthorized, "Authentication required",
            "send the tenant's API key as \"Authorization: Bearer <key>\" (Auth:Mode is keys), or sign in at / with a browser", "");
    }

    /// <summary>The tenant named by a valid JWT's tenant claim (the tenant's name, exactly), or null.</summary>
    private async Task<StoredTenant?> FromJwtAsync(HttpContext context, JwtOptions jwt)
    {
        var result = await context.AuthenticateAsync(PeopleAuthentication.JwtScheme);
        if (!result.Succeeded || result.Principal.FindFirstValue(jwt.TenantClaim) is not { Length: > 0 and <= AdminApi.MaximumNameLength } name)
            return null;
        context.User = result.Principal;
        return await tenants.FindByNameAsync(name, context.RequestAborted);
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
        if (token is not null && await ApiKeys.FindTenantAsync(tenants, token, context.RequestAborted) is not null)
        {
            await RejectAsync(context, StatusCodes.Status403Forbidden, "Forbidden",
                "a tenant key cannot manage tenants; use the admin token (Auth:AdminToken)", null);
            return;
        }
        await RejectAsync(context, StatusCodes.Status401Unauthorized, "Authentication required",
            "send the admin token (Auth:AdminToken) as \"Authorization: Bearer <token>\"", token is null ? "" : ", error=\"invalid_token\"");
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
