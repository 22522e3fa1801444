using System.Globalization;
using System.Text;
using System.Text.Json.Nodes;
using Microsoft.Playwright;
using Xunit.Abstractions;

namespace QaService.Browser.Tests;

/// <summary>
/// The guided upload as a person uses it, in the real service: settings and files, the preview where one column must be
/// changed (the fixes' latitude header is not a contract name, so the run fails without the change), the run, the report.
/// Once with script (live CRS suggestions, upload progress, under the page's CSP) and once with script turned off.
/// </summary>
[Collection(LiveServiceCollection.Name)]
public sealed class GuidedUploadPageTests(LiveService service, ITestOutputHelper output)
{
    /// <summary>The fixes' header: "latitude_deg" is what the reader cannot map by itself.</summary>
    private const string FixesHeader = "id,mark,latitude_deg,lon,h";

    [Fact]
    public async Task With_script_a_person_uploads_changes_a_column_and_reaches_the_report()
    {
        if (LiveService.SkipReason is { } skip)
        {
            output.WriteLine(skip);
            return;
        }

        await using var session = await BrowserSession.OpenAsync(service);
        var page = session.Page;
        await page.GotoAsync("/");
        await page.Locator("#start-guided").ClickAsync();
        await page.WaitForURLAsync("**/v1/uploads/new");

        // Live suggestions: typing a code fills the field's datalist from GET /v1/crs.
        await page.Locator("#marksCrs").PressSequentiallyAsync("3263");
        await page.Locator("#marksCrs-list option[value='EPSG:32633']").WaitForAsync(new LocatorWaitForOptions { State = WaitForSelectorState.Attached });
        Assert.Contains("matching CRS", await page.Locator("#marksCrs-status").InnerTextAsync());
        await page.Locator("#marksCrs").FillAsync("EPSG:32633");
        await FillRestAsync(page, "Guided with script", Files(null));

        // The files go by XMLHttpRequest with a progress bar; the response is held back a moment so the bar is seen.
        await page.RouteAsync("**/v1/uploads", async route =>
        {
            await Task.Delay(700);
            await route.ContinueAsync();
        });
        await page.Locator("#preview-button").ClickAsync();
        await page.Locator("#upload-progress-box").WaitForAsync(new LocatorWaitForOptions { State = WaitForSelectorState.Visible });
        // Read in the same evaluation that sees the bar move: the page may go on to the preview right after.
        var progress = await page.WaitForFunctionAsync(
            "() => { const bar = document.getElementById('upload-progress'); return bar && bar.value > 0 ? document.getElementById('upload-progress-text').textContent : null; }");
        Assert.Matches("Sending the files: [0-9]+ %|Sent", await progress.JsonValueAsync<string>());
        await page.WaitForURLAsync(new System.Text.RegularExpressions.Regex("/v1/uploads/[A-Za-z0-9_-]{43}$"));
        await page.UnrouteAllAsync();

        await ChangeColumnAndRunAsync(page, "Guided with script");
        Assert.Empty(session.Errors);
        Assert.Empty(session.ExternalRequests(service));
    }

    [Fact]
    public async Task Without_script_the_same_flow_works_with_the_search_button()
    {
        if (LiveService.SkipReason is { } skip)
        {
            output.WriteLine(skip);
            return;
        }

        await using var session = await BrowserSession.OpenAsync(service, javaScript: false);
        var page = session.Page;
        await page.GotoAsync("/v1/uploads/new");
        await page.Locator("#marksCrs").FillAsync("UTM zone 33N");
        await page.Locator("#marks-search").ClickAsync();
        await page.Locator("#marksCrs-matches").WaitForAsync();
        await page.Locator("#marksCrs-matches label", new PageLocatorOptions { HasText = "EPSG:32633" }).ClickAsync();
        Assert.True(await page.Locator("#marksCrs-matches input[value='EPSG:32633']").IsCheckedAsync());
        await FillRestAsync(page, "Guided without script", Files(null));
        await page.Locator("#preview-button").ClickAsync();
        await page.WaitForURLAsync(new System.Text.RegularExpressions.Regex("/v1/uploads/[A-Za-z0-9_-]{43}$"));
        Assert.Contains("EPSG:32633", await page.Locator("#settings").InnerTextAsync());

        await ChangeColumnAndRunAsync(page, "Guided without script");
        Assert.Empty(session.Errors);
    }

