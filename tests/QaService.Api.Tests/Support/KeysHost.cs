using System.Net;
using System.Net.Http.Headers;
using System.Net.Http.Json;
using System.Text.Json;

namespace QaService.Api.Tests.Support;

/// <summary>A service with <c>Auth:Mode</c> = <c>keys</c> and an admin token; helpers to make tenants and keyed clients.</summary>
public sealed class KeysHost : IDisposable
{
    /// <summary>Invented admin token for tests (≥ 32 characters, as Auth:AdminToken requires).</summary>
    public const string AdminToken = "test-admin-token-0123456789abcdef-not-a-secret";

    public KeysHost() : this(new Dictionary<string, string?>(), 0) { }

    private KeysHost(IDictionary<string, string?> extra, int _)
    {
        var settings = new Dictionary<string, string?>(extra) { ["Auth:Mode"] = "keys", ["Auth:AdminToken"] = AdminToken };
        Factory = new QaServiceFactory(extra: settings);
    }

    /// <summary>A keys-mode host with more settings (xunit fixtures may have only one public constructor).</summary>
    public static KeysHost With(IDictionary<string, string?> extra) => new(extra, 0);

    public QaServiceFactory Factory { get; }

    public HttpClient Client(string? bearer)
    {
        var client = Factory.CreateClient();
        if (bearer is not null)
            client.DefaultRequestHeaders.Authorization = new AuthenticationHeaderValue("Bearer", bearer);
        return client;
    }

    /// <summary>Creates a tenant through the admin API and returns its id and key.</summary>
    public async Task<(string Tenant, string Key)> CreateTenantAsync(string? name = null)
    {
        var response = await Client(AdminToken).PostAsJsonAsync("/v1/admin/tenants", new { name = name ?? $"team-{Guid.NewGuid():N}" });
        var text = await response.Content.ReadAsStringAsync();
        Assert.True(response.StatusCode == HttpStatusCode.Created, text);
        var body = JsonDocument.Parse(text).RootElement;
        return (body.GetProperty("tenant").GetString()!, body.GetProperty("apiKey").GetString()!);
    }

    public void Dispose() => Factory.Dispose();
}
