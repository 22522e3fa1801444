using System.Net;
using System.Net.Http.Headers;
using System.Text;
using Microsoft.AspNetCore.TestHost;
using Microsoft.Extensions.DependencyInjection;
using QaService.Api.Tests.Support;

namespace QaService.Api.Tests.Production;

/// <summary>
/// Sign-in for people under Auth:Mode=keys: the form at /, the session cookie (RFC 6265bis attributes HttpOnly,
/// SameSite=Lax, Secure over HTTPS), tenant scoping of every view, antiforgery on every form and on cookie-made
/// /v1 changes (OWASP CSRF Prevention Cheat Sheet: synchronizer token), sign-out and sliding expiry.
/// </summary>
public sealed class SignInTests(KeysHost host) : IClassFixture<KeysHost>
{
    [Fact]
    public async Task Without_a_session_the_start_page_is_the_sign_in_form_with_a_token()
    {
        var html = await BrowserLike.Client(host.Factory).GetStringAsync("/");
        Assert.Contains("<form id=\"sign-in\" method=\"post\" action=\"/ui/sign-in\">", html);
        Assert.Contains("name=\"apiKey\"", html);
        Assert.False(string.IsNullOrEmpty(BrowserLike.FormToken(html)));
        Assert.DoesNotContain("id=\"recent\"", html);
        Assert.DoesNotContain("id=\"upload\"", html);
    }

    [Theory]
    [InlineData("qak_thisIsNotAKeyThatWasEverIssued0000000000", HttpStatusCode.Unauthorized)]
    [InlineData("", HttpStatusCode.BadRequest)]
    public async Task A_wrong_key_shows_the_form_again_with_the_error_beside_the_field(string key, HttpStatusCode status)
    {
        var client = BrowserLike.Client(host.Factory);
        var response = await BrowserLike.SignInAsync(client, key);
        var html = await response.Content.ReadAsStringAsync();
        Assert.Equal(status, response.StatusCode);
        Assert.Contains("aria-describedby=\"apiKey-error\"", html);
        Assert.Matches("id=\"apiKey-error\"[^>]*>[^<]+</strong>", html);
        Assert.DoesNotContain(" at QaService", html);
        Assert.False(response.Headers.TryGetValues("Set-Cookie", out var cookies) && cookies.Any(c => c.StartsWith("qaservice_session=", StringComparison.Ordinal)));
    }

    [Fact]
    public async Task The_session_cookie_is_HttpOnly_SameSite_Lax_and_Secure_only_over_https()
    {
        var (_, key) = await host.CreateTenantAsync();
        var plain = await BrowserLike.SignInAsync(BrowserLike.Client(host.Factory), key);
        Assert.Equal(HttpStatusCode.SeeOther, plain.StatusCode);
        Assert.Equal("/", plain.Headers.Location!.OriginalString);
        var cookie = plain.Headers.GetValues("Set-Cookie").Single(c => c.StartsWith("qaservice_session=", StringComparison.Ordinal)).ToLowerInvariant();
        Assert.Contains("httponly", cookie);
        Assert.Contains("samesite=lax", cookie);
        Assert.DoesNotContain("secure", cookie);

        var secure = await BrowserLike.SignInAsync(BrowserLike.Client(host.Factory, "https://localhost"), key);
        Assert.Equal(HttpStatusCode.SeeOther, secure.StatusCode);
        Assert.Contains("secure", secure.Headers.GetValues("Set-Cookie").Single(c => c.StartsWith("qaservice_session=", StringComparison.Ordinal)).ToLowerInvariant());
    }

    [Fact]
    public async Task A_session_sees_every_view_of_its_own_reports_and_404_for_another_tenants()
    {
        var (_, north) = await host.CreateTenantAsync("north-" + Guid.NewGuid().ToString("N"));
        var (_, south) = await host.CreateTenantAsync();
        var northTitle = Requests.Minimal();
        northTitle["title"] = "North <batch> 7";
        var own = (await host.Client(north).PostJsonAsync(northTitle)).Headers.Location!.OriginalString;
        var foreign = (await host.Client(south).PostJsonAsync(Requests.Minimal())).Headers.Location!.OriginalString;

        var browser = BrowserLike.Client(host.Factory);
        Assert.Equal(HttpStatusCode.SeeOther, (await BrowserLike.SignInAsync(browser, north)).StatusCode);
        var home = await browser.GetStringAsync("/");
        Assert.Contains("North &lt;batch&gt; 7", home);
        Assert.Contains("id=\"sign-out\"", home);
        Assert.Contains("id=\"upload\"", home);
        Assert.DoesNotContain(foreign.Split('/').Last(), home);

        foreach (var path in TenantKeyTests.TenantScopedReadPaths(own))
            Assert.Equal(HttpStatusCode.OK, (await browser.GetAsync(path)).StatusCode);
        using var asHtml = new HttpRequestMessage(HttpMethod.Get, own);
        asHtml.Headers.Accept.ParseAdd("text/html");
        var page = await browser.SendAsync(asHtml);
        Assert.Equal("text/html", page.Content.Headers.ContentType?.MediaType);
        foreach (var path in TenantKeyTests.TenantScopedReadPaths(foreign))
            await ProblemAssert.IsProblemAsync(await browser.GetAsync(path), HttpStatusCode.NotFound);
    }

