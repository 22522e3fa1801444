namespace QaService.Api.WarmUp;

/// <summary>Configuration section <c>WarmUp</c>.</summary>
public sealed class WarmUpOptions
{
    public const string Section = "WarmUp";

    /// <summary>Run one synthetic upload through the pipeline at start (default on; the test hosts turn it off).</summary>
    public bool Enabled { get; set; } = true;
}
