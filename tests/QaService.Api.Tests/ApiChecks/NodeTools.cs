using System.Diagnostics;
using QaService.Tests.Shared;

namespace QaService.Api.Tests.ApiChecks;

/// <summary>
/// The npm tools in tools/api-checks (versions pinned by its package-lock.json: @redocly/cli, openapi-typescript,
/// openapi-fetch, typescript), run with Node; installed by <see cref="NpmTools"/> when absent. Missing tools fail the
/// test, never pass it silently.
/// </summary>
internal static class NodeTools
{
    private static readonly TimeSpan Timeout = TimeSpan.FromSeconds(120);

    public static string Folder { get; } = Path.Combine(ServiceProcess.RepositoryRoot(), "tools", "api-checks");

    private static readonly Lazy<string> Installed = new(() => NpmTools.EnsureInstalled("api-checks"));

    /// <summary>Path of an installed tool's entry script (node_modules/.bin/&lt;name&gt;); fails the test when it is not installed.</summary>
    public static string Bin(string name)
    {
        var path = Path.Combine(Installed.Value, "node_modules", ".bin", name);
        if (File.Exists(path))
            return path;
        var why = Environment.GetEnvironmentVariable("CI") == "true"
            ? ".ci/run should have installed them before dotnet test"
            : "run once: npm ci --prefix tools/api-checks";
        Assert.Fail($"{path} is missing: the API checks need the npm tools of tools/api-checks; {why}");
        return path;
    }

    /// <summary>Runs <c>node script args…</c> in <paramref name="workingFolder"/>; returns the exit code, standard output and standard error.</summary>
    public static async Task<(int ExitCode, string Output, string Errors)> RunNodeAsync(string workingFolder, string script, params string[] args)
    {
        var start = new ProcessStartInfo("node") { WorkingDirectory = workingFolder, RedirectStandardOutput = true, RedirectStandardError = true };
        start.ArgumentList.Add(script);
        foreach (var arg in args)
            start.ArgumentList.Add(arg);
        // No telemetry or update checks from the tools: tests stay offline apart from the service under test.
        start.Environment["REDOCLY_TELEMETRY"] = "off";
        start.Environment["REDOCLY_SUPPRESS_UPDATE_NOTICE"] = "true";
        start.Environment["NO_COLOR"] = "1";
        Process process;
        try
        {
            process = Process.Start(start) ?? throw new InvalidOperationException("node did not start");
        }
        catch (System.ComponentModel.Win32Exception e)
        {
            Assert.Fail($"node is not on PATH ({e.Message}); install Node.js 20 or later to run the API checks");
            throw;
        }
        using (process)
        {
            var stdout = process.StandardOutput.ReadToEndAsync();
            var stderr = process.StandardError.ReadToEndAsync();
            using var cancel = new CancellationTokenSource(Timeout);
            try
            {
                await process.WaitForExitAsync(cancel.Token);
            }
            catch (OperationCanceledException)
            {
                process.Kill(entireProcessTree: true);
                Assert.Fail($"node {Path.GetFileName(script)} did not finish within {Timeout.TotalSeconds} s");
            }
            return (process.ExitCode, await stdout, await stderr);
        }
    }
}
