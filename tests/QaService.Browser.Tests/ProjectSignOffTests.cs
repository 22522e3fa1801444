using System.Net;
using System.Text;
using System.Text.Json;
using Microsoft.Playwright;
using Xunit.Abstractions;

namespace QaService.Browser.Tests;

/// <summary>
/// A project walked end to end in a real browser: two deliveries uploaded through the form with the project's id, each
/// accepted on its report page, and the project page showing both as accepted with the trend of their figures.
/// </summary>
[Collection(LiveServiceCollection.Name)]
public sealed class ProjectSignOffTests(LiveService service, ITestOutputHelper output)
{
    [Fact]
    public async Task Two_deliveries_are_uploaded_accepted_and_shown_on_the_project_page()
    {
        if (LiveService.SkipReason is { } skip)
        {
            output.WriteLine(skip);
            return;
        }

        // The project is made through the API (there is no page for it); its spec is what the uploads inherit.
        var created = await service.Http.PostAsync("v1/projects", new StringContent(
            """{ "name": "Ashgrove lighting contract", "spec": { "standard": "nssda", "horizontal": 0.10, "vertical": 0.15 } }""", Encoding.UTF8, "application/json"));
        Assert.Equal(HttpStatusCode.Created, created.StatusCode);
        var project = JsonDocument.Parse(await created.Content.ReadAsStringAsync()).RootElement.GetProperty("id").GetString()!;

        var (marksCsv, fixesCsv) = UploadFormTests.DemoAsCsv();
        await using var session = await BrowserSession.OpenAsync(service);
        var page = session.Page;
        var reports = new List<string>();
        foreach (var (title, reviewer) in new[] { ("Ashgrove delivery 1", "I. Marsh"), ("Ashgrove delivery 2", "I. Marsh") })
        {
            await page.GotoAsync("/");
            await page.Locator("#options").FillAsync($$"""
                { "title": "{{title}}", "projectId": "{{project}}",
                  "marks": { "crs": "EPSG:32633", "heights": "ellipsoidal" },
                  "fixes": { "crs": "EPSG:4979", "heights": "ellipsoidal" },
                  "pairing": { "radius": 1.0 } }
                """);
            await page.Locator("#marks").SetInputFilesAsync(new FilePayload { Name = "marks.csv", MimeType = "text/csv", Buffer = Encoding.UTF8.GetBytes(marksCsv) });
            await page.Locator("#fixes").SetInputFilesAsync(new FilePayload { Name = "fixes.csv", MimeType = "text/csv", Buffer = Encoding.UTF8.GetBytes(fixesCsv) });
            await page.Locator("#upload button[type=submit]").ClickAsync();
            await page.WaitForURLAsync("**/report.html");
            // No spec in the options: the verdict is the project's (the demo passes 0.10/0.15 m), not "inconclusive".
            Assert.Equal("PASS", await page.Locator("#verdict").InnerTextAsync());
            Assert.Contains("awaiting decision", await page.Locator("#acceptance-state").InnerTextAsync());
            reports.Add(new Uri(page.Url).AbsolutePath.Split('/')[^2]);

            await page.Locator("#decision-form input[value=accepted]").CheckAsync();
            await page.Locator("#decision-by").FillAsync(reviewer);
            await page.Locator("#decision-comment").FillAsync("checked against the contract");
            await page.Locator("#decision-form button[type=submit]").ClickAsync();
            await page.WaitForURLAsync("**/report.html#sign-off");
            Assert.Contains("accepted", await page.Locator("#acceptance-state").InnerTextAsync());
            Assert.Equal(1, await page.Locator("#decisions tbody tr").CountAsync());
            Assert.Equal(64, (await page.Locator("#report-sha256").InnerTextAsync()).Length);
            await page.Locator("#sign-off").ScreenshotAsync(new LocatorScreenshotOptions { Path = Path.Combine(LiveService.ArtifactFolder, "report-sign-off.png") });
        }

        await page.GotoAsync($"/v1/projects/{project}/report.html");
        Assert.Equal("Ashgrove lighting contract", await page.Locator("h1").InnerTextAsync());
        var rows = page.Locator("#delivery-table tbody tr");
        Assert.Equal(2, await rows.CountAsync());
        for (int i = 0; i < 2; i++)
        {
            Assert.Equal(reports[i], await rows.Nth(i).GetAttributeAsync("data-assessment"));
            Assert.Contains("accepted", await rows.Nth(i).Locator(".acceptance").InnerTextAsync());
        }
        Assert.Equal(2, await page.Locator("#plot-trend .s-nh circle").CountAsync());
        Assert.Equal(2, await page.Locator("#trend-table tbody tr").CountAsync());
        Assert.Empty(session.Errors);
        Assert.Empty(session.ExternalRequests(service));
        await page.ScreenshotAsync(new PageScreenshotOptions { Path = Path.Combine(LiveService.ArtifactFolder, "project-page.png"), FullPage = true });
    }
}
