using System.Globalization;
using System.Net;
using System.Text.Json;
using Microsoft.AspNetCore.Hosting;
using Microsoft.AspNetCore.TestHost;
using Microsoft.Extensions.DependencyInjection;
using QaService.Api.Tests.Support;

namespace QaService.Api.Tests;

/// <summary>
/// The guided upload's staging endpoints end to end through the in-memory host: stage, preview, run; tokens that are
/// malformed, unknown, expired or another tenant's; the size cap; errors shown at the field and at the file row.
/// </summary>
public sealed class GuidedUploadTests : IDisposable
{
    private readonly QaServiceFactory factory = new();

    public void Dispose() => factory.Dispose();

    [Fact]
    public async Task A_changed_column_is_what_makes_the_run_reach_the_report()
    {
        var client = GuidedUploadClient.For(factory);
        // "latitude_deg" is not a contract name: the reader's detection leaves lat unmapped, so the person must choose it.
        var (marks, fixes) = GuidedUploadClient.DemoFiles("id,mark,latitude_deg,lon,h");
        var staged = await client.StageAsync(GuidedUploadClient.DemoSettings(), marks, fixes);
        Assert.Equal(HttpStatusCode.SeeOther, staged.StatusCode);
        var preview = staged.Headers.Location!.OriginalString;
        Assert.Matches("^/v1/uploads/[A-Za-z0-9_-]{43}$", preview);

        var page = await client.Http.GetStringAsync(preview);
        Assert.Contains("Format: <strong>CSV", page);
        Assert.Contains("<th scope=\"col\">latitude_deg</th>", page);
        Assert.Contains("<select id=\"fixes-col-lat\" name=\"fixes.lat\"><option value=\"\" selected>", page);
        Assert.Contains("<option value=\"lon\" selected>lon</option>", page);
        Assert.Contains("<option value=\"e\" selected>e</option>", page);

        // Run as detected: every fix lacks its latitude; the page names the rows and the column.
        var detected = new Dictionary<string, string> { ["marks.id"] = "id", ["marks.e"] = "e", ["marks.n"] = "n", ["marks.h"] = "h",
            ["fixes.id"] = "id", ["fixes.mark"] = "mark", ["fixes.lat"] = "", ["fixes.lon"] = "lon", ["fixes.h"] = "h" };
        var failed = await client.RunAsync(preview, detected);
        Assert.Equal(HttpStatusCode.BadRequest, failed.StatusCode);
        var failedPage = await failed.Content.ReadAsStringAsync();
        Assert.Contains("id=\"fixes-row-2\"", failedPage);
        Assert.Contains("<select id=\"fixes-col-lat\" name=\"fixes.lat\" aria-describedby=\"fixes-errors\" aria-invalid=\"true\">", failedPage);

        var changed = new Dictionary<string, string>(detected) { ["fixes.lat"] = "latitude_deg" };
        var run = await client.RunAsync(preview, changed);
        Assert.Equal(HttpStatusCode.SeeOther, run.StatusCode);
        var reportPage = run.Headers.Location!.OriginalString;
        Assert.Matches("^/v1/assessments/[^/]+/report.html$", reportPage);
        Assert.Equal(HttpStatusCode.OK, (await client.Http.GetAsync(reportPage)).StatusCode);

        // The same figures as the demo's JSON request; 10 cm became 0.1 m.
        var report = JsonDocument.Parse(await client.Http.GetStringAsync(reportPage.Replace("/report.html", "", StringComparison.Ordinal))).RootElement;
        var demo = await DemoReportAsync();
        Assert.Equal(demo.GetProperty("counts").GetProperty("paired").GetInt32(), report.GetProperty("counts").GetProperty("paired").GetInt32());
        Assert.Equal(demo.GetProperty("horizontal").GetProperty("rmseR").GetDouble(), report.GetProperty("horizontal").GetProperty("rmseR").GetDouble(), 1e-9);
        Assert.Equal(0.1, report.GetProperty("spec").GetProperty("horizontal").GetDouble());
        Assert.Equal("Guided upload check", report.GetProperty("title").GetString());

        // Run once: the staged files are gone afterwards.
        Assert.Equal(HttpStatusCode.NotFound, (await client.Http.GetAsync(preview)).StatusCode);
    }

