using Microsoft.Playwright;
using Xunit.Abstractions;

namespace QaService.Browser.Tests;

/// <summary>
/// axe-core on every page of the web UI as rendered by the real service, in the states a person meets: the home page,
/// the upload form (fresh, with CRS search results, with errors), the preview (fresh and with row errors) and a report.
/// 0 serious or critical violations; color-contrast measured on each.
/// </summary>
[Collection(LiveServiceCollection.Name)]
public sealed class AccessibilityTests(LiveService service, ITestOutputHelper output)
{
    [Fact]
    public async Task Home_upload_preview_and_report_pages_have_no_serious_violations()
    {
        if (LiveService.SkipReason is { } skip)
        {
            output.WriteLine(skip);
            return;
        }

        await using var session = await BrowserSession.OpenAsync(service, bypassCsp: true);
        var page = session.Page;
        await page.GotoAsync("/");
        await AxeAudit.AssertNoSeriousViolationsAsync(page);

        await page.GotoAsync("/v1/uploads/new");
        await AxeAudit.AssertNoSeriousViolationsAsync(page);

        await page.Locator("#fixesCrs").FillAsync("ETRS89 UTM 33");
        await page.Locator("#fixes-search").ClickAsync();
        await page.Locator("#fixesCrs-matches").WaitForAsync();
        await AxeAudit.AssertNoSeriousViolationsAsync(page);

        var (marks, fixes) = GuidedUploadPageTests.Files(3);
        await page.Locator("#marksCrs").FillAsync("EPSG:32633");
        await page.Locator("#fixesCrs").FillAsync("not a crs");
        await page.Locator("#marks").SetInputFilesAsync(marks);
        await page.Locator("#fixes").SetInputFilesAsync(fixes);
        await page.Locator("#preview-button").ClickAsync();
        await page.Locator("#error-summary").WaitForAsync();
        await AxeAudit.AssertNoSeriousViolationsAsync(page);

        await page.Locator("#fixesCrs").FillAsync("EPSG:4979");
        await page.Locator("#horizontal").FillAsync("0.1");
        await page.Locator("#preview-button").ClickAsync();
        await page.Locator("#fixes-columns").WaitForAsync();
        await AxeAudit.AssertNoSeriousViolationsAsync(page);

        await page.Locator("#fixes-col-lat").SelectOptionAsync("latitude_deg");
        await page.Locator("#run-button").ClickAsync();
        await page.Locator("#fixes-row-3").WaitForAsync();
        await AxeAudit.AssertNoSeriousViolationsAsync(page);

        await page.GotoAsync("/v1/assessments/demo/report.html");
        await AxeAudit.AssertNoSeriousViolationsAsync(page);
    }
}
