using System.Net;
using System.Text;
using System.Text.Json;
using System.Text.Json.Nodes;
using Microsoft.Playwright;
using Xunit.Abstractions;

namespace QaService.Browser.Tests;

/// <summary>
/// Under Auth:Mode=keys, end to end in Chromium: a person signs in with a key, sees the team's reports and nobody
/// else's, signs out; a share link opens the report in a fresh browser with no key until it is revoked or expires.
/// </summary>
[Collection(KeysLiveServiceCollection.Name)]
public sealed class SignInAndShareTests(KeysLiveService service, ITestOutputHelper output)
{
    [Fact]
    public async Task Signing_in_with_a_key_opens_the_teams_reports_and_no_one_elses()
    {
        if (LiveService.SkipReason is { } skip)
        {
            output.WriteLine(skip);
            return;
        }

        var (_, key) = await service.CreateTenantAsync();
        var (_, otherKey) = await service.CreateTenantAsync();
        var own = await CreateReportAsync(key, "Hydrant check, Larkfield east");
        var foreign = await CreateReportAsync(otherKey, "Valve survey, Ormsby");

        await using var session = await BrowserSession.OpenAsync(service);
        var page = session.Page;
        await page.GotoAsync("/");
        await page.Locator("#apiKey").FillAsync("qak_notAKeyOfThisService000000000000000000000");
        await page.Locator("#sign-in button[type=submit]").ClickAsync();
        await page.WaitForSelectorAsync("#apiKey-error");
        Assert.Contains("not valid", await page.Locator("#apiKey-error").InnerTextAsync());
        output.WriteLine($"after the wrong key: {string.Join(" | ", session.Errors)}");
        // The refused sign-in answers 401, which Chromium logs as a failed load; nothing after it may log an error.
        Assert.All(session.Errors, e => Assert.Contains("401", e));
        session.Errors.Clear();

        await page.Locator("#apiKey").FillAsync(key);
        await page.Locator("#sign-in button[type=submit]").ClickAsync();
        await page.WaitForSelectorAsync("#recent");
        Assert.Equal(0, await page.Locator("#recent a", new PageLocatorOptions { HasText = "Valve survey, Ormsby" }).CountAsync());
        await page.Locator("#recent a", new PageLocatorOptions { HasText = "Hydrant check, Larkfield east" }).First.ClickAsync();
        try
        {
            await page.WaitForURLAsync($"**{own}/report.html");
        }
        catch (TimeoutException)
        {
            // Seen once under CI load and not reproduced: say where the page was, so the next one can be explained.
            output.WriteLine($"waiting for the report: page at {page.Url}, title \"{await page.TitleAsync()}\", errors: {string.Join(" | ", session.Errors)}");
            throw;
        }
        Assert.Equal("Hydrant check, Larkfield east", await page.Locator("h1").InnerTextAsync());
        Assert.Empty(session.Errors);

        var response = await page.GotoAsync($"{foreign}/report.html");
        Assert.Equal(404, response!.Status);

        await page.GotoAsync("/");
        await page.Locator("#sign-out button[type=submit]").ClickAsync();
        await page.WaitForSelectorAsync("#sign-in");
        Assert.Equal(401, (await page.GotoAsync($"{own}/report.html"))!.Status);
    }

    [Fact]
    public async Task A_share_link_opens_the_report_without_a_key_until_revoked_or_expired()
    {
        if (LiveService.SkipReason is { } skip)
        {
            output.WriteLine(skip);
            return;
        }

        var (_, key) = await service.CreateTenantAsync();
        var report = await CreateReportAsync(key, "Manhole lids, Brackwater");
        var (linkId, url, _) = await ShareAsync(key, report, 72);

        // A fresh browser context: no cookies, no key.
        await using (var stranger = await BrowserSession.OpenAsync(service))
        {
            var opened = await stranger.Page.GotoAsync(url);
            Assert.Equal(200, opened!.Status);
            Assert.Equal("Manhole lids, Brackwater", await stranger.Page.Locator("h1").InnerTextAsync());
            var csvHref = await stranger.Page.Locator("a", new PageLocatorOptions { HasText = "CSV" }).First.GetAttributeAsync("href");
            Assert.StartsWith("/shared/", csvHref);
            Assert.Equal(HttpStatusCode.OK, (await service.Http.GetAsync(csvHref!.TrimStart('/'))).StatusCode);
            Assert.Empty(stranger.ExternalRequests(service));
        }

        Assert.Equal(HttpStatusCode.NoContent, (await service.Send(HttpMethod.Delete, $"{report.TrimStart('/')}/share-links/{linkId}", key)).StatusCode);
        await using (var stranger = await BrowserSession.OpenAsync(service))
        {
            Assert.Equal(404, (await stranger.Page.GotoAsync(url))!.Status);
            Assert.True(await stranger.Page.Locator("#share-gone").IsVisibleAsync());
        }

        // A short link (0.0015 h = 5.4 s) opens at once and is 404 once its expiresAt has passed.
        var (_, shortUrl, expiresAt) = await ShareAsync(key, report, 0.0015);
        await using (var stranger = await BrowserSession.OpenAsync(service))
        {
            Assert.Equal(200, (await stranger.Page.GotoAsync(shortUrl))!.Status);
            var wait = expiresAt - DateTimeOffset.UtcNow + TimeSpan.FromMilliseconds(500);
            if (wait > TimeSpan.Zero)
                await Task.Delay(wait);
            Assert.Equal(404, (await stranger.Page.GotoAsync(shortUrl))!.Status);
        }
    }

    /// <summary>Stores the demo request under another title for the tenant; returns the report's path.</summary>
    internal async Task<string> CreateReportAsync(string key, string title)
    {
        var request = JsonNode.Parse(await File.ReadAllTextAsync(HostileInputTests.DemoRequestPath()))!;
        request["title"] = title;
        var response = await service.Send(HttpMethod.Post, "v1/assessments", key, new StringContent(request.ToJsonString(), Encoding.UTF8, "application/json"));
        Assert.Equal(HttpStatusCode.Created, response.StatusCode);
        return response.Headers.Location!.OriginalString;
    }

    internal async Task<(string Id, string Url, DateTimeOffset ExpiresAt)> ShareAsync(string key, string report, double hours)
    {
        var response = await service.Send(HttpMethod.Post, $"{report.TrimStart('/')}/share-links", key,
            new StringContent(JsonSerializer.Serialize(new { expiresInHours = hours }), Encoding.UTF8, "application/json"));
        var text = await response.Content.ReadAsStringAsync();
        Assert.True(response.StatusCode == HttpStatusCode.Created, text);
        var body = JsonDocument.Parse(text).RootElement;
        return (body.GetProperty("id").GetString()!, body.GetProperty("url").GetString()!, body.GetProperty("expiresAt").GetDateTimeOffset());
    }
}
