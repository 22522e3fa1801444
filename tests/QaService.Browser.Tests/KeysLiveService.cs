using System.Net;
using System.Net.Http.Headers;
using System.Net.Http.Json;
using System.Text.Json;

namespace QaService.Browser.Tests;

/// <summary>
/// The built service in <c>Auth:Mode=keys</c> with an admin token, as shared deployments run it; tenants are made
/// through <c>POST /v1/admin/tenants</c> like an administrator would.
/// </summary>
public sealed class KeysLiveService : LiveService
{
    /// <summary>Invented admin token for tests (≥ 32 characters, as Auth:AdminToken requires).</summary>
    public const string AdminToken = "browser-test-admin-token-0123456789-not-a-secret";

    protected override IEnumerable<KeyValuePair<string, string>> Settings => [new("Auth:Mode", "keys"), new("Auth:AdminToken", AdminToken)];

    /// <summary>A new tenant's name and API key.</summary>
    public async Task<(string Name, string Key)> CreateTenantAsync()
    {
        var name = $"crew-{Guid.NewGuid():N}";
        var response = await Send(HttpMethod.Post, "v1/admin/tenants", AdminToken, JsonContent.Create(new { name }));
        var text = await response.Content.ReadAsStringAsync();
        Assert.True(response.StatusCode == HttpStatusCode.Created, text);
        return (name, JsonDocument.Parse(text).RootElement.GetProperty("apiKey").GetString()!);
    }

    /// <summary>A call to the service with a Bearer credential (API key or admin token).</summary>
    public Task<HttpResponseMessage> Send(HttpMethod method, string path, string bearer, HttpContent? content = null)
    {
        var request = new HttpRequestMessage(method, path) { Content = content };
        request.Headers.Authorization = new AuthenticationHeaderValue("Bearer", bearer);
        return Http.SendAsync(request);
    }
}

[CollectionDefinition(Name)]
public sealed class KeysLiveServiceCollection : ICollectionFixture<KeysLiveService>
{
    public const string Name = "live service with keys";
}
