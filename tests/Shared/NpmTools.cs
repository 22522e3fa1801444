using System.Diagnostics;

namespace QaService.Tests.Shared;

/// <summary>
/// The test-only npm tools under tools/ (pinned by each folder's package-lock.json). When a folder's node_modules is
/// missing, <c>npm ci</c> installs it once, so the README's single test command works on a fresh machine; .ci/run
/// installs them ahead of the tests as well. A failed install fails the calling test with npm's own words.
/// </summary>
public static class NpmTools
{
    private static readonly TimeSpan InstallTimeout = TimeSpan.FromMinutes(5);
    private static readonly object Gate = new();

    /// <summary>Installs <c>tools/&lt;folderName&gt;</c>'s packages when its node_modules is absent; returns the folder.</summary>
    public static string EnsureInstalled(string folderName)
    {
        var folder = Path.Combine(ServiceProcess.RepositoryRoot(), "tools", folderName);
        lock (Gate)
        {
            if (Directory.Exists(Path.Combine(folder, "node_modules")))
                return folder;
            var start = new ProcessStartInfo("npm") { RedirectStandardOutput = true, RedirectStandardError = true };
            foreach (var arg in new[] { "ci", "--prefix", folder, "--no-audit", "--no-fund", "--loglevel=error" })
                start.ArgumentList.Add(arg);
            try
            {
                using var npm = Process.Start(start) ?? throw new InvalidOperationException("npm did not start");
                var errors = npm.StandardError.ReadToEndAsync();
                npm.StandardOutput.ReadToEnd();
                if (!npm.WaitForExit(InstallTimeout))
                {
                    npm.Kill(entireProcessTree: true);
                    throw new InvalidOperationException($"npm ci --prefix tools/{folderName} did not finish within {InstallTimeout.TotalMinutes} min");
                }
                if (npm.ExitCode != 0)
                    throw new InvalidOperationException($"npm ci --prefix tools/{folderName} failed ({npm.ExitCode}): {errors.Result}");
            }
            catch (System.ComponentModel.Win32Exception e)
            {
                throw new InvalidOperationException($"npm is not on PATH ({e.Message}): install Node.js 20 and npm (Debian nodejs, npm), or run .ci/run", e);
            }
            return folder;
        }
    }
}
