using System.Text.Json;
using Microsoft.Playwright;

namespace QaService.Browser.Tests;

/// <summary>
/// Accessibility audit of a rendered page with axe-core (Deque, MPL-2.0; version pinned in
/// tools/browser-checks/package-lock.json, installed by <c>npm ci --prefix tools/browser-checks</c>, which .ci/run does).
/// axe's rules cover WCAG 2.x A/AA checks, among them color-contrast (SC 1.4.3), measured on the rendered page. The
/// script is injected as an inline script element, so the page's browser context must bypass the page's CSP.
/// A missing axe-core fails the test (never a silent pass).
/// </summary>
public static class AxeAudit
{
    /// <summary>The impacts that fail a page (axe's scale: minor, moderate, serious, critical).</summary>
    private static readonly string[] FailingImpacts = ["serious", "critical"];

    /// <summary>axe-core's script; <c>npm ci</c> installs it first when tools/browser-checks has no node_modules.</summary>
    private static readonly Lazy<string> Script = new(() => File.ReadAllText(InstalledScript()));

    private static string InstalledScript()
    {
        QaService.Tests.Shared.NpmTools.EnsureInstalled("browser-checks");
        return File.Exists(ScriptPath) ? ScriptPath
            : throw new FileNotFoundException($"axe-core is not at {ScriptPath} after npm ci --prefix tools/browser-checks", ScriptPath);
    }

    public static string ScriptPath { get; } = Path.Combine(RepositoryRoot(), "tools", "browser-checks", "node_modules", "axe-core", "axe.min.js");

    /// <summary>Runs axe on the page as it is now and fails on any serious or critical violation, listing each with its elements.</summary>
    /// <returns>The rule ids axe evaluated with a result (passes, violations, incomplete), for callers that check coverage.</returns>
    public static async Task<IReadOnlyList<string>> AssertNoSeriousViolationsAsync(IPage page)
    {
        await page.AddScriptTagAsync(new PageAddScriptTagOptions { Content = Script.Value });
        var json = await page.EvaluateAsync<string>("async () => JSON.stringify(await axe.run(document))");
        var results = JsonDocument.Parse(json).RootElement;

        var failing = results.GetProperty("violations").EnumerateArray()
            .Where(v => FailingImpacts.Contains(v.GetProperty("impact").GetString()))
            .Select(v => $"{v.GetProperty("id").GetString()} ({v.GetProperty("impact").GetString()}): {v.GetProperty("help").GetString()} at " +
                string.Join("; ", v.GetProperty("nodes").EnumerateArray().Take(5).Select(n => n.GetProperty("target").ToString())))
            .ToList();
        Assert.True(failing.Count == 0, $"axe-core {results.GetProperty("testEngine").GetProperty("version").GetString()} on {page.Url}:\n" + string.Join("\n", failing));

        var evaluated = new[] { "passes", "violations", "incomplete" }
            .SelectMany(kind => results.GetProperty(kind).EnumerateArray().Select(r => r.GetProperty("id").GetString()!)).ToList();
        // Text contrast is measured on every audited page (every page has text).
        Assert.Contains("color-contrast", evaluated);
        return evaluated;
    }

    private static string RepositoryRoot()
    {
        var dir = new DirectoryInfo(AppContext.BaseDirectory);
        while (dir is not null && !File.Exists(Path.Combine(dir.FullName, "QaService.sln")))
            dir = dir.Parent;
        return dir?.FullName ?? throw new InvalidOperationException("QaService.sln not found above the test output folder");
    }
}
