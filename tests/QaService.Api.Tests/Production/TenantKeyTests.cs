using System.Diagnostics;
using System.Net;
using System.Net.Http.Json;
using System.Text;
using System.Text.Json;
using Microsoft.Data.Sqlite;
using QaService.Api.Tests.Support;

namespace QaService.Api.Tests.Production;

/// <summary>api-v1 "Tenants and keys": Bearer keys on every /v1 call, admin token for /v1/admin, 404 across tenants.</summary>
public sealed class TenantKeyTests(KeysHost host) : IClassFixture<KeysHost>
{
    [Theory]
    [InlineData("POST", "/v1/assessments")]
    [InlineData("GET", "/v1/assessments/demo")]
    [InlineData("GET", "/v1/assessments")]
    [InlineData("DELETE", "/v1/assessments/demo")]
    [InlineData("POST", "/v1/transform")]
    [InlineData("GET", "/v1/crs?q=utm")]
    public async Task Anonymous_calls_get_401_problem_with_a_bearer_challenge(string method, string path)
    {
        var request = new HttpRequestMessage(new HttpMethod(method), path);
        if (method == "POST")
            request.Content = new StringContent(Requests.Minimal().ToJsonString(), Encoding.UTF8, "application/json");
        var response = await host.Client(null).SendAsync(request);
        await ProblemAssert.IsProblemAsync(response, HttpStatusCode.Unauthorized);
        Assert.StartsWith("Bearer", response.Headers.WwwAuthenticate.ToString());
    }

    [Theory]
    [InlineData("qak_thisIsNotAKeyThatWasEverIssued0000000000")]
    [InlineData(KeysHost.AdminToken)]
    [InlineData("x")]
    public async Task A_wrong_key_gets_401(string key)
    {
        var response = await host.Client(key).PostJsonAsync(Requests.Minimal());
        await ProblemAssert.IsProblemAsync(response, HttpStatusCode.Unauthorized);
    }

    [Fact]
    public async Task Non_bearer_schemes_get_401()
    {
        var (_, key) = await host.CreateTenantAsync();
        var client = host.Client(null);
        client.DefaultRequestHeaders.TryAddWithoutValidation("Authorization", "Basic " + Convert.ToBase64String(Encoding.UTF8.GetBytes(key)));
        await ProblemAssert.IsProblemAsync(await client.GetAsync("/v1/crs?q=utm"), HttpStatusCode.Unauthorized);
    }

    [Fact]
    public async Task A_tenant_key_opens_v1_and_probes_need_no_key()
    {
        var (_, key) = await host.CreateTenantAsync();
        Assert.Equal(HttpStatusCode.Created, (await host.Client(key).PostJsonAsync(Requests.Minimal())).StatusCode);
        Assert.Equal(HttpStatusCode.OK, (await host.Client(null).GetAsync("/healthz")).StatusCode);
        Assert.Equal(HttpStatusCode.OK, (await host.Client(null).GetAsync("/readyz")).StatusCode);
    }

    [Fact]
    public async Task What_one_tenant_created_is_404_to_another()
    {
        var (_, north) = await host.CreateTenantAsync();
        var (_, south) = await host.CreateTenantAsync();
        var created = await host.Client(north).PostJsonAsync(Requests.Minimal());
        Assert.Equal(HttpStatusCode.Created, created.StatusCode);
        var location = created.Headers.Location!.OriginalString;

        foreach (var path in TenantScopedReadPaths(location))
        {
            Assert.Equal(HttpStatusCode.OK, (await host.Client(north).GetAsync(path)).StatusCode);
            var other = await host.Client(south).GetAsync(path);
            await ProblemAssert.IsProblemAsync(other, HttpStatusCode.NotFound);
            // The same answer as for an id that never existed: nothing tells the other tenant it is there.
            var unknown = await host.Client(south).GetAsync(path.Replace(location, "/v1/assessments/AAAAAAAAAAAAAAAAAAAAAA"));
            Assert.Equal(HttpStatusCode.NotFound, unknown.StatusCode);
        }
    }

    [Fact]
    public async Task Another_tenant_neither_lists_nor_deletes_a_report()
    {
        var (_, north) = await host.CreateTenantAsync();
        var (_, south) = await host.CreateTenantAsync();
        var created = await host.Client(north).PostJsonAsync(Requests.Minimal());
        Assert.Equal(HttpStatusCode.Created, created.StatusCode);
        var location = created.Headers.Location!.OriginalString;
        var id = location.Split('/')[^1];

        Assert.Equal([id], (await ListingScenarios.PageAsync(host.Client(north), "/v1/assessments")).Items);
        Assert.Empty((await ListingScenarios.PageAsync(host.Client(south), "/v1/assessments")).Items);
        await ProblemAssert.IsProblemAsync(await host.Client(south).DeleteAsync(location), HttpStatusCode.NotFound);
        Assert.Equal(HttpStatusCode.OK, (await host.Client(north).GetAsync(location)).StatusCode);
        Assert.Equal(HttpStatusCode.NoContent, (await host.Client(north).DeleteAsync(location)).StatusCode);
    }

