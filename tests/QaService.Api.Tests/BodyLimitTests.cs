using System.Net;
using System.Text;
using QaService.Api.Tests.Support;

namespace QaService.Api.Tests;

/// <summary>Limits:MaxBodyBytes (api-v1 "Configuration keys"): a larger body gets 413 with a problem body.</summary>
public sealed class BodyLimitTests
{
    [Fact]
    public async Task Body_over_the_limit_is_413_problem()
    {
        using var factory = new QaServiceFactory(extra: new Dictionary<string, string?> { ["Limits:MaxBodyBytes"] = "2048" });
        var client = factory.CreateClient();
        var body = Requests.Minimal();
        body["title"] = new string('x', 4000);
        var response = await client.PostAsync("/v1/assessments", new StringContent(body.ToJsonString(), Encoding.UTF8, "application/json"));
        var problem = await ProblemAssert.IsProblemAsync(response, HttpStatusCode.RequestEntityTooLarge);
        Assert.Contains("2048", problem.GetProperty("detail").GetString());
    }
}
