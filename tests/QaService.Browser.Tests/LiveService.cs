using Microsoft.Playwright;
using QaService.Tests.Shared;

namespace QaService.Browser.Tests;

/// <summary>
/// The built service started as a child process on 127.0.0.1 (a free port, its own SQLite file, demo on), and one
/// headless Debian Chromium driven by Playwright. A browser cannot reach an in-memory test server, hence the process.
/// When Chromium is not installed the tests say so and return (xunit 2.9 has no dynamic skip); CI installs it.
/// </summary>
public sealed class LiveService : IAsyncLifetime
{
    /// <summary>Debian's package <c>chromium</c>; never a browser downloaded by Playwright.</summary>
    public const string ChromiumPath = "/usr/bin/chromium";

    private static readonly string[] ChromiumArgs =
        ["--headless", "--no-sandbox", "--disable-gpu", "--disable-quic", "--no-first-run", "--disable-background-networking", "--disable-component-update", "--disable-sync"];

    private ServiceProcess? service;
    private IPlaywright? playwright;

    public static bool ChromiumInstalled => File.Exists(ChromiumPath);

    /// <summary>Why the browser tests did not run, or null when they do.</summary>
    public static string? SkipReason => ChromiumInstalled ? null : $"SKIPPED (not a failure): {ChromiumPath} not found; install Debian's chromium (apt-get install -y chromium) to run the browser tests.";

    public Uri BaseAddress => service?.BaseAddress ?? new Uri("http://127.0.0.1/");

    public IBrowser Browser { get; private set; } = null!;

    public HttpClient Http => service?.Http ?? throw new InvalidOperationException("the service is not running");

    /// <summary>Where screenshots and PDFs are kept: TestResults/browser under the test output folder.</summary>
    public static string ArtifactFolder { get; } = Directory.CreateDirectory(Path.Combine(AppContext.BaseDirectory, "TestResults", "browser")).FullName;

    public async Task InitializeAsync()
    {
        if (!ChromiumInstalled)
            return;

        service = await ServiceProcess.StartAsync(new Dictionary<string, string> { ["Demo:Enabled"] = "true" });
        playwright = await Playwright.CreateAsync();
        Browser = await playwright.Chromium.LaunchAsync(new BrowserTypeLaunchOptions { ExecutablePath = ChromiumPath, Headless = true, Args = ChromiumArgs });
    }

    public async Task DisposeAsync()
    {
        if (Browser is not null)
            await Browser.CloseAsync();
        playwright?.Dispose();
        if (service is not null)
            await service.DisposeAsync();
    }
}

[CollectionDefinition(Name)]
public sealed class LiveServiceCollection : ICollectionFixture<LiveService>
{
    public const string Name = "live service";
}
