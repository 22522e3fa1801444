using System.Net;
using System.Text.Json;
using System.Text.Json.Nodes;
using QaService.Api.Tests.Support;

namespace QaService.Api.Tests;

/// <summary>
/// End-to-end cases with an answer computed outside the project: tests/reference-data/assessment-cases.json,
/// made by make-assessment-cases.py. Marks' lat/lon by PROJ 9.1.1 cs2cs (EPSG:32633 → EPSG:4979); fixes
/// made from residuals designed in east-north-up by GeographicLib 2.1.2 CartConvert (local cartesian,
/// reverse); figures from the designed residuals with numpy 1.24 / scipy 1.10 (quad + brentq for the
/// exact radii, numpy.percentile linear for p50/p90/p95).
/// </summary>
public sealed class ReferenceCaseTests : IClassFixture<ReferenceCaseTests.Host>
{
    public sealed class Host : IDisposable
    {
        public QaServiceFactory Factory { get; } = new();
        public JsonElement Cases { get; } = JsonDocument.Parse(File.ReadAllText(ReferenceData.PathOf("assessment-cases.json"))).RootElement.GetProperty("cases");
        public void Dispose() => Factory.Dispose();
    }

    /// <summary>Issue acceptance: figures agree with the independent computation within 2 mm.</summary>
    private const double FigureToleranceMetres = 0.002;

    /// <summary>
    /// Issue acceptance: a designed ENU residual is recovered within 0.1 mm. The fixture rounds fix
    /// lat/lon to 15 decimals of degree and heights to 1e-10 m, far below this.
    /// </summary>
    private const double ResidualToleranceMetres = 0.0001;

    private readonly Host host;
    private readonly HttpClient client;

    public ReferenceCaseTests(Host host)
    {
        this.host = host;
        client = host.Factory.CreateClient();
    }

    private async Task<JsonElement> RunCaseAsync(int index)
    {
        var request = JsonNode.Parse(host.Cases[index].GetProperty("request").GetRawText())!;
        var response = await client.PostJsonAsync(request);
        var text = await response.Content.ReadAsStringAsync();
        Assert.True(response.StatusCode == HttpStatusCode.Created, text);
        return JsonDocument.Parse(text).RootElement;
    }

    [Theory]
    [InlineData(0)]
    [InlineData(1)]
    [InlineData(2)]
    public async Task Designed_residuals_are_recovered_within_a_tenth_of_a_millimetre(int caseIndex)
    {
        var report = await RunCaseAsync(caseIndex);
        var residuals = report.GetProperty("residuals").EnumerateArray().ToDictionary(r => r.GetProperty("fix").GetString()!);
        foreach (var designed in host.Cases[caseIndex].GetProperty("designedResiduals").EnumerateArray())
        {
            var actual = residuals[designed.GetProperty("fix").GetString()!];
            Assert.Equal(designed.GetProperty("mark").GetString(), actual.GetProperty("mark").GetString());
            foreach (var component in new[] { "dE", "dN", "dU" })
                Assert.Equal(designed.GetProperty(component).GetDouble(), actual.GetProperty(component).GetDouble(), ResidualToleranceMetres);
        }
    }

    [Theory]
    [InlineData(0)]
    [InlineData(1)]
    [InlineData(2)]
    public async Task Every_figure_agrees_with_the_independent_computation(int caseIndex)
    {
        var report = await RunCaseAsync(caseIndex);
        var expected = host.Cases[caseIndex].GetProperty("expected");
        foreach (var block in new[] { "horizontal", "vertical" })
        {
            var actualBlock = report.GetProperty(block);
            foreach (var figure in expected.GetProperty(block).EnumerateObject())
            {
                var actual = actualBlock.GetProperty(figure.Name);
                if (figure.Value.ValueKind == JsonValueKind.String)
                    Assert.Equal(figure.Value.GetString(), actual.GetString());
                else if (figure.Name == "n")
                    Assert.Equal(figure.Value.GetInt32(), actual.GetInt32());
                else
                    Assert.True(Math.Abs(figure.Value.GetDouble() - actual.GetDouble()) <= FigureToleranceMetres,
                        $"{block}.{figure.Name}: expected {figure.Value.GetDouble()}, got {actual.GetDouble()}");
            }
        }
    }

    [Fact]
    public async Task Case_within_spec_passes()
    {
        var report = await RunCaseAsync(0);
        Assert.Equal("approx", report.GetProperty("horizontal").GetProperty("nssdaMethod").GetString());
        Assert.Equal("pass", report.GetProperty("verdict").GetString());
        Assert.StartsWith("Tested ", report.GetProperty("statement").GetString());
        Assert.Contains("meters horizontal accuracy at 95% confidence level", report.GetProperty("statement").GetString());
    }

    [Fact]
    public async Task Case_exceeding_spec_fails_and_uses_the_exact_branch()
    {
        var report = await RunCaseAsync(1);
        Assert.Equal("exact", report.GetProperty("horizontal").GetProperty("nssdaMethod").GetString());
        Assert.Equal("fail", report.GetProperty("verdict").GetString());
        Assert.False(report.GetProperty("spec").GetProperty("horizontalMet").GetBoolean());
    }

    [Fact]
    public async Task Twelve_points_are_inconclusive_with_min_points_failing()
    {
        var report = await RunCaseAsync(2);
        Assert.Equal("inconclusive", report.GetProperty("verdict").GetString());
        var minPoints = report.GetProperty("checks").EnumerateArray().Single(c => c.GetProperty("id").GetString() == "min-points");
        Assert.Equal("fail", minPoints.GetProperty("status").GetString());
        Assert.Equal(12, report.GetProperty("counts").GetProperty("paired").GetInt32());
    }

    [Fact]
    public async Task Report_carries_every_contract_field_and_the_cautions()
    {
        var report = await RunCaseAsync(0);
        foreach (var field in new[] { "id", "title", "createdAt", "verdict", "counts", "horizontal", "vertical", "residuals", "checks", "statement", "cautions" })
            Assert.True(report.TryGetProperty(field, out _), $"missing {field}");
        foreach (var field in new[] { "n", "meanE", "meanN", "sdE", "sdN", "rmseE", "rmseN", "rmseR", "nssda95", "nssdaMethod", "cep50", "r95", "ce90", "drms", "twoDrms", "p50", "p90", "p95" })
            Assert.True(report.GetProperty("horizontal").TryGetProperty(field, out _), $"missing horizontal.{field}");
        foreach (var field in new[] { "n", "mean", "sd", "rmse", "nssda95", "le90", "p95" })
            Assert.True(report.GetProperty("vertical").TryGetProperty(field, out _), $"missing vertical.{field}");
        foreach (var field in new[] { "marks", "fixes", "paired", "unpaired", "excluded" })
            Assert.True(report.GetProperty("counts").TryGetProperty(field, out _), $"missing counts.{field}");
        var checkIds = report.GetProperty("checks").EnumerateArray().Select(c => c.GetProperty("id").GetString()).ToList();
        Assert.Contains("min-points", checkIds);
        var cautions = string.Join(" ", report.GetProperty("cautions").EnumerateArray().Select(c => c.GetString()));
        Assert.Contains("not a survey certification", cautions);
        Assert.Contains("licensed surveyor", cautions);
        Assert.Contains("call-before-you-dig", cautions);
    }
}
