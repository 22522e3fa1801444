using System.Collections.Concurrent;
using System.Diagnostics;
using System.Net;
using System.Net.Sockets;

namespace QaService.Tests.Shared;

/// <summary>
/// The built service (src/QaService.Api/bin/&lt;configuration&gt;/&lt;tfm&gt;/QaService.Api.dll) as a child process on a
/// free 127.0.0.1 port, with its output kept. Shared by the browser tests and the API tests' start-up tests (linked
/// source file), so there is one way to start a real instance.
/// </summary>
public sealed class ServiceProcess : IAsyncDisposable
{
    private readonly Process process;
    private readonly ConcurrentQueue<string> output = new();

    private ServiceProcess(Process process, Uri baseAddress)
    {
        this.process = process;
        BaseAddress = baseAddress;
    }

    public Uri BaseAddress { get; }

    public bool HasExited => process.HasExited;

    public int ExitCode => process.ExitCode;

    /// <summary>Every line written to stdout and stderr so far.</summary>
    public IReadOnlyList<string> Output => [.. output];

    /// <summary>Starts <c>dotnet QaService.Api.dll --urls http://127.0.0.1:PORT</c> plus <paramref name="arguments"/> in <paramref name="workingFolder"/>.</summary>
    public static ServiceProcess Start(string workingFolder, IEnumerable<string> arguments)
    {
        var baseAddress = new Uri($"http://127.0.0.1:{FreePort()}/");
        var start = new ProcessStartInfo("dotnet") { WorkingDirectory = workingFolder, RedirectStandardOutput = true, RedirectStandardError = true };
        foreach (var arg in new[] { ServiceAssembly(), "--urls", baseAddress.ToString().TrimEnd('/') }.Concat(arguments))
            start.ArgumentList.Add(arg);
        var process = Process.Start(start) ?? throw new InvalidOperationException("the service process did not start");
        var service = new ServiceProcess(process, baseAddress);
        process.OutputDataReceived += (_, line) => { if (line.Data is not null) service.output.Enqueue(line.Data); };
        process.ErrorDataReceived += (_, line) => { if (line.Data is not null) service.output.Enqueue(line.Data); };
        process.BeginOutputReadLine();
        process.BeginErrorReadLine();
        return service;
    }

    /// <summary>Waits until <c>/readyz</c> answers 200; throws with the output if the process exits or the time runs out.</summary>
    public async Task WaitUntilReadyAsync(HttpClient http, TimeSpan timeout)
    {
        var deadline = DateTime.UtcNow + timeout;
        while (DateTime.UtcNow < deadline)
        {
            if (process.HasExited)
                throw new InvalidOperationException($"the service exited with code {process.ExitCode} before serving:\n{string.Join('\n', Output)}");
            try
            {
                if ((await http.GetAsync(new Uri(BaseAddress, "readyz"))).IsSuccessStatusCode)
                    return;
            }
            catch (HttpRequestException)
            {
                // Not listening yet.
            }
            await Task.Delay(200);
        }
        throw new TimeoutException($"the service did not answer /readyz within {timeout.TotalSeconds} s:\n{string.Join('\n', Output)}");
    }

    /// <summary>Waits for the process to exit by itself; false when it is still running after <paramref name="timeout"/>.</summary>
    public async Task<bool> WaitForExitAsync(TimeSpan timeout)
    {
        using var limit = new CancellationTokenSource(timeout);
        try
        {
            await process.WaitForExitAsync(limit.Token);
            process.WaitForExit(); // drains the redirected output
            return true;
        }
        catch (OperationCanceledException)
        {
            return false;
        }
    }

    public async ValueTask DisposeAsync()
    {
        if (!process.HasExited)
        {
            process.Kill(entireProcessTree: true);
            await process.WaitForExitAsync();
        }
        process.Dispose();
    }

    /// <summary>The service built beside the test project (the same configuration and target framework).</summary>
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
}
