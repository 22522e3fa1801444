using System.Diagnostics;
using System.Net;
using System.Net.Sockets;
using System.Text;

namespace QaService.Tests.Shared;

/// <summary>
/// The built service (src/QaService.Api/bin/&lt;configuration&gt;/&lt;tfm&gt;/QaService.Api.dll) started as a child
/// process on a free 127.0.0.1 port, with its own SQLite file in a temporary folder; stopped and cleaned up on
/// dispose. Used where an in-memory host will not do: a browser, or a Node client in another process.
/// Linked into each test project that needs it (tests/Shared), so there is one copy.
/// </summary>
public sealed class ServiceProcess : IAsyncDisposable
{
    private static readonly TimeSpan StartupTimeout = TimeSpan.FromSeconds(60);

    private readonly string folder = Path.Combine(Path.GetTempPath(), $"qaservice-process-{Guid.NewGuid():N}");
    private readonly StringBuilder log = new();
    private Process? service;

    private ServiceProcess(Uri baseAddress)
    {
        BaseAddress = baseAddress;
        Http = new HttpClient { BaseAddress = baseAddress };
    }

    public Uri BaseAddress { get; }

    /// <summary>A client for the service's base address (no authorization header).</summary>
    public HttpClient Http { get; }

    /// <summary>What the service wrote to stdout and stderr so far (for failure messages).</summary>
    public string Log
    {
        get
        {
            lock (log)
                return log.ToString();
        }
    }

    /// <summary>Starts the service with <paramref name="settings"/> as <c>--Key=value</c> arguments and waits for /readyz.</summary>
    public static async Task<ServiceProcess> StartAsync(IReadOnlyDictionary<string, string>? settings = null)
    {
        var process = new ServiceProcess(new Uri($"http://127.0.0.1:{FreePort()}/"));
        try
        {
            await process.LaunchAsync(settings ?? new Dictionary<string, string>());
            return process;
        }
        catch
        {
            await process.DisposeAsync();
            throw;
        }
    }

    /// <summary>The repository root: the folder above the test output that holds QaService.sln.</summary>
    public static string RepositoryRoot()
    {
        var root = new DirectoryInfo(AppContext.BaseDirectory);
        while (root is not null && !File.Exists(Path.Combine(root.FullName, "QaService.sln")))
            root = root.Parent;
        return root?.FullName ?? throw new InvalidOperationException("QaService.sln not found above the test output folder");
    }

    private async Task LaunchAsync(IReadOnlyDictionary<string, string> settings)
    {
        Directory.CreateDirectory(folder);
        var start = new ProcessStartInfo("dotnet") { WorkingDirectory = folder, RedirectStandardOutput = true, RedirectStandardError = true };
        start.ArgumentList.Add(ServiceAssembly());
        start.ArgumentList.Add("--urls");
        start.ArgumentList.Add(BaseAddress.ToString().TrimEnd('/'));
        var arguments = new Dictionary<string, string>
        {
            ["Storage:ConnectionString"] = $"Data Source={Path.Combine(folder, "qaservice.db")}",
            ["Serilog:MinimumLevel:Default"] = "Warning",
        };
        foreach (var (key, value) in settings)
            arguments[key] = value;
        foreach (var (key, value) in arguments)
            start.ArgumentList.Add($"--{key}={value}");

        service = Process.Start(start) ?? throw new InvalidOperationException("the service process did not start");
        service.OutputDataReceived += (_, e) => Append(e.Data);
        service.ErrorDataReceived += (_, e) => Append(e.Data);
        service.BeginOutputReadLine();
        service.BeginErrorReadLine();
        await WaitUntilServingAsync();
    }

    private void Append(string? line)
    {
        if (line is null)
            return;
        lock (log)
            log.AppendLine(line);
    }

    public async ValueTask DisposeAsync()
    {
        Http.Dispose();
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

    /// <summary>The service built beside the test project: same configuration and target framework folder names.</summary>
    private static string ServiceAssembly()
    {
        var here = new DirectoryInfo(AppContext.BaseDirectory);
        string tfm = here.Name, configuration = here.Parent!.Name;
        var dll = Path.Combine(RepositoryRoot(), "src", "QaService.Api", "bin", configuration, tfm, "QaService.Api.dll");
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
                throw new InvalidOperationException($"the service exited with code {service.ExitCode} before serving:\n{Log}");
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

        throw new TimeoutException($"the service did not answer /readyz within {StartupTimeout.TotalSeconds} s:\n{Log}");
    }
}
