using System.Net;
using System.Net.Http.Json;
using System.Text.Json.Nodes;
using Xunit.Abstractions;

namespace QaService.Browser.Tests;

/// <summary>
/// Ids are data, never markup or formulas: a mark id that is an HTML tag with a script handler shows as text and
/// runs nothing; a fix id that is a spreadsheet formula is inert in the CSV (OWASP "CSV Injection").
/// </summary>
[Collection(LiveServiceCollection.Name)]
public sealed class HostileInputTests(LiveService service, ITestOutputHelper output)
{
    private const string ScriptId = "<img src=x onerror=alert(1)>";
    private const string FormulaId = "=HYPERLINK(\"http://example.invalid/x\",\"click\")";

    [Fact]
    public async Task Markup_in_an_id_is_shown_as_text_and_runs_nothing()
    {
        if (LiveService.SkipReason is { } skip)
        {
            output.WriteLine(skip);
            return;
        }

        string id = await CreateHostileAssessmentAsync();
        await using var session = await BrowserSession.OpenAsync(service);
        await session.Page.GotoAsync($"v1/assessments/{id}/report.html");

        Assert.Empty(session.Dialogs);
        Assert.Empty(session.Errors);
        Assert.Empty(session.ExternalRequests(service));
        Assert.Equal(0, await session.Page.Locator("img").CountAsync());
        Assert.Contains(ScriptId, await session.Page.Locator("#residual-table").InnerTextAsync());
        Assert.Contains(FormulaId, await session.Page.Locator("#residual-table").InnerTextAsync());
        Assert.Contains(ScriptId, await session.Page.TitleAsync());

        var html = await service.Http.GetStringAsync($"v1/assessments/{id}/report.html");
        Assert.DoesNotContain("<img", html, StringComparison.OrdinalIgnoreCase);
        Assert.Contains("&lt;img src=x onerror=alert(1)&gt;", html);
    }

    [Fact]
    public async Task A_formula_in_an_id_is_inert_in_the_csv()
    {
        if (LiveService.SkipReason is { } skip)
        {
            output.WriteLine(skip);
            return;
        }

        string id = await CreateHostileAssessmentAsync();
        var response = await service.Http.GetAsync($"v1/assessments/{id}/residuals.csv");
        Assert.Equal(HttpStatusCode.OK, response.StatusCode);
        Assert.Equal("text/csv", response.Content.Headers.ContentType?.MediaType);
        string csv = await response.Content.ReadAsStringAsync();

        // RFC 4180: the field holds a comma and quotes, so it is quoted with inner quotes doubled; the leading
        // apostrophe keeps a spreadsheet from reading it as a formula.
        Assert.Contains("\"'=HYPERLINK(\"\"http://example.invalid/x\"\",\"\"click\"\")\"", csv);
        Assert.DoesNotContain(",=HYPERLINK", csv);
        Assert.All(csv.Split("\r\n", StringSplitOptions.RemoveEmptyEntries), line => Assert.False(line.StartsWith('='), line));

        var geojson = await service.Http.GetStringAsync($"v1/assessments/{id}/residuals.geojson");
        Assert.Contains("FeatureCollection", geojson);
    }

    /// <summary>The demo request with its first mark renamed to markup and its first fix renamed to a formula.</summary>
    private async Task<string> CreateHostileAssessmentAsync()
    {
        var request = JsonNode.Parse(await File.ReadAllTextAsync(DemoRequestPath()))!;
        var marks = request["marks"]!["points"]!.AsArray();
        string oldMark = marks[0]!["id"]!.GetValue<string>();
        marks[0]!["id"] = ScriptId;
        var fixes = request["fixes"]!["points"]!.AsArray();
        foreach (var fix in fixes)
        {
            if (fix!["mark"]?.GetValue<string>() == oldMark)
                fix["mark"] = ScriptId;
        }

        fixes[0]!["id"] = FormulaId;
        request["title"] = ScriptId;

        var response = await service.Http.PostAsJsonAsync("v1/assessments", request);
        Assert.Equal(HttpStatusCode.Created, response.StatusCode);
        var body = JsonNode.Parse(await response.Content.ReadAsStringAsync())!;
        return body["id"]!.GetValue<string>();
    }

    internal static string DemoRequestPath()
    {
        var dir = new DirectoryInfo(AppContext.BaseDirectory);
        while (dir is not null && !File.Exists(Path.Combine(dir.FullName, "QaService.sln")))
            dir = dir.Parent;
        return Path.Combine(dir!.FullName, "src", "QaService.Api", "Demo", "millbrook-ferry-hydrants.json");
    }
}