    [Fact]
    public async Task A_session_changes_v1_only_with_the_antiforgery_header()
    {
        var (_, key) = await host.CreateTenantAsync();
        var browser = BrowserLike.Client(host.Factory);
        await BrowserLike.SignInAsync(browser, key);

        // A cross-site page could make the browser send its cookie; without the token the call is anonymous.
        var refused = await browser.PostJsonAsync(Requests.Minimal());
        await ProblemAssert.IsProblemAsync(refused, HttpStatusCode.Unauthorized);
        using var forged = new HttpRequestMessage(HttpMethod.Post, "/v1/assessments") { Content = new StringContent(Requests.Minimal().ToJsonString(), Encoding.UTF8, "application/json") };
        forged.Headers.Add("X-QaService-Antiforgery", "not-a-token");
        await ProblemAssert.IsProblemAsync(await browser.SendAsync(forged), HttpStatusCode.Unauthorized);

        var token = BrowserLike.FormToken(await browser.GetStringAsync("/"));
        using var proper = new HttpRequestMessage(HttpMethod.Post, "/v1/assessments") { Content = new StringContent(Requests.Minimal().ToJsonString(), Encoding.UTF8, "application/json") };
        proper.Headers.Add("X-QaService-Antiforgery", token);
        var created = await browser.SendAsync(proper);
        Assert.Equal(HttpStatusCode.Created, created.StatusCode);
        // It belongs to the signed-in tenant: its key reads it.
        Assert.Equal(HttpStatusCode.OK, (await host.Client(key).GetAsync(created.Headers.Location)).StatusCode);
    }

    [Fact]
    public async Task Forms_without_a_valid_token_get_400_and_change_nothing()
    {
        var (_, key) = await host.CreateTenantAsync();
        var browser = BrowserLike.Client(host.Factory);
        var home = await browser.GetStringAsync("/");

        var noToken = await browser.PostAsync("/ui/sign-in", new FormUrlEncodedContent(new Dictionary<string, string> { ["apiKey"] = key }));
        Assert.Equal(HttpStatusCode.BadRequest, noToken.StatusCode);
        Assert.Contains("id=\"problem-detail\"", await noToken.Content.ReadAsStringAsync());
        var wrongToken = await browser.PostAsync("/ui/sign-in", new FormUrlEncodedContent(new Dictionary<string, string> { [BrowserLike.TokenField] = BrowserLike.FormToken(home) + "x", ["apiKey"] = key }));
        Assert.Equal(HttpStatusCode.BadRequest, wrongToken.StatusCode);
        Assert.Contains("id=\"sign-in\"", await browser.GetStringAsync("/"));

        await BrowserLike.SignInAsync(browser, key);
        var before = await browser.GetStringAsync("/");
        var upload = await browser.PostAsync("/ui/assessments", CaseZeroUpload());
        Assert.Equal(HttpStatusCode.BadRequest, upload.StatusCode);
        var signOut = await browser.PostAsync("/ui/sign-out", new FormUrlEncodedContent(new Dictionary<string, string>()));
        Assert.Equal(HttpStatusCode.BadRequest, signOut.StatusCode);
        // Still signed in, and no report was added by the refused upload.
        var after = await browser.GetStringAsync("/");
        Assert.Contains("id=\"sign-out\"", after);
        Assert.Contains("None yet.", before);
        Assert.Contains("None yet.", after);
    }

    [Fact]
    public async Task The_upload_form_works_for_a_session_and_the_report_is_the_tenants()
    {
        var (_, key) = await host.CreateTenantAsync();
        var browser = BrowserLike.Client(host.Factory);
        await BrowserLike.SignInAsync(browser, key);
        var token = BrowserLike.UploadToken(await browser.GetStringAsync("/"));
        var response = await browser.PostAsync($"/ui/assessments?af={Uri.EscapeDataString(token)}",
            CaseZeroUpload());
        Assert.Equal(HttpStatusCode.SeeOther, response.StatusCode);
        var report = response.Headers.Location!.OriginalString;
        Assert.EndsWith("/report.html", report);
        Assert.Equal(HttpStatusCode.OK, (await browser.GetAsync(report)).StatusCode);
        Assert.Equal(HttpStatusCode.OK, (await host.Client(key).GetAsync(report)).StatusCode);
        var (_, other) = await host.CreateTenantAsync();
        Assert.Equal(HttpStatusCode.NotFound, (await host.Client(other).GetAsync(report)).StatusCode);
    }

