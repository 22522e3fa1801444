using System.Net;
using System.Net.Http.Headers;
using System.Security.Cryptography;
using QaService.Api.Tests.Support;

namespace QaService.Api.Tests.Production;

/// <summary>
/// JWT bearer tokens from an organisation's identity provider (Auth:Jwt:*): the service reads the provider's keys
/// through its discovery document (a provider served by the test on loopback) and maps Auth:Jwt:TenantClaim to a
/// tenant by name. RFC 7519 §4.1.3 (aud), §4.1.4 (exp); RFC 7515 (signature). API keys keep working beside tokens.
/// </summary>
public sealed class JwtBearerTests : IDisposable
{
    private const string Audience = "qaservice-tests";
    private const string Claim = "qa_team";
    private readonly LoopbackOidcProvider provider = new();
    private readonly KeysHost host;

    public JwtBearerTests() => host = KeysHost.With(new Dictionary<string, string?>
    {
        ["Auth:Jwt:Authority"] = provider.Issuer,
        ["Auth:Jwt:Audience"] = Audience,
        ["Auth:Jwt:TenantClaim"] = Claim,
        ["Auth:Jwt:RequireHttpsMetadata"] = "false",
    });

    [Fact]
    public async Task A_valid_token_acts_as_the_tenant_its_claim_names()
    {
        var north = "north-" + Guid.NewGuid().ToString("N");
        var (_, northKey) = await host.CreateTenantAsync(north);
        var (_, southKey) = await host.CreateTenantAsync();
        var token = provider.Token(Audience, new Dictionary<string, object> { [Claim] = north });

        var created = await Bearer(token).PostJsonAsync(Requests.Minimal());
        Assert.Equal(HttpStatusCode.Created, created.StatusCode);
        Assert.True(provider.JwksRequests > 0, "the signing key came from the provider's JWKS");
        foreach (var path in TenantKeyTests.TenantScopedReadPaths(created.Headers.Location!.OriginalString))
        {
            Assert.Equal(HttpStatusCode.OK, (await Bearer(token).GetAsync(path)).StatusCode);
            // The tenant's API key sees it too (same tenant); another tenant's does not.
            Assert.Equal(HttpStatusCode.OK, (await host.Client(northKey).GetAsync(path)).StatusCode);
            await ProblemAssert.IsProblemAsync(await host.Client(southKey).GetAsync(path), HttpStatusCode.NotFound);
        }

        var southReport = (await host.Client(southKey).PostJsonAsync(Requests.Minimal())).Headers.Location;
        await ProblemAssert.IsProblemAsync(await Bearer(token).GetAsync(southReport), HttpStatusCode.NotFound);
    }

    public static TheoryData<string> Bad_tokens => ["wrong audience", "expired", "bad signature", "other issuer", "unknown tenant", "no tenant claim", "altered payload"];

    [Theory]
    [MemberData(nameof(Bad_tokens))]
    public async Task A_token_that_fails_any_check_gets_401(string flaw)
    {
        var tenant = "team-" + Guid.NewGuid().ToString("N");
        await host.CreateTenantAsync(tenant);
        var existing = "team-" + Guid.NewGuid().ToString("N");
        await host.CreateTenantAsync(existing);
        var claims = new Dictionary<string, object> { [Claim] = tenant };
        // The control: the same tenant with a sound token is let in, so each 401 below is for its flaw alone.
        Assert.Equal(HttpStatusCode.OK, (await Bearer(provider.Token(Audience, claims)).GetAsync("/v1/crs?q=utm")).StatusCode);

        using var stranger = RSA.Create(2048);
        string token = flaw switch
        {
            "wrong audience" => provider.Token("some-other-api", claims),
            "expired" => provider.Token(Audience, claims, lifetime: TimeSpan.FromMinutes(-30)),
            "bad signature" => provider.Token(Audience, claims, signWith: stranger),
            "other issuer" => provider.Token(Audience, claims, issuer: "http://127.0.0.1:1"),
            "unknown tenant" => provider.Token(Audience, new Dictionary<string, object> { [Claim] = "no-such-team" }),
            "no tenant claim" => provider.Token(Audience, new Dictionary<string, object>()),
            _ => Alter(provider.Token(Audience, claims), existing),
        };
        var response = await Bearer(token).GetAsync("/v1/crs?q=utm");
        await ProblemAssert.IsProblemAsync(response, HttpStatusCode.Unauthorized);
        Assert.Contains("invalid_token", response.Headers.WwwAuthenticate.ToString());
    }

    [Fact]
    public async Task An_api_key_still_works_beside_tokens()
    {
        var (_, key) = await host.CreateTenantAsync();
        Assert.Equal(HttpStatusCode.Created, (await host.Client(key).PostJsonAsync(Requests.Minimal())).StatusCode);
        await ProblemAssert.IsProblemAsync(await host.Client("qak_thisIsNotAKeyThatWasEverIssued0000000000").GetAsync("/v1/crs?q=utm"), HttpStatusCode.Unauthorized);
    }

    /// <summary>Another existing tenant's name in the payload, the original signature kept.</summary>
    private static string Alter(string token, string tenant)
    {
        var parts = token.Split('.');
        var payload = System.Text.Json.Nodes.JsonNode.Parse(System.Buffers.Text.Base64Url.DecodeFromChars(parts[1]))!;
        payload[Claim] = tenant;
        return $"{parts[0]}.{System.Buffers.Text.Base64Url.EncodeToString(System.Text.Json.JsonSerializer.SerializeToUtf8Bytes(payload))}.{parts[2]}";
    }

    private HttpClient Bearer(string token)
    {
        var client = host.Factory.CreateClient();
        client.DefaultRequestHeaders.Authorization = new AuthenticationHeaderValue("Bearer", token);
        return client;
    }

    public void Dispose()
    {
        host.Dispose();
        provider.Dispose();
    }
}
