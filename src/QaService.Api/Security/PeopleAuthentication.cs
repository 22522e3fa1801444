using System.Security.Claims;
using Microsoft.AspNetCore.Authentication;
using Microsoft.AspNetCore.Authentication.Cookies;
using Microsoft.AspNetCore.Authentication.JwtBearer;

namespace QaService.Api.Security;

/// <summary>
/// ASP.NET Core authentication for people and organisations beside API keys: a session cookie after a browser signs
/// in with a key (<c>/ui/sign-in</c>), and JWT bearer tokens from an OpenID Connect provider. Neither is a default
/// scheme: <see cref="TenantResolutionMiddleware"/> asks each scheme explicitly and turns the result into the tenant.
/// </summary>
internal static class PeopleAuthentication
{
    public const string SessionScheme = "QaSession";
    public const string JwtScheme = "QaJwt";

    /// <summary>Session cookie name (no "ASP.NET" in it: nothing to fingerprint).</summary>
    public const string SessionCookie = "qaservice_session";

    /// <summary>Claim of the session principal holding the tenant id.</summary>
    public const string TenantClaim = "qaservice:tenant";

    /// <summary>Header that carries the antiforgery request token on state-changing /v1 calls made with the cookie.</summary>
    public const string AntiforgeryHeader = "X-QaService-Antiforgery";

    public static IServiceCollection AddPeopleAuthentication(this IServiceCollection services, AuthOptions auth)
    {
        var builder = services.AddAuthentication()
            .AddCookie(SessionScheme, options =>
            {
                options.Cookie.Name = SessionCookie;
                options.Cookie.HttpOnly = true;
                options.Cookie.SameSite = SameSiteMode.Lax;
                // Secure whenever the request came over HTTPS (behind a TLS proxy: forward the scheme).
                options.Cookie.SecurePolicy = CookieSecurePolicy.SameAsRequest;
                options.ExpireTimeSpan = TimeSpan.FromHours(auth.SessionHours);
                options.SlidingExpiration = true;
                // Never a redirect: the middleware answers 401 problems for /v1 and the sign-in form for pages.
                options.Events.OnRedirectToLogin = context => { context.Response.StatusCode = StatusCodes.Status401Unauthorized; return Task.CompletedTask; };
                options.Events.OnRedirectToAccessDenied = context => { context.Response.StatusCode = StatusCodes.Status403Forbidden; return Task.CompletedTask; };
            });
        if (auth.Jwt.Enabled)
        {
            builder.AddJwtBearer(JwtScheme, options =>
            {
                options.Authority = auth.Jwt.Authority;
                options.Audience = auth.Jwt.Audience;
                options.RequireHttpsMetadata = auth.Jwt.RequireHttpsMetadata;
                // Claim names as the provider wrote them, so Auth:Jwt:TenantClaim is found under its own name.
                options.MapInboundClaims = false;
                options.TokenValidationParameters.ValidateIssuer = true;
                options.TokenValidationParameters.ValidateAudience = true;
                options.TokenValidationParameters.ValidateLifetime = true;
                options.TokenValidationParameters.RequireExpirationTime = true;
                options.TokenValidationParameters.ClockSkew = TimeSpan.FromMinutes(1);
            });
        }

        DatabaseKeyRing.Register(services);
        services.AddAntiforgery(options =>
        {
            options.HeaderName = AntiforgeryHeader;
            options.Cookie.Name = "qaservice_antiforgery";
            options.Cookie.SameSite = SameSiteMode.Strict;
            options.Cookie.SecurePolicy = CookieSecurePolicy.SameAsRequest;
            // SecurityHeadersMiddleware sends X-Frame-Options: DENY on every answer already.
            options.SuppressXFrameOptionsHeader = true;
        });
        return services;
    }

    /// <summary>The principal a session cookie carries: the tenant id (also as NameIdentifier, which antiforgery binds its tokens to) and name.</summary>
    public static ClaimsPrincipal SessionPrincipal(string tenantId, string tenantName) =>
        new(new ClaimsIdentity(
            [new Claim(ClaimTypes.NameIdentifier, tenantId), new Claim(TenantClaim, tenantId), new Claim(ClaimTypes.Name, tenantName)],
            SessionScheme));

    /// <summary>The tenant id of a valid session cookie on this request, or null (no cookie, expired, tampered).</summary>
    public static async Task<(string TenantId, ClaimsPrincipal Principal)?> SessionAsync(HttpContext context)
    {
        if (!context.Request.Cookies.ContainsKey(SessionCookie))
            return null;
        var result = await context.AuthenticateAsync(SessionScheme);
        return result.Succeeded && result.Principal.FindFirstValue(TenantClaim) is { Length: > 0 } tenant ? (tenant, result.Principal) : null;
    }
}