    [Fact]
    public async Task What_one_tenant_created_cannot_be_shared_or_unshared_by_another()
    {
        var (_, north) = await host.CreateTenantAsync();
        var (_, south) = await host.CreateTenantAsync();
        var location = (await host.Client(north).PostJsonAsync(Requests.Minimal())).Headers.Location!.OriginalString;
        foreach (var (method, path) in TenantScopedWritePaths(location))
        {
            using var byOther = new HttpRequestMessage(new HttpMethod(method), path) { Content = JsonContent.Create(new { expiresInHours = 1 }) };
            await ProblemAssert.IsProblemAsync(await host.Client(south).SendAsync(byOther), HttpStatusCode.NotFound);
        }
        var link = await host.Client(north).PostAsJsonAsync($"{location}/share-links", new { expiresInHours = 1 });
        Assert.Equal(HttpStatusCode.Created, link.StatusCode);
        var linkId = System.Text.Json.JsonDocument.Parse(await link.Content.ReadAsStringAsync()).RootElement.GetProperty("id").GetString();
        await ProblemAssert.IsProblemAsync(await host.Client(south).DeleteAsync($"{location}/share-links/{linkId}"), HttpStatusCode.NotFound);
        Assert.Equal(HttpStatusCode.NoContent, (await host.Client(north).DeleteAsync($"{location}/share-links/{linkId}")).StatusCode);
    }

    /// <summary>Every path under an assessment that changes something of it (method, path).</summary>
    internal static IEnumerable<(string Method, string Path)> TenantScopedWritePaths(string location) =>
        [("POST", $"{location}/share-links"), ("DELETE", $"{location}/share-links/sl_AAAAAAAAAAAAAAAAAAAAAA")];

    /// <summary>Every path under an assessment that returns its data.</summary>
    internal static IEnumerable<string> TenantScopedReadPaths(string location) =>
        [location, $"{location}/report.html", $"{location}/residuals.csv", $"{location}/residuals.geojson", $"{location}/decisions"];

    /// <summary>Every path under a project that returns its data.</summary>
    internal static IEnumerable<string> ProjectScopedReadPaths(string location) => [location, $"{location}/report.html"];

    [Fact]
    public async Task Projects_and_decisions_are_404_to_another_tenant()
    {
        var (_, north) = await host.CreateTenantAsync();
        var (_, south) = await host.CreateTenantAsync();
        var created = await host.Client(north).PostAsync("/v1/projects",
            new StringContent("""{ "name": "North depot mains", "spec": { "horizontal": 0.5 } }""", Encoding.UTF8, "application/json"));
        Assert.Equal(HttpStatusCode.Created, created.StatusCode);
        var location = created.Headers.Location!.OriginalString;
        var projectId = location.Split('/')[^1];
        foreach (var path in ProjectScopedReadPaths(location))
        {
            Assert.Equal(HttpStatusCode.OK, (await host.Client(north).GetAsync(path)).StatusCode);
            await ProblemAssert.IsProblemAsync(await host.Client(south).GetAsync(path), HttpStatusCode.NotFound);
        }
        Assert.DoesNotContain(projectId, await host.Client(south).GetStringAsync("/v1/projects"));

        // Another tenant's project cannot be named by a delivery, and its report cannot be signed off.
        var request = Requests.Minimal();
        request["projectId"] = projectId;
        await ProblemAssert.IsBadInputAsync(await host.Client(south).PostJsonAsync(request), "/projectId", "no project");
        var report = await host.Client(north).PostJsonAsync(request);
        Assert.Equal(HttpStatusCode.Created, report.StatusCode);
        var decisions = $"{report.Headers.Location!.OriginalString}/decisions";
        var decision = new StringContent("""{ "decision": "accepted", "by": "intruder" }""", Encoding.UTF8, "application/json");
        await ProblemAssert.IsProblemAsync(await host.Client(south).PostAsync(decisions, decision), HttpStatusCode.NotFound);
        var own = JsonDocument.Parse(await host.Client(north).GetStringAsync(decisions)).RootElement;
        Assert.Empty(own.GetProperty("decisions").EnumerateArray());
    }

