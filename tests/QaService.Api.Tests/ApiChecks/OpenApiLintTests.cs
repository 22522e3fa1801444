using System.Text;
using System.Text.Json;
using QaService.Api.Tests.Support;
using Xunit.Abstractions;

namespace QaService.Api.Tests.ApiChecks;

/// <summary>
/// The OpenAPI document passes Redocly CLI's "recommended" ruleset (@redocly/cli 2.77.0, pinned in
/// tools/api-checks/package-lock.json): no errors and no warnings, in both Auth modes (the document says which).
/// </summary>
public sealed class OpenApiLintTests(ITestOutputHelper output)
{
    /// <summary>Warnings allowed: none remain today; raise only with a reason written here.</summary>
    private const int MaximumWarnings = 0;

    public static TheoryData<string> Modes => ["none", "keys"];

    [Theory]
    [MemberData(nameof(Modes))]
    public async Task Document_passes_redocly_recommended_ruleset(string authMode)
    {
        var redocly = NodeTools.Bin("redocly");
        var settings = new Dictionary<string, string?> { ["Auth:Mode"] = authMode, ["Auth:AdminToken"] = KeysHost.AdminToken };
        using var factory = new QaServiceFactory(extra: settings);
        var document = await factory.CreateClient().GetStringAsync("/openapi/v1.json");
        var file = Path.Combine(Path.GetTempPath(), $"qaservice-openapi-{Guid.NewGuid():N}.json");
        await File.WriteAllTextAsync(file, document);
        try
        {
            var (exit, json, errors) = await NodeTools.RunNodeAsync(NodeTools.Folder, redocly, "lint", "--extends", "recommended", "--format", "json", file);
            var (errorCount, warningCount, listing) = Summarise(json, errors);
            output.WriteLine($"redocly lint --extends recommended ({authMode}): {errorCount} errors, {warningCount} warnings\n{listing}");
            Assert.True(exit == 0 && errorCount == 0, $"redocly lint exited {exit} with {errorCount} errors:\n{listing}");
            Assert.True(warningCount <= MaximumWarnings, $"{warningCount} warnings (at most {MaximumWarnings}):\n{listing}");
        }
        finally
        {
            File.Delete(file);
        }
    }

    /// <summary>Counts and one line per problem (severity, rule, where, message) from Redocly's JSON report.</summary>
    private static (int Errors, int Warnings, string Listing) Summarise(string json, string stderr)
    {
        JsonElement report;
        try
        {
            report = JsonDocument.Parse(json).RootElement;
        }
        catch (JsonException)
        {
            Assert.Fail($"redocly did not write a JSON report:\n{json}\n{stderr}");
            throw;
        }
        var totals = report.GetProperty("totals");
        var listing = new StringBuilder();
        foreach (var problem in report.GetProperty("problems").EnumerateArray())
        {
            var where = problem.TryGetProperty("location", out var locations) && locations.GetArrayLength() > 0
                ? locations[0].GetProperty("pointer").GetString() : "";
            listing.AppendLine($"{problem.GetProperty("severity").GetString()} {problem.GetProperty("ruleId").GetString()} at {where}: {problem.GetProperty("message").GetString()}");
        }
        return (totals.GetProperty("errors").GetInt32(), totals.GetProperty("warnings").GetInt32(), listing.ToString());
    }
}