    [Theory]
    [InlineData("not-a-token")]
    [InlineData("AAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAA")]
    public async Task An_unknown_or_malformed_token_is_404(string token)
    {
        var client = GuidedUploadClient.For(factory);
        Assert.Equal(HttpStatusCode.NotFound, (await client.Http.GetAsync($"/v1/uploads/{token}")).StatusCode);
        Assert.Equal(HttpStatusCode.NotFound, (await client.Http.GetAsync($"/v1/uploads/new?token={token}")).StatusCode);
        var run = await client.Http.PostAsync($"/v1/uploads/{token}/run",
            new FormUrlEncodedContent(new Dictionary<string, string> { ["__RequestVerificationToken"] = await client.TokenOfAsync("/v1/uploads/new") }));
        Assert.Equal(HttpStatusCode.NotFound, run.StatusCode);
    }

    [Fact]
    public async Task An_expired_upload_is_410_and_removed()
    {
        var clock = new ShiftedClock();
        using var host = factory.WithWebHostBuilder(b => b.ConfigureTestServices(s => s.AddSingleton<TimeProvider>(clock)));
        var client = GuidedUploadClient.For(host);
        var (marks, fixes) = GuidedUploadClient.DemoFiles();
        var preview = (await client.StageAsync(GuidedUploadClient.DemoSettings(), marks, fixes)).Headers.Location!.OriginalString;
        Assert.Equal(HttpStatusCode.OK, (await client.Http.GetAsync(preview)).StatusCode);

        clock.Shift = TimeSpan.FromMinutes(61); // Uploads:StagingMinutes defaults to 60
        Assert.Equal(HttpStatusCode.Gone, (await client.Http.GetAsync(preview)).StatusCode);
        // Removed on that answer: afterwards it is simply unknown.
        Assert.Equal(HttpStatusCode.NotFound, (await client.Http.GetAsync(preview)).StatusCode);
    }

    [Fact]
    public async Task A_file_over_the_cap_is_413_at_its_field()
    {
        using var small = new QaServiceFactory(extra: new Dictionary<string, string?> { ["Uploads:MaxStagedFileBytes"] = "1000" });
        var client = GuidedUploadClient.For(small);
        var (_, fixes) = GuidedUploadClient.DemoFiles();
        Assert.True(fixes.Length > 1000);
        var response = await client.StageAsync(GuidedUploadClient.DemoSettings(), "id,e,n\nA,1,2\n"u8.ToArray(), fixes);
        Assert.Equal(HttpStatusCode.RequestEntityTooLarge, response.StatusCode);
        var page = await response.Content.ReadAsStringAsync();
        Assert.Contains("id=\"fixes-error\"", page);
        Assert.Contains("id=\"fixes\" name=\"fixes\" accept=\"" + ".csv,.txt,.geojson,.json,.gpx,.nmea,.nma,.log\" aria-describedby=\"fixes-hint fixes-error\" aria-invalid=\"true\"", page);
        // The marks file within the cap was kept: the page says so and carries the token.
        Assert.Contains("id=\"marks-received\"", page);
        Assert.Contains("name=\"token\"", page);
    }

    [Fact]
    public async Task A_row_error_is_shown_at_its_row_with_the_row_as_written()
    {
        var client = GuidedUploadClient.For(factory);
        var (marks, fixes) = GuidedUploadClient.DemoFiles(editFixLine: (line, text) => line == 4 ? text.Replace(",48.", ",95.", StringComparison.Ordinal) : text);
        var preview = (await client.StageAsync(GuidedUploadClient.DemoSettings(), marks, fixes)).Headers.Location!.OriginalString;
        var run = await client.RunAsync(preview, new Dictionary<string, string> { ["fixes.lat"] = "lat", ["fixes.lon"] = "lon", ["fixes.id"] = "id", ["fixes.mark"] = "mark", ["fixes.h"] = "h",
            ["marks.id"] = "id", ["marks.e"] = "e", ["marks.n"] = "n", ["marks.h"] = "h" });
        Assert.Equal(HttpStatusCode.BadRequest, run.StatusCode);
        var page = await run.Content.ReadAsStringAsync();
        var row = page[page.IndexOf("<tr id=\"fixes-row-4\"", StringComparison.Ordinal)..];
        row = row[..row.IndexOf("</tr>", StringComparison.Ordinal)];
        Assert.Contains(">lat<", row);
        Assert.Contains(",95.", row);
        Assert.Contains("<a href=\"#fixes-row-4\">", page);
    }

