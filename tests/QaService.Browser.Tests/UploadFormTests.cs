using System.Globalization;
using System.Net;
using System.Text;
using System.Text.Json.Nodes;
using Microsoft.Playwright;
using Xunit.Abstractions;

namespace QaService.Browser.Tests;

/// <summary>The web UI end to end: the list at / and the upload form leading to the HTML report.</summary>
[Collection(LiveServiceCollection.Name)]
public sealed class UploadFormTests(LiveService service, ITestOutputHelper output)
{
    [Fact]
    public async Task Home_lists_the_demo_and_links_its_report()
    {
        if (LiveService.SkipReason is { } skip)
        {
            output.WriteLine(skip);
            return;
        }

        await using var session = await BrowserSession.OpenAsync(service);
        await session.Page.GotoAsync("/");
        Assert.Empty(session.Errors);
        await session.Page.Locator("#recent a", new PageLocatorOptions { HasText = "Millbrook Ferry" }).First.ClickAsync();
        await session.Page.WaitForURLAsync("**/v1/assessments/demo/report.html");
        Assert.Equal("PASS", await session.Page.Locator("#verdict").InnerTextAsync());
    }

    [Fact]
    public async Task Uploading_marks_and_fixes_files_leads_to_the_report()
    {
        if (LiveService.SkipReason is { } skip)
        {
            output.WriteLine(skip);
            return;
        }

        // The form posts the contract's multipart request; until the service reads multipart it answers 415.
        using var probe = new MultipartFormDataContent { { new StringContent("{}"), "options" } };
        if ((await service.Http.PostAsync("v1/assessments", probe)).StatusCode == HttpStatusCode.UnsupportedMediaType)
        {
            output.WriteLine("SKIPPED (not a failure): this build of POST /v1/assessments does not read multipart/form-data yet.");
            return;
        }

        var (marksCsv, fixesCsv) = DemoAsCsv();
        await using var session = await BrowserSession.OpenAsync(service);
        var page = session.Page;
        await page.GotoAsync("/");
        await page.Locator("#options").FillAsync("""
            { "title": "Form upload <b>check</b>",
              "marks": { "crs": "EPSG:32633", "heights": "ellipsoidal" },
              "fixes": { "crs": "EPSG:4979", "heights": "ellipsoidal" },
              "spec": { "standard": "nssda", "horizontal": 0.10, "vertical": 0.15 },
              "pairing": { "radius": 1.0 } }
            """);
        await page.Locator("#marks").SetInputFilesAsync(new FilePayload { Name = "marks.csv", MimeType = "text/csv", Buffer = Encoding.UTF8.GetBytes(marksCsv) });
        await page.Locator("#fixes").SetInputFilesAsync(new FilePayload { Name = "fixes.csv", MimeType = "text/csv", Buffer = Encoding.UTF8.GetBytes(fixesCsv) });
        await page.Locator("#upload button[type=submit]").ClickAsync();
        await page.WaitForURLAsync("**/report.html");

        Assert.Empty(session.Errors);
        Assert.Equal("PASS", await page.Locator("#verdict").InnerTextAsync());
        Assert.Equal("Form upload <b>check</b>", await page.Locator("h1").InnerTextAsync());
        // The uploaded files hold the demo's points: the new report pairs as many fixes, and plots every counted one.
        string jsonPath = new Uri(page.Url).AbsolutePath.Replace("/report.html", "", StringComparison.Ordinal);
        var report = System.Text.Json.JsonDocument.Parse(await service.Http.GetStringAsync(jsonPath.TrimStart('/'))).RootElement;
        var demo = System.Text.Json.JsonDocument.Parse(await service.Http.GetStringAsync("v1/assessments/demo")).RootElement;
        Assert.Equal(demo.GetProperty("counts").GetProperty("paired").GetInt32(), report.GetProperty("counts").GetProperty("paired").GetInt32());
        int included = report.GetProperty("residuals").EnumerateArray().Count(r => r.GetProperty("excluded").ValueKind == System.Text.Json.JsonValueKind.Null);
        Assert.Equal(report.GetProperty("horizontal").GetProperty("n").GetInt32(), included);
        Assert.Equal(included, await page.Locator("#plot-scatter circle.pt").CountAsync());
        await page.ScreenshotAsync(new PageScreenshotOptions { Path = Path.Combine(LiveService.ArtifactFolder, "uploaded-report.png"), FullPage = true });

        await page.GotoAsync("/");
        Assert.Equal(1, await page.Locator("#recent a", new PageLocatorOptions { HasText = "Form upload <b>check</b>" }).CountAsync());
    }

    [Fact]
    public async Task A_bad_upload_shows_what_to_fix()
    {
        if (LiveService.SkipReason is { } skip)
        {
            output.WriteLine(skip);
            return;
        }

        await using var session = await BrowserSession.OpenAsync(service);
        var page = session.Page;
        await page.GotoAsync("/");
        await page.Locator("#options").FillAsync("{ \"title\": ");
        await page.Locator("#marks").SetInputFilesAsync(new FilePayload { Name = "m.csv", MimeType = "text/csv", Buffer = "id,e,n\n"u8.ToArray() });
        await page.Locator("#fixes").SetInputFilesAsync(new FilePayload { Name = "f.csv", MimeType = "text/csv", Buffer = "id,lat,lon\n"u8.ToArray() });
        var response = await page.RunAndWaitForResponseAsync(() => page.Locator("#upload button[type=submit]").ClickAsync(),
            r => new Uri(r.Url).AbsolutePath == "/ui/assessments");
        await page.WaitForLoadStateAsync();

        Assert.True(response.Status is >= 400 and < 500, $"status {response.Status}");
        Assert.Equal("The upload was not accepted", await page.Locator("h1").InnerTextAsync());
        Assert.False(string.IsNullOrWhiteSpace(await page.Locator("#problem-detail").InnerTextAsync()));
    }

    /// <summary>
    /// The demo's marks (UTM 33N) and fixes (WGS 84) as CSV files with the contract's column names; a fix without a
    /// mark keeps an empty mark cell and is paired by proximity, as in the demo's JSON request (radius 1 m).
    /// </summary>
    internal static (string Marks, string Fixes) DemoAsCsv()
    {
        var request = JsonNode.Parse(File.ReadAllText(HostileInputTests.DemoRequestPath()))!;
        var marks = new StringBuilder("id,e,n,h\n");
        foreach (var m in request["marks"]!["points"]!.AsArray())
            marks.Append(CultureInfo.InvariantCulture, $"{m!["id"]},{m["e"]},{m["n"]},{m["h"]}\n");
        var fixes = new StringBuilder("id,mark,lat,lon,h\n");
        foreach (var f in request["fixes"]!["points"]!.AsArray())
            fixes.Append(CultureInfo.InvariantCulture, $"{f!["id"]},{f["mark"]},{f["lat"]},{f["lon"]},{f["h"]}\n");
        return (marks.ToString(), fixes.ToString());
    }
}
