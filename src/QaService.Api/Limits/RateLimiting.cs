using System.Globalization;
using System.Threading.RateLimiting;
using Microsoft.AspNetCore.RateLimiting;
using QaService.Api.Problems;
using QaService.Api.Security;

namespace QaService.Api.Limits;

/// <summary>
/// Per-key rate limiting with ASP.NET Core's rate limiter: a fixed window per tenant (keys mode) or
/// per client address (no keys), on <c>/v1/*</c> only, so probes and metrics are never limited. Each
/// instance counts for itself: with N instances a key may make up to N × the limit.
/// </summary>
internal static class RateLimiting
{
    public static IServiceCollection AddKeyRateLimiting(this IServiceCollection services, LimitsOptions limits)
    {
        services.AddRateLimiter(options =>
        {
            options.GlobalLimiter = PartitionedRateLimiter.Create<HttpContext, string>(context =>
            {
                if (!context.Request.Path.StartsWithSegments("/v1"))
                    return RateLimitPartition.GetNoLimiter("unlimited");
                return RateLimitPartition.GetFixedWindowLimiter(PartitionKey(context), _ => new FixedWindowRateLimiterOptions
                {
                    PermitLimit = limits.RateLimitPermits,
                    Window = TimeSpan.FromSeconds(limits.RateLimitWindowSeconds),
                    QueueLimit = 0,
                    AutoReplenishment = true,
                });
            });
            options.OnRejected = (rejected, cancellationToken) =>
            {
                var retryAfter = rejected.Lease.TryGetMetadata(MetadataName.RetryAfter, out var wait)
                    ? (int)Math.Ceiling(wait.TotalSeconds)
                    : limits.RateLimitWindowSeconds;
                var context = rejected.HttpContext;
                context.Response.Headers.RetryAfter = retryAfter.ToString(CultureInfo.InvariantCulture);
                return new ValueTask(InputProblems.Status(StatusCodes.Status429TooManyRequests, "Too many requests",
                    string.Create(CultureInfo.InvariantCulture,
                        $"more than {limits.RateLimitPermits} requests in {limits.RateLimitWindowSeconds} s for this key; retry after {retryAfter} s (Limits:RateLimitPermits, Limits:RateLimitWindowSeconds)"))
                    .ExecuteAsync(context));
            };
        });
        return services;
    }

    /// <summary>The tenant when keys are used; otherwise the client address (one local tenant, many callers).</summary>
    private static string PartitionKey(HttpContext context)
    {
        var tenant = context.Features.Get<TenantFeature>();
        return tenant is not null && tenant.TenantId != Tenants.Local
            ? "tenant:" + tenant.TenantId
            : "address:" + (context.Connection.RemoteIpAddress?.ToString() ?? "unknown");
    }
}
