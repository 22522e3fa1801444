using System.Net;
using System.Net.Http.Json;
using System.Text;
using System.Text.Json;
using Microsoft.AspNetCore.Mvc.Testing;
using Microsoft.AspNetCore.TestHost;
using Microsoft.Data.Sqlite;
using Microsoft.Extensions.DependencyInjection;
using Npgsql;
using QaService.Api.Tests.Support;

namespace QaService.Api.Tests.Production;

/// <summary>
/// Share links (POST/DELETE /v1/assessments/{id}/share-links, GET /shared/{token}/…): open without credentials until
/// they expire (the injected clock) or are revoked; only the owner makes or revokes them; a deleted report's links die.
/// Each storage provider runs the same scenario.
/// </summary>
public sealed class ShareLinkTests
{
    [Fact]
    public Task Sqlite_share_links_live_and_die_as_documented() => ScenarioAsync(new Dictionary<string, string?>(), DeleteFromSqlite);

    [PostgresFact]
    public Task Postgres_share_links_live_and_die_as_documented() => ScenarioAsync(PostgresFactAttribute.Settings(), DeleteFromPostgres);

    [Theory]
    [InlineData("""{"expiresInHours": 0}""")]
    [InlineData("""{"expiresInHours": -1}""")]
    [InlineData("""{"expiresInHours": 0.0009}""")]
    [InlineData("""{"expiresInHours": 721}""")]
    [InlineData("""{"expiresInHours": "72"}""")]
    [InlineData("""{"expiresInHours": 1e400}""")]
    public async Task A_bad_lifetime_is_400_with_a_pointer(string body)
    {
        using var host = new KeysHost();
        var (_, key) = await host.CreateTenantAsync();
        var report = (await host.Client(key).PostJsonAsync(Requests.Minimal())).Headers.Location!.OriginalString;
        var response = await host.Client(key).PostAsync($"{report}/share-links", new StringContent(body, Encoding.UTF8, "application/json"));
        await ProblemAssert.IsBadInputAsync(response, "/expiresInHours", "");
    }

    [Fact]
    public async Task Links_are_128_bit_random_and_signed_a_forged_one_is_404()
    {
        using var host = new KeysHost();
        var (_, key) = await host.CreateTenantAsync();
        var report = (await host.Client(key).PostJsonAsync(Requests.Minimal())).Headers.Location!.OriginalString;
        var url = (await CreateAsync(host.Client(key), report, 1)).Url;
        var token = new Uri(url).Segments[2].TrimEnd('/');
        var (random, mac) = (token.Split('.')[0], token.Split('.')[1]);
        // 16 random bytes = 22 base64url characters; HMAC-SHA256 = 32 bytes = 43 characters.
        Assert.Matches("^[A-Za-z0-9_-]{22}$", random);
        Assert.Matches("^[A-Za-z0-9_-]{43}$", mac);
        var anonymous = host.Factory.CreateClient();
        Assert.Equal(HttpStatusCode.OK, (await anonymous.GetAsync(url)).StatusCode);
        string flipped = random[..^1] + (random[^1] == 'A' ? 'B' : 'A');
        foreach (var forged in new[] { $"{flipped}.{mac}", $"{random}.{mac[..^1]}{(mac[^1] == 'A' ? 'B' : 'A')}", random, "x" })
            Assert.Equal(HttpStatusCode.NotFound, (await anonymous.GetAsync($"/shared/{forged}/report.html")).StatusCode);
    }

