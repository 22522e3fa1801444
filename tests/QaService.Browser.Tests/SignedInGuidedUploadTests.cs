using Microsoft.Playwright;
using Xunit.Abstractions;

namespace QaService.Browser.Tests;

/// <summary>
/// The whole way a QA lead and a crew use a shared deployment (Auth:Mode=keys), in Chromium against the real service:
/// sign in with the team's key, upload two files through the guided page, change the one column the reader could not
/// map, reach the report; another team's report stays 404; a share link opens the new report in a fresh browser with
/// no key, and is 404 once revoked. (Expiry of a link: <see cref="SignInAndShareTests"/>.)
/// </summary>
[Collection(KeysLiveServiceCollection.Name)]
public sealed class SignedInGuidedUploadTests(KeysLiveService service, ITestOutputHelper output)
{
    [Fact]
    public async Task A_signed_in_crew_uploads_through_the_guided_page_and_shares_the_report()
    {
        if (LiveService.SkipReason is { } skip)
        {
            output.WriteLine(skip);
            return;
        }

        var (_, key) = await service.CreateTenantAsync();
        var (_, otherKey) = await service.CreateTenantAsync();
        var sharing = new SignInAndShareTests(service, output);
        var foreign = await sharing.CreateReportAsync(otherKey, "Valve survey, Ormsby");

        await using var session = await BrowserSession.OpenAsync(service);
        var page = session.Page;
        await page.GotoAsync("/");
        await page.Locator("#apiKey").FillAsync(key);
        await page.Locator("#sign-in button[type=submit]").ClickAsync();
        await page.Locator("#start-guided").ClickAsync();
        await page.WaitForURLAsync("**/v1/uploads/new");
        await page.Locator("#marksCrs").FillAsync("EPSG:32633");
        await GuidedUploadPageTests.FillRestAsync(page, "Hydrants, Larkfield north (signed in)", GuidedUploadPageTests.Files(null));
        await page.Locator("#preview-button").ClickAsync();
        await page.WaitForURLAsync(new System.Text.RegularExpressions.Regex("/v1/uploads/[A-Za-z0-9_-]{43}$"));
        await GuidedUploadPageTests.ChangeColumnAndRunAsync(page, "Hydrants, Larkfield north (signed in)");
        var report = new Uri(page.Url).AbsolutePath[..^"/report.html".Length];
        Assert.Empty(session.Errors);

        Assert.Equal(404, (await page.GotoAsync($"{foreign}/report.html"))!.Status);

        var (linkId, url, _) = await sharing.ShareAsync(key, report, 72);
        await using (var stranger = await BrowserSession.OpenAsync(service))
        {
            var opened = await stranger.Page.GotoAsync(url);
            Assert.Equal(200, opened!.Status);
            Assert.Equal("Hydrants, Larkfield north (signed in)", await stranger.Page.Locator("h1").InnerTextAsync());
            var revoked = await service.Send(HttpMethod.Delete, $"{report.TrimStart('/')}/share-links/{linkId}", key);
            Assert.Equal(System.Net.HttpStatusCode.NoContent, revoked.StatusCode);
            Assert.Equal(404, (await stranger.Page.GotoAsync(url))!.Status);
        }
    }
}