    [Fact]
    public async Task Admin_creates_a_tenant_and_the_key_is_shown_once_and_stored_only_as_its_sha256()
    {
        var name = $"north-depot-{Guid.NewGuid():N}";
        var response = await host.Client(KeysHost.AdminToken).PostAsJsonAsync("/v1/admin/tenants", new { name });
        Assert.Equal(HttpStatusCode.Created, response.StatusCode);
        var body = System.Text.Json.JsonDocument.Parse(await response.Content.ReadAsStringAsync()).RootElement;
        var key = body.GetProperty("apiKey").GetString()!;
        Assert.False(string.IsNullOrEmpty(body.GetProperty("tenant").GetString()));
        // 256 random bits: at least 43 base64url characters after the prefix.
        Assert.Matches("^qak_[A-Za-z0-9_-]{43}$", key);

        // Asking again for the same name does not show the key again.
        var again = await host.Client(KeysHost.AdminToken).PostAsJsonAsync("/v1/admin/tenants", new { name });
        var againText = await again.Content.ReadAsStringAsync();
        Assert.Equal(HttpStatusCode.Conflict, again.StatusCode);
        Assert.DoesNotContain(key, againText);

        // The store holds SHA-256(key) as computed by coreutils' sha256sum, and the key nowhere.
        string stored;
        await using (var connection = new SqliteConnection($"Data Source={host.Factory.DatabasePath};Pooling=False"))
        {
            await connection.OpenAsync();
            await using var command = connection.CreateCommand();
            command.CommandText = "SELECT key_hash FROM tenants WHERE name = $name";
            command.Parameters.AddWithValue("$name", name);
            stored = (string)(await command.ExecuteScalarAsync())!;
        }
        Assert.Equal(Sha256Sum(key), stored);
        foreach (var file in Directory.GetFiles(Path.GetDirectoryName(host.Factory.DatabasePath)!, Path.GetFileName(host.Factory.DatabasePath) + "*"))
            Assert.DoesNotContain(key, Encoding.UTF8.GetString(await ReadSharedAsync(file)));
    }

    [Fact]
    public async Task A_tenant_key_on_the_admin_path_gets_403_and_no_token_401()
    {
        var (_, key) = await host.CreateTenantAsync();
        await ProblemAssert.IsProblemAsync(await host.Client(key).PostAsJsonAsync("/v1/admin/tenants", new { name = "sneaky" }), HttpStatusCode.Forbidden);
        await ProblemAssert.IsProblemAsync(await host.Client(null).PostAsJsonAsync("/v1/admin/tenants", new { name = "sneaky" }), HttpStatusCode.Unauthorized);
        await ProblemAssert.IsProblemAsync(await host.Client("wrong-token").PostAsJsonAsync("/v1/admin/tenants", new { name = "sneaky" }), HttpStatusCode.Unauthorized);
    }

    [Theory]
    [InlineData("""{"name": ""}""")]
    [InlineData("""{"name": null}""")]
    [InlineData("""{}""")]
    [InlineData("""{"name": "line\nbreak"}""")]
    public async Task A_bad_tenant_name_is_400_with_a_pointer(string json)
    {
        var response = await host.Client(KeysHost.AdminToken).PostAsync("/v1/admin/tenants", new StringContent(json, Encoding.UTF8, "application/json"));
        await ProblemAssert.IsBadInputAsync(response, "/name", "name");
    }

    [Theory]
    [InlineData(null)]
    [InlineData("")]
    public async Task Without_an_admin_token_the_admin_paths_are_disabled(string? token)
    {
        using var factory = new QaServiceFactory(extra: new Dictionary<string, string?> { ["Auth:Mode"] = "keys", ["Auth:AdminToken"] = token });
        var client = factory.CreateClient();
        client.DefaultRequestHeaders.Authorization = new System.Net.Http.Headers.AuthenticationHeaderValue("Bearer", KeysHost.AdminToken);
        await ProblemAssert.IsProblemAsync(await client.PostAsJsonAsync("/v1/admin/tenants", new { name = "x" }), HttpStatusCode.NotFound);
    }

    [Fact]
    public async Task Without_keys_there_is_one_tenant_and_no_key_is_needed()
    {
        using var factory = new QaServiceFactory();
        var response = await factory.CreateClient().PostJsonAsync(Requests.Minimal());
        Assert.Equal(HttpStatusCode.Created, response.StatusCode);
        Assert.Equal(HttpStatusCode.OK, (await factory.CreateClient().GetAsync(response.Headers.Location)).StatusCode);
    }

    private static string Sha256Sum(string text)
    {
        var start = new ProcessStartInfo("sha256sum") { RedirectStandardInput = true, RedirectStandardOutput = true };
        using var process = Process.Start(start)!;
        process.StandardInput.Write(text);
        process.StandardInput.Close();
        var output = process.StandardOutput.ReadToEnd();
        process.WaitForExit();
        return output.Split(' ')[0];
    }

    private static async Task<byte[]> ReadSharedAsync(string path)
    {
        await using var stream = new FileStream(path, FileMode.Open, FileAccess.Read, FileShare.ReadWrite | FileShare.Delete);
        using var copy = new MemoryStream();
        await stream.CopyToAsync(copy);
        return copy.ToArray();
    }
}