    [Fact]
    public async Task Settings_errors_are_shown_next_to_their_fields()
    {
        var client = GuidedUploadClient.For(factory);
        var (marks, fixes) = GuidedUploadClient.DemoFiles();
        var settings = GuidedUploadClient.DemoSettings();
        settings["marksCrs"] = "EPSG:99999999";
        settings["horizontal"] = "ten";
        var response = await client.StageAsync(settings, marks, fixes);
        Assert.Equal(HttpStatusCode.BadRequest, response.StatusCode);
        var page = await response.Content.ReadAsStringAsync();
        Assert.Contains("aria-describedby=\"marksCrs-hint marksCrs-error\" aria-invalid=\"true\"", page);
        Assert.Contains("id=\"horizontal\" name=\"horizontal\" value=\"ten\" inputmode=\"decimal\" autocomplete=\"off\" aria-describedby=\"horizontal-hint horizontal-error\" aria-invalid=\"true\"", page);
        Assert.Contains("<a href=\"#horizontal\">", page);
        Assert.DoesNotContain("id=\"vertical-error\"", page);
    }

    [Fact]
    public async Task Search_without_script_lists_matches_and_a_pick_is_used()
    {
        var client = GuidedUploadClient.For(factory);
        var settings = GuidedUploadClient.DemoSettings();
        settings["marksCrs"] = "UTM zone 33N";
        var search = await client.StageAsync(settings, null, null, "search-marks");
        Assert.Equal(HttpStatusCode.OK, search.StatusCode);
        var page = await search.Content.ReadAsStringAsync();
        Assert.Contains("name=\"marksCrsPick\" id=\"marksCrsPick-", page);
        Assert.Contains("value=\"EPSG:32633\"", page);

        var (marks, fixes) = GuidedUploadClient.DemoFiles();
        settings["marksCrsPick"] = "EPSG:32633";
        var staged = await client.StageAsync(settings, marks, fixes);
        Assert.Equal(HttpStatusCode.SeeOther, staged.StatusCode);
        Assert.Contains("<dd>EPSG:32633 ", await client.Http.GetStringAsync(staged.Headers.Location!.OriginalString));
    }

    [Fact]
    public async Task A_post_without_the_antiforgery_token_is_refused()
    {
        var client = GuidedUploadClient.For(factory);
        await client.TokenOfAsync("/v1/uploads/new");
        var (marks, fixes) = GuidedUploadClient.DemoFiles();
        var response = await client.StageAsync(GuidedUploadClient.DemoSettings(), marks, fixes, antiforgery: "forged");
        Assert.Equal(HttpStatusCode.BadRequest, response.StatusCode);
    }

    [Fact]
    public async Task Another_tenants_staged_upload_is_404()
    {
        using var host = new KeysHost();
        var (_, north) = await host.CreateTenantAsync();
        var (_, south) = await host.CreateTenantAsync();
        var northClient = GuidedUploadClient.For(host.Factory, north);
        var (marks, fixes) = GuidedUploadClient.DemoFiles();
        var staged = await northClient.StageAsync(GuidedUploadClient.DemoSettings(), marks, fixes);
        Assert.Equal(HttpStatusCode.SeeOther, staged.StatusCode);
        var preview = staged.Headers.Location!.OriginalString;
        Assert.Equal(HttpStatusCode.OK, (await northClient.Http.GetAsync(preview)).StatusCode);

        var southClient = GuidedUploadClient.For(host.Factory, south);
        Assert.Equal(HttpStatusCode.NotFound, (await southClient.Http.GetAsync(preview)).StatusCode);
        var run = await southClient.Http.PostAsync($"{preview}/run", new FormUrlEncodedContent(new Dictionary<string, string>
            { ["__RequestVerificationToken"] = await southClient.TokenOfAsync("/v1/uploads/new") }));
        Assert.Equal(HttpStatusCode.NotFound, run.StatusCode);
        // Without a key the pages are not served at all.
        Assert.Equal(HttpStatusCode.Unauthorized, (await host.Client(null).GetAsync(preview)).StatusCode);
        // The owner can still run it.
        Assert.Equal(HttpStatusCode.SeeOther, (await northClient.RunAsync(preview, new Dictionary<string, string>())).StatusCode);
    }

    private async Task<JsonElement> DemoReportAsync()
    {
        var client = factory.CreateClient();
        var body = await File.ReadAllTextAsync(GuidedUploadClient.DemoPath());
        var response = await client.PostAsync("/v1/assessments", new StringContent(body, System.Text.Encoding.UTF8, "application/json"));
        return JsonDocument.Parse(await response.Content.ReadAsStringAsync()).RootElement;
    }

    /// <summary>The system clock moved forward by <see cref="Shift"/>.</summary>
    private sealed class ShiftedClock : TimeProvider
    {
        public TimeSpan Shift { get; set; }

        public override DateTimeOffset GetUtcNow() => base.GetUtcNow() + Shift;
    }
}
