using System.ComponentModel.DataAnnotations;

namespace QaService.Api;

/// <summary>Request limits (configuration section <c>Limits</c>, api-v1 "Configuration keys").</summary>
public sealed class LimitsOptions
{
    public const string Section = "Limits";

    /// <summary>Largest request body in bytes; a larger one gets 413 (default 256 MiB).</summary>
    [Range(1024, long.MaxValue)]
    public long MaxBodyBytes { get; set; } = 268_435_456;
}
