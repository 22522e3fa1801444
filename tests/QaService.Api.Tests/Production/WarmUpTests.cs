using System.Net;
using QaService.Api.Tests.Support;

namespace QaService.Api.Tests.Production;

/// <summary>
/// The start-up warm-up upload (WarmUp:Enabled, on by default): it finishes (its duration appears in /metrics, in
/// Prometheus text) and stores nothing (it is not among the recent assessments on the home page, nor readable by its id).
/// </summary>
public sealed class WarmUpTests
{
    [Fact]
    public async Task The_warm_up_upload_finishes_and_stores_nothing()
    {
        using var factory = new QaServiceFactory(extra: new Dictionary<string, string?> { ["WarmUp:Enabled"] = "true" });
        var client = factory.CreateClient();
        string text = "";
        const string Sample = "qaservice_warmup_duration_seconds{";
        for (var attempt = 0; attempt < 240 && !text.Split('\n').Any(l => l.StartsWith(Sample, StringComparison.Ordinal)); attempt++)
        {
            await Task.Delay(250);
            var response = await client.GetAsync("/metrics");
            Assert.Equal(HttpStatusCode.OK, response.StatusCode);
            text = await response.Content.ReadAsStringAsync();
        }
        var line = text.Split('\n').Single(l => l.StartsWith(Sample, StringComparison.Ordinal));
        Assert.True(double.Parse(line[(line.LastIndexOf(' ') + 1)..], System.Globalization.CultureInfo.InvariantCulture) > 0, line);

        var list = await client.GetStringAsync("/"); // the page lists recent assessments
        Assert.DoesNotContain("warm-up", list);
        Assert.Equal(HttpStatusCode.NotFound, (await client.GetAsync("/v1/assessments/warm-up")).StatusCode);
    }
}
