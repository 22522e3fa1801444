using System.ComponentModel.DataAnnotations;

namespace QaService.Api;

/// <summary>Request limits (configuration section <c>Limits</c>, api-v1 "Configuration keys"; README lists them).</summary>
public sealed class LimitsOptions
{
    public const string Section = "Limits";

    /// <summary>Largest request body in bytes; a larger one gets 413 (default 256 MiB).</summary>
    [Range(1024, long.MaxValue)]
    public long MaxBodyBytes { get; set; } = 268_435_456;

    /// <summary>
    /// Most points (marks + fixes, or transform points) in one request; more gets 413 with a pointer.
    /// Default 1,000,000: about 100 MB of JSON, a few seconds of work (bench/transform-vs-cs2cs.sh ran 200,000 in 0.5 s).
    /// </summary>
    [Range(1, int.MaxValue)]
    public int MaxPoints { get; set; } = 1_000_000;

    /// <summary>Requests one API key (or, without keys, one client address) may make per window, per instance; more gets 429 with Retry-After.</summary>
    [Range(1, int.MaxValue)]
    public int RateLimitPermits { get; set; } = 600;

    /// <summary>Length of the rate-limit window in seconds (fixed window).</summary>
    [Range(1, 86_400)]
    public int RateLimitWindowSeconds { get; set; } = 60;

    /// <summary>Longest a request may take before it is cancelled and answered 503 (default 120 s, enough to upload and assess the largest body).</summary>
    [Range(1, 3_600)]
    public int RequestTimeoutSeconds { get; set; } = 120;
}