    private static async Task ScenarioAsync(Dictionary<string, string?> settings, Func<QaServiceFactory, string, Task> deleteReport)
    {
        var clock = new ManualClock(DateTimeOffset.UtcNow);
        settings["Auth:Mode"] = "keys";
        settings["Auth:AdminToken"] = KeysHost.AdminToken;
        using var keys = KeysHost.With(settings);
        using var factory = keys.Factory.WithWebHostBuilder(b => b.ConfigureTestServices(s => s.AddSingleton<TimeProvider>(clock)));
        HttpClient Client(string? bearer)
        {
            var client = factory.CreateClient(new WebApplicationFactoryClientOptions { HandleCookies = false });
            if (bearer is not null)
                client.DefaultRequestHeaders.Authorization = new System.Net.Http.Headers.AuthenticationHeaderValue("Bearer", bearer);
            return client;
        }
        async Task<string> KeyAsync()
        {
            var response = await Client(KeysHost.AdminToken).PostAsJsonAsync("/v1/admin/tenants", new { name = $"share-{Guid.NewGuid():N}" });
            return JsonDocument.Parse(await response.Content.ReadAsStringAsync()).RootElement.GetProperty("apiKey").GetString()!;
        }
        var (owner, other) = (await KeyAsync(), await KeyAsync());
        var body = Requests.Minimal();
        body["title"] = "Shared <survey> of Larkfield";
        var report = (await Client(owner).PostJsonAsync(body)).Headers.Location!.OriginalString;
        var anonymous = Client(null);

        // Create: 201 with a URL that opens the page and its downloads with no credentials.
        var link = await CreateAsync(Client(owner), report, 72);
        Assert.Equal(clock.Now.AddHours(72), link.ExpiresAt);
        var page = await anonymous.GetAsync(link.Url);
        Assert.Equal(HttpStatusCode.OK, page.StatusCode);
        var html = await page.Content.ReadAsStringAsync();
        Assert.Contains("Shared &lt;survey&gt; of Larkfield", html);
        var basePath = new Uri(link.Url).AbsolutePath.Replace("/report.html", "", StringComparison.Ordinal);
        Assert.Contains($"href=\"{basePath}/residuals.csv\"", html);
        Assert.DoesNotContain($"href=\"{report}/residuals.csv\"", html);
        var views = new[] { link.Url, $"{basePath}/residuals.csv", $"{basePath}/residuals.geojson" };
        foreach (var view in views)
            Assert.Equal(HttpStatusCode.OK, (await anonymous.GetAsync(view)).StatusCode);
        Assert.Equal("text/csv", (await anonymous.GetAsync(views[1])).Content.Headers.ContentType?.MediaType);
        Assert.Equal(await Client(owner).GetStringAsync($"{report}/residuals.csv"), await anonymous.GetStringAsync(views[1]));

        // Another tenant can neither make nor revoke links of this report: 404 as for any report path.
        await ProblemAssert.IsProblemAsync(await Client(other).PostAsJsonAsync($"{report}/share-links", new { expiresInHours = 1 }), HttpStatusCode.NotFound);
        await ProblemAssert.IsProblemAsync(await Client(other).DeleteAsync($"{report}/share-links/{link.Id}"), HttpStatusCode.NotFound);
        await ProblemAssert.IsProblemAsync(await Client(null).PostAsJsonAsync($"{report}/share-links", new { expiresInHours = 1 }), HttpStatusCode.Unauthorized);
        Assert.Equal(HttpStatusCode.OK, (await anonymous.GetAsync(link.Url)).StatusCode);

        // Revoke: 204, then every view is 404, and revoking again is 404.
        Assert.Equal(HttpStatusCode.NoContent, (await Client(owner).DeleteAsync($"{report}/share-links/{link.Id}")).StatusCode);
        foreach (var view in views)
            Assert.Equal(HttpStatusCode.NotFound, (await anonymous.GetAsync(view)).StatusCode);
        await ProblemAssert.IsProblemAsync(await Client(owner).DeleteAsync($"{report}/share-links/{link.Id}"), HttpStatusCode.NotFound);

        // Expiry by the injected clock: open one second before, 404 at the instant it expires.
        var shortLink = await CreateAsync(Client(owner), report, 0.5);
        clock.Advance(TimeSpan.FromMinutes(30) - TimeSpan.FromSeconds(1));
        Assert.Equal(HttpStatusCode.OK, (await anonymous.GetAsync(shortLink.Url)).StatusCode);
        clock.Advance(TimeSpan.FromSeconds(1));
        Assert.Equal(HttpStatusCode.NotFound, (await anonymous.GetAsync(shortLink.Url)).StatusCode);

        // A deleted report takes its links with it (the lookup joins on the report).
        var lastLink = await CreateAsync(Client(owner), report, 24);
        Assert.Equal(HttpStatusCode.OK, (await anonymous.GetAsync(lastLink.Url)).StatusCode);
        await deleteReport(keys.Factory, report.Split('/').Last());
        Assert.Equal(HttpStatusCode.NotFound, (await anonymous.GetAsync(lastLink.Url)).StatusCode);
        await ProblemAssert.IsProblemAsync(await Client(owner).PostAsJsonAsync($"{report}/share-links", new { expiresInHours = 1 }), HttpStatusCode.NotFound);
    }

    private static async Task<(string Id, string Url, DateTimeOffset ExpiresAt)> CreateAsync(HttpClient owner, string report, double hours)
    {
        var response = await owner.PostAsJsonAsync($"{report}/share-links", new { expiresInHours = hours });
        var text = await response.Content.ReadAsStringAsync();
        Assert.True(response.StatusCode == HttpStatusCode.Created, text);
        var body = JsonDocument.Parse(text).RootElement;
        var url = body.GetProperty("url").GetString()!;
        Assert.Equal(url, response.Headers.Location!.OriginalString);
        Assert.StartsWith("http://localhost/shared/", url);
        return (body.GetProperty("id").GetString()!, url, body.GetProperty("expiresAt").GetDateTimeOffset());
    }

    private static async Task DeleteFromSqlite(QaServiceFactory factory, string id)
    {
        await using var connection = new SqliteConnection($"Data Source={factory.DatabasePath};Pooling=False");
        await connection.OpenAsync();
        await using var command = connection.CreateCommand();
        command.CommandText = "DELETE FROM reports WHERE id = $id";
        command.Parameters.AddWithValue("$id", id);
        Assert.Equal(1, await command.ExecuteNonQueryAsync());
    }

    private static async Task DeleteFromPostgres(QaServiceFactory factory, string id)
    {
        await using var source = NpgsqlDataSource.Create(PostgresFactAttribute.ConnectionString!);
        await using var command = source.CreateCommand("DELETE FROM reports WHERE id = $1");
        command.Parameters.Add(new NpgsqlParameter { Value = id });
        Assert.Equal(1, await command.ExecuteNonQueryAsync());
    }
}
