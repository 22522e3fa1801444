using System.Diagnostics;
using System.Net;
using System.Net.Sockets;
using Microsoft.Playwright;

namespace QaService.Browser.Tests;

/// <summary>
/// The built service started as a child process on 127.0.0.1 (a free port, its own SQLite file, demo on), and one
/// headless Debian Chromium driven by Playwright. A browser cannot reach an in-memory test server, hence the process.
/// When Chromium is not installed the tests say so and return (xunit 2.9 has no dynamic skip); CI installs it.
/// </summary>
public class LiveService : IAsyncLifetime
{
    /// <summary>Debian's package <c>chromium</c>; never a browser downloaded by Playwright.</summary>
    public const string ChromiumPath = "/usr/bin/chromium";

    private static readonly string[] ChromiumArgs =
        ["--headless", "--no-sandbox", "--disable-gpu", "--disable-quic", "--no-first-run", "--disable-background-networking", "--disable-component-update", "--disable-sync"];

    private static readonly TimeSpan StartupTimeout = TimeSpan.FromSeconds(60);

    private readonly string folder = Path.Combine(Path.GetTempPath(), $"qaservice-browser-{Guid.NewGuid():N}");
    private Process? service;
    private IPlaywright? playwright;

    public static bool ChromiumInstalled => File.Exists(ChromiumPath);

    /// <summary>Why the browser tests did not run, or null when they do.</summary>
    public static string? SkipReason => ChromiumInstalled ? null : $"SKIPPED (not a failure): {ChromiumPath} not found; install Debian's chromium (apt-get install -y chromium) to run the browser tests.";

    public Uri BaseAddress { get; private set; } = new("http://127.0.0.1/");

    public IBrowser Browser { get; private set; } = null!;

    public HttpClient Http { get; private set; } = null!;

    /// <summary>Where screenshots and PDFs are kept: TestResults/browser under the test output folder.</summary>
    public static string ArtifactFolder { get; } = Directory.CreateDirectory(Path.Combine(AppContext.BaseDirectory, "TestResults", "browser")).FullName;

    /// <summary>More command-line settings for the service (a subclass starts it in another mode).</summary>
    protected virtual IEnumerable<string> Settings => [];

    public async Task InitializeAsync()
    {
        if (!ChromiumInstalled)
            return;

        Directory.CreateDirectory(folder);
        int port = FreePort();
        BaseAddress = new Uri($"http://127.0.0.1:{port}/");
        var start = new ProcessStartInfo("dotnet")
        {
            WorkingDirectory = folder,
            RedirectStandardOutput = true,
            RedirectStandardError = true,
        };
        foreach (var arg in new[]
                 {
                     ServiceAssembly(), "--urls", BaseAddress.ToString().TrimEnd('/'),
                     $"--Storage:ConnectionString=Data Source={Path.Combine(folder, "qaservice.db")}",
                     "--Demo:Enabled=true", "--Serilog:MinimumLevel:Default=Warning",
                 }.Concat(Settings))
            start.ArgumentList.Add(arg);
        service = Process.Start(start) ?? throw new InvalidOperationException("the service process did not start");
        service.OutputDataReceived += (_, _) => { };
        service.ErrorDataReceived += (_, _) => { };
        service.BeginOutputReadLine();
        service.BeginErrorReadLine();

        Http = new HttpClient { BaseAddress = BaseAddress };
        await WaitUntilServingAsync();

        playwright = await Playwright.CreateAsync();
        Browser = await playwright.Chromium.LaunchAsync(new BrowserTypeLaunchOptions { ExecutablePath = ChromiumPath, Headless = true, Args = ChromiumArgs });
    }

    public async Task DisposeAsync()
    {
        if (Browser is not null)
            await Browser.CloseAsync();
        playwright?.Dispose();
        Http?.Dispose();
        if (service is { HasExited: false })
        {
            service.Kill(entireProcessTree: true);
            await service.WaitForExitAsync();
        }

        service?.Dispose();
        try
        {
            Directory.Delete(folder, recursive: true);
        }
        catch (IOException)
        {
            // A leftover temp folder is harmless.
        }
    }

    /// <summary>The service built beside this project: src/QaService.Api/bin/&lt;configuration&gt;/&lt;tfm&gt;/QaService.Api.dll.</summary>
    private static string ServiceAssembly()
    {
        var here = new DirectoryInfo(AppContext.BaseDirectory);
        string tfm = here.Name, configuration = here.Parent!.Name;
        var root = here;
        while (root is not null && !File.Exists(Path.Combine(root.FullName, "QaService.sln")))
            root = root.Parent;
        if (root is null)
            throw new InvalidOperationException("QaService.sln not found above the test output folder");
        var dll = Path.Combine(root.FullName, "src", "QaService.Api", "bin", configuration, tfm, "QaService.Api.dll");
        return File.Exists(dll) ? dll : throw new FileNotFoundException("build the solution first", dll);
    }

    private static int FreePort()
    {
        using var listener = new TcpListener(IPAddress.Loopback, 0);
        listener.Start();
        return ((IPEndPoint)listener.LocalEndpoint).Port;
    }

    private async Task WaitUntilServingAsync()
    {
        var deadline = DateTime.UtcNow + StartupTimeout;
        while (DateTime.UtcNow < deadline)
        {
            if (service!.HasExited)
                throw new InvalidOperationException($"the service exited with code {service.ExitCode} before serving");
            try
            {
                if ((await Http.GetAsync("readyz")).IsSuccessStatusCode)
                    return;
            }
            catch (HttpRequestException)
            {
                // Not listening yet.
            }

            await Task.Delay(200);
        }

        throw new TimeoutException($"the service did not answer /readyz within {StartupTimeout.TotalSeconds} s");
    }
}

[CollectionDefinition(Name)]
public sealed class LiveServiceCollection : ICollectionFixture<LiveService>
{
    public const string Name = "live service";
}