    [Fact]
    public async Task Errors_point_at_the_field_and_at_the_file_row()
    {
        if (LiveService.SkipReason is { } skip)
        {
            output.WriteLine(skip);
            return;
        }

        await using var session = await BrowserSession.OpenAsync(service, javaScript: false);
        var page = session.Page;
        await page.GotoAsync("/v1/uploads/new");
        await page.Locator("#marksCrs").FillAsync("EPSG:32633");
        // No required accuracy given: the form comes back with the error at the horizontal field.
        await FillRestAsync(page, "Guided errors", Files(4), horizontal: "");
        await page.Locator("#vertical").FillAsync("");
        await page.Locator("#preview-button").ClickAsync();
        await page.Locator("#error-summary").WaitForAsync();
        Assert.Equal("true", await page.Locator("#horizontal").GetAttributeAsync("aria-invalid"));
        Assert.Contains("horizontal-error", await page.Locator("#horizontal").GetAttributeAsync("aria-describedby"));
        Assert.Contains("give the required horizontal accuracy", await page.Locator("#horizontal-error").InnerTextAsync());
        // The files were staged with the first post: the page says so and they need not be chosen again.
        Assert.Equal("fixes.csv", await page.Locator("#fixes-received").InnerTextAsync());

        await page.Locator("#horizontal").FillAsync("0.328");
        await page.Locator("#horizontalUnit").SelectOptionAsync("ft");
        await page.Locator("#preview-button").ClickAsync();
        await page.WaitForURLAsync(new System.Text.RegularExpressions.Regex("/v1/uploads/[A-Za-z0-9_-]{43}$"));
        await page.Locator("#fixes-col-lat").SelectOptionAsync("latitude_deg");
        await page.Locator("#run-button").ClickAsync();

        // Line 4 of the fixes file has latitude 95: the page lists that row as written, at the lat column.
        var row = page.Locator("#fixes-row-4");
        await row.WaitForAsync();
        Assert.Contains(",95,", await row.InnerTextAsync());
        Assert.Contains("latitude_deg", await row.InnerTextAsync());
        Assert.Equal("true", await page.Locator("#fixes-col-lat").GetAttributeAsync("aria-invalid"));
        await page.Locator("#error-summary a[href='#fixes-row-4']").ClickAsync();
        Assert.EndsWith("#fixes-row-4", page.Url);
    }

    /// <summary>Everything of step one but the marks CRS.</summary>
    internal static async Task FillRestAsync(IPage page, string title, (FilePayload Marks, FilePayload Fixes) files, string horizontal = "10")
    {
        await page.Locator("#fixesCrs").FillAsync("EPSG:4979");
        await page.Locator("#standard").SelectOptionAsync("nssda");
        await page.Locator("#horizontal").FillAsync(horizontal);
        await page.Locator("#horizontalUnit").SelectOptionAsync("cm");
        await page.Locator("#vertical").FillAsync("0.15");
        await page.Locator("#pairingRadius").FillAsync("1");
        await page.Locator("#title").FillAsync(title);
        await page.Locator("#marks").SetInputFilesAsync(files.Marks);
        await page.Locator("#fixes").SetInputFilesAsync(files.Fixes);
    }

    /// <summary>The preview: the detector left lat unmapped; the person picks the column, runs, and reads the report.</summary>
    internal static async Task ChangeColumnAndRunAsync(IPage page, string title)
    {
        Assert.Contains("CSV", await page.Locator("#fixes-format").InnerTextAsync());
        Assert.Equal(5, await page.Locator("#fixes-preview tbody tr").CountAsync());
        Assert.Equal("", await page.Locator("#fixes-col-lat").InputValueAsync());
        Assert.Equal("lon", await page.Locator("#fixes-col-lon").InputValueAsync());
        await page.Locator("#fixes-col-lat").SelectOptionAsync("latitude_deg");
        await page.Locator("#run-button").ClickAsync();
        await page.WaitForURLAsync("**/report.html");
        Assert.Equal("PASS", await page.Locator("#verdict").InnerTextAsync());
        Assert.Equal(title, await page.Locator("h1").InnerTextAsync());
    }

    /// <summary>
    /// The demo's marks (UTM 33N) and fixes (WGS 84) as CSV, the fixes under <see cref="FixesHeader"/>; with
    /// <paramref name="badLatitudeLine"/> that physical line of the fixes gets latitude 95.
    /// </summary>
    internal static (FilePayload Marks, FilePayload Fixes) Files(int? badLatitudeLine)
    {
        var request = JsonNode.Parse(File.ReadAllText(HostileInputTests.DemoRequestPath()))!;
        var marks = new StringBuilder("id,e,n,h\n");
        foreach (var m in request["marks"]!["points"]!.AsArray())
            marks.Append(CultureInfo.InvariantCulture, $"{m!["id"]},{m["e"]},{m["n"]},{m["h"]}\n");
        var fixes = new StringBuilder(FixesHeader + "\n");
        var line = 1;
        foreach (var f in request["fixes"]!["points"]!.AsArray())
        {
            var lat = ++line == badLatitudeLine ? 95.0 : f!["lat"]!.GetValue<double>();
            fixes.Append(CultureInfo.InvariantCulture, $"{f!["id"]},{f["mark"]},{lat},{f["lon"]},{f["h"]}\n");
        }
        return (new FilePayload { Name = "marks.csv", MimeType = "text/csv", Buffer = Encoding.UTF8.GetBytes(marks.ToString()) },
            new FilePayload { Name = "fixes.csv", MimeType = "text/csv", Buffer = Encoding.UTF8.GetBytes(fixes.ToString()) });
    }
}
