using System.Net;
using System.Text.Json.Nodes;
using QaService.Api.Tests.Support;

namespace QaService.Api.Tests.Production;

/// <summary>Limits (README "Configuration"): per-key rate limit → 429 with Retry-After; point cap → 413 with a pointer.</summary>
public sealed class LimitTests
{
    [Fact]
    public async Task Above_the_rate_limit_a_key_gets_429_with_retry_after_and_other_keys_are_not_held_back()
    {
        using var host = KeysHost.With(new Dictionary<string, string?> { ["Limits:RateLimitPermits"] = "3", ["Limits:RateLimitWindowSeconds"] = "60" });
        var (_, busy) = await host.CreateTenantAsync();
        var (_, quiet) = await host.CreateTenantAsync();
        var client = host.Client(busy);
        for (var i = 0; i < 3; i++)
            Assert.Equal(HttpStatusCode.OK, (await client.GetAsync("/v1/crs?q=utm")).StatusCode);

        var limited = await client.GetAsync("/v1/crs?q=utm");
        var problem = await ProblemAssert.IsProblemAsync(limited, (HttpStatusCode)429);
        var retryAfter = limited.Headers.RetryAfter?.Delta;
        Assert.NotNull(retryAfter);
        Assert.InRange(retryAfter.Value.TotalSeconds, 1, 60);
        Assert.Contains("Limits:RateLimitPermits", problem.GetProperty("detail").GetString());

        Assert.Equal(HttpStatusCode.OK, (await host.Client(quiet).GetAsync("/v1/crs?q=utm")).StatusCode);
        Assert.Equal(HttpStatusCode.OK, (await client.GetAsync("/healthz")).StatusCode);
    }

    [Fact]
    public async Task More_points_than_the_cap_is_413_naming_the_list()
    {
        using var factory = new QaServiceFactory(extra: new Dictionary<string, string?> { ["Limits:MaxPoints"] = "3" });
        var client = factory.CreateClient();
        Assert.Equal(HttpStatusCode.Created, (await client.PostJsonAsync(Requests.Minimal())).StatusCode);

        var body = Requests.Minimal();
        body["fixes"]!["points"]!.AsArray().Add(JsonNode.Parse("""{ "id": "F2", "mark": "B", "lat": 48.754, "lon": 15.001, "h": 201.0 }"""));
        body["fixes"]!["points"]!.AsArray().Add(JsonNode.Parse("""{ "id": "F3", "mark": "B", "lat": 48.754, "lon": 15.001, "h": 201.0 }"""));
        var response = await client.PostJsonAsync(body);
        var problem = await ProblemAssert.IsProblemAsync(response, HttpStatusCode.RequestEntityTooLarge);
        var error = Assert.Single(problem.GetProperty("errors").EnumerateArray());
        Assert.Equal("/fixes/points", error.GetProperty("pointer").GetString());
        Assert.Contains("Limits:MaxPoints", error.GetProperty("message").GetString());
    }

    [Fact]
    public async Task Transform_points_count_against_the_cap_too()
    {
        using var factory = new QaServiceFactory(extra: new Dictionary<string, string?> { ["Limits:MaxPoints"] = "1" });
        var response = await factory.CreateClient().PostAsync("/v1/transform", new StringContent(
            """{ "from": "EPSG:4326", "to": "EPSG:32633", "points": [ { "lat": 48.75, "lon": 15.0 }, { "lat": 48.76, "lon": 15.0 } ] }""",
            System.Text.Encoding.UTF8, "application/json"));
        var problem = await ProblemAssert.IsProblemAsync(response, HttpStatusCode.RequestEntityTooLarge);
        Assert.Equal("/points", problem.GetProperty("errors")[0].GetProperty("pointer").GetString());
    }

    [Theory]
    [InlineData("Limits:RateLimitPermits", "0")]
    [InlineData("Limits:MaxPoints", "-5")]
    [InlineData("Limits:RequestTimeoutSeconds", "0")]
    [InlineData("Auth:Mode", "open")]
    [InlineData("Auth:AdminToken", "short")]
    [InlineData("Storage:Provider", "oracle")]
    public void Bad_settings_stop_the_service_at_start(string key, string value)
    {
        using var factory = new QaServiceFactory(extra: new Dictionary<string, string?> { [key] = value });
        var fault = Record.Exception(() => factory.CreateClient());
        Assert.NotNull(fault);
        Assert.Contains(key.Split(':')[1], fault.ToString());
    }
}
