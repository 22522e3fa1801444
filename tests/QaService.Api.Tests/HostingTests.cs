using System.Net;
using System.Text.Json;
using QaService.Api.Tests.Support;

namespace QaService.Api.Tests;

/// <summary>Health probes, the OpenAPI document, the explorer page and the demo (api-v1 "Health"; issue: OpenAPI with units).</summary>
public sealed class HostingTests : IClassFixture<DemoServiceHost>
{
    private readonly HttpClient client;

    public HostingTests(DemoServiceHost host) => client = host.Factory.CreateClient();

    [Theory]
    [InlineData("/healthz")]
    [InlineData("/readyz")]
    public async Task Probes_answer_200(string path) =>
        Assert.Equal(HttpStatusCode.OK, (await client.GetAsync(path)).StatusCode);

    [Fact]
    public async Task OpenApi_document_describes_the_contract_with_units()
    {
        var text = await client.GetStringAsync("/openapi/v1.json");
        var document = JsonDocument.Parse(text).RootElement;
        var paths = document.GetProperty("paths");
        Assert.True(paths.TryGetProperty("/v1/assessments", out _));
        Assert.True(paths.TryGetProperty("/v1/assessments/{id}", out _));
        var schemas = document.GetProperty("components").GetProperty("schemas");
        var horizontal = schemas.GetProperty("HorizontalAccuracy").GetProperty("properties");
        Assert.Contains("metres", horizontal.GetProperty("cep50").GetProperty("description").GetString());
        var request = paths.GetProperty("/v1/assessments").GetProperty("post").GetProperty("requestBody")
            .GetProperty("content").GetProperty("application/json").GetProperty("schema");
        var point = request.GetProperty("properties").GetProperty("fixes").GetProperty("properties")
            .GetProperty("points").GetProperty("items").GetProperty("properties");
        Assert.Contains("degrees", point.GetProperty("lat").GetProperty("description").GetString());
        // The standards selectable by spec.standard are listed with their editions.
        var standard = request.GetProperty("properties").GetProperty("spec").GetProperty("properties").GetProperty("standard").GetProperty("description").GetString();
        foreach (var expected in new[] { "\"nssda\"", "FGDC-STD-007.3-1998", "\"asprs-2023\"", "Edition 2", "\"nmas-1947\"", "1947", "\"nga-ce90\"", "CE90" })
            Assert.Contains(expected, standard);
    }

    [Fact]
    public async Task Explorer_page_serves() =>
        Assert.Equal(HttpStatusCode.OK, (await client.GetAsync("/swagger/index.html")).StatusCode);

    [Fact]
    public async Task Demo_report_is_there_from_the_start()
    {
        var report = JsonDocument.Parse(await client.GetStringAsync("/v1/assessments/demo")).RootElement;
        Assert.Equal("demo", report.GetProperty("id").GetString());
        Assert.Contains("Millbrook Ferry", report.GetProperty("title").GetString());
        Assert.True(report.GetProperty("counts").GetProperty("paired").GetInt32() >= 20);
    }

    [Fact]
    public async Task Landing_page_links_the_demo() =>
        Assert.Contains("/v1/assessments/demo", await client.GetStringAsync("/"));
}
