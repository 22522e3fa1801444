namespace QaService.Api.Demo;

/// <summary>The built-in demo (configuration section <c>Demo</c>).</summary>
public sealed class DemoOptions
{
    public const string Section = "Demo";

    /// <summary>Fixed, documented id of the demo report (the one report whose id is not random).</summary>
    public const string ReportId = "demo";

    /// <summary>Store the demo report at start-up when it is not there yet (default true).</summary>
    public bool Enabled { get; set; } = true;
}