    [Fact]
    public async Task Sign_out_ends_the_session()
    {
        var (_, key) = await host.CreateTenantAsync();
        var browser = BrowserLike.Client(host.Factory);
        await BrowserLike.SignInAsync(browser, key);
        var home = await browser.GetStringAsync("/");
        var signOut = await browser.PostAsync("/ui/sign-out", new FormUrlEncodedContent(new Dictionary<string, string> { [BrowserLike.TokenField] = BrowserLike.FormToken(home) }));
        Assert.Equal(HttpStatusCode.SeeOther, signOut.StatusCode);
        Assert.Contains("id=\"sign-in\"", await browser.GetStringAsync("/"));
        await ProblemAssert.IsProblemAsync(await browser.GetAsync("/v1/crs?q=utm"), HttpStatusCode.Unauthorized);
    }

    [Fact]
    public async Task The_session_slides_and_expires_after_Auth_SessionHours_idle()
    {
        var clock = new ManualClock(DateTimeOffset.UtcNow);
        using var keys = KeysHost.With(new Dictionary<string, string?> { ["Auth:SessionHours"] = "2" });
        using var factory = keys.Factory.WithWebHostBuilder(b => b.ConfigureTestServices(s => s.AddSingleton<TimeProvider>(clock)));
        var admin = factory.CreateClient();
        admin.DefaultRequestHeaders.Authorization = new AuthenticationHeaderValue("Bearer", KeysHost.AdminToken);
        var created = await admin.PostAsync("/v1/admin/tenants", new StringContent("{\"name\":\"slide\"}", Encoding.UTF8, "application/json"));
        var key = System.Text.Json.JsonDocument.Parse(await created.Content.ReadAsStringAsync()).RootElement.GetProperty("apiKey").GetString()!;

        var browser = BrowserLike.Client(factory);
        await BrowserLike.SignInAsync(browser, key);
        // 1.5 h: past half the lifetime, so this request renews the cookie (ASP.NET Core cookie handler's sliding rule).
        clock.Advance(TimeSpan.FromHours(1.5));
        Assert.Contains("id=\"sign-out\"", await browser.GetStringAsync("/"));
        clock.Advance(TimeSpan.FromHours(1.5));
        Assert.Contains("id=\"sign-out\"", await browser.GetStringAsync("/"));
        // Idle longer than 2 h: signed out.
        clock.Advance(TimeSpan.FromHours(2.1));
        Assert.Contains("id=\"sign-in\"", await browser.GetStringAsync("/"));
    }

    /// <summary>Reference case 0 as files: marks CSV (UTM 33N), fixes GeoJSON (as MultipartAcceptanceTests sends them).</summary>
    private static MultipartFormDataContent CaseZeroUpload() => Uploads.Form(
        """{ "marks": { "crs": "EPSG:32633", "heights": "ellipsoidal" }, "fixes": { "heights": "ellipsoidal" }, "spec": { "standard": "nssda", "horizontal": 1.0, "vertical": 1.0 } }""",
        Uploads.FieldFile("case0-marks.csv"), Uploads.FieldFile("case0-fixes.geojson"));

    [Fact]
    public async Task A_session_made_on_one_instance_is_honoured_by_another_on_the_same_database()
    {
        // Two instances on one SQLite file stand for a load-balanced pair: the Data Protection keys live in the database.
        using var first = KeysHost.With(new Dictionary<string, string?>());
        var settings = new Dictionary<string, string?> { ["Auth:Mode"] = "keys", ["Auth:AdminToken"] = KeysHost.AdminToken };
        using var second = new QaServiceFactory(first.Factory.DatabasePath, extra: settings);
        var (_, key) = await first.CreateTenantAsync();
        var browser = BrowserLike.Client(first.Factory);
        var signIn = await BrowserLike.SignInAsync(browser, key);
        var cookie = signIn.Headers.GetValues("Set-Cookie").Single(c => c.StartsWith("qaservice_session=", StringComparison.Ordinal)).Split(';')[0];

        var elsewhere = BrowserLike.Client(second);
        using var request = new HttpRequestMessage(HttpMethod.Get, "/");
        request.Headers.Add("Cookie", cookie);
        Assert.Contains("id=\"sign-out\"", await (await elsewhere.SendAsync(request)).Content.ReadAsStringAsync());
        // In-process hosts would also share a key folder under $HOME: check the ring really is in the database.
        await using var connection = new Microsoft.Data.Sqlite.SqliteConnection($"Data Source={first.Factory.DatabasePath};Pooling=False");
        await connection.OpenAsync();
        await using var count = connection.CreateCommand();
        count.CommandText = "SELECT COUNT(*) FROM service_secrets WHERE name LIKE 'data-protection-key:%' AND value LIKE '<key %'";
        Assert.True((long)(await count.ExecuteScalarAsync())! >= 1);
    }
}
