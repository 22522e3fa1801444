namespace QaService.Api.Security;

/// <summary>
/// The tenant of the current request. Every endpoint that reads or writes reports scopes them by
/// <see cref="TenantId"/>, so what one tenant created is 404 to every other (api-v1 "Tenants and keys").
/// </summary>
public interface ITenantContext
{
    /// <summary>The tenant id; <see cref="Tenants.Local"/> when <c>Auth:Mode</c> is <c>none</c>.</summary>
    string TenantId { get; }
}

/// <summary>Fixed tenant ids.</summary>
public static class Tenants
{
    /// <summary>The one tenant while <c>Auth:Mode</c> is <c>none</c> (and the owner of the demo report).</summary>
    public const string Local = "local";
}

/// <summary>Set on the request by <see cref="TenantResolutionMiddleware"/> once the caller is known.</summary>
internal sealed record TenantFeature(string TenantId, bool IsAdmin);

/// <summary>Reads the tenant that <see cref="TenantResolutionMiddleware"/> resolved for this request.</summary>
internal sealed class HttpTenantContext(IHttpContextAccessor accessor) : ITenantContext
{
    public string TenantId =>
        accessor.HttpContext?.Features.Get<TenantFeature>()?.TenantId
        ?? throw new InvalidOperationException("no tenant was resolved for this request: tenant-scoped endpoints must live under /v1");
}
