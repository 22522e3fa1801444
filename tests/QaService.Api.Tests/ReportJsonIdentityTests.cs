using System.Net;
using System.Text.Json;
using System.Text.Json.Nodes;
using System.Text.Json.Serialization;
using QaService.Api.Tests.Support;
using QaService.Core.Reporting;

namespace QaService.Api.Tests;

/// <summary>
/// Reports are written with generated JSON code (ReportJsonContext) for speed; these check the bytes equal what
/// System.Text.Json's reflection-based serializer writes with the contract's options (web defaults, nulls kept),
/// on the reference cases (tests/reference-data/assessment-cases.json) and the demo report.
/// </summary>
public sealed class ReportJsonIdentityTests(DemoServiceHost host) : IClassFixture<DemoServiceHost>
{
    /// <summary>The writer options as they were before source generation: reflection only.</summary>
    private static readonly JsonSerializerOptions Reflection = new(JsonSerializerDefaults.Web) { DefaultIgnoreCondition = JsonIgnoreCondition.Never };

    private readonly HttpClient client = host.Factory.CreateClient();

    [Theory]
    [InlineData(0)]
    [InlineData(1)]
    [InlineData(2)]
    public async Task Reference_case_report_is_byte_identical_to_the_reflection_serializer(int caseIndex)
    {
        var cases = JsonDocument.Parse(File.ReadAllText(ReferenceData.PathOf("assessment-cases.json"))).RootElement.GetProperty("cases");
        var response = await client.PostJsonAsync(JsonNode.Parse(cases[caseIndex].GetProperty("request").GetRawText())!);
        var posted = await response.Content.ReadAsStringAsync();
        Assert.True(response.StatusCode == HttpStatusCode.Created, posted);
        AssertSameAsReflection(posted);
    }

    [Fact]
    public async Task Demo_report_is_byte_identical_to_the_reflection_serializer() =>
        AssertSameAsReflection(await client.GetStringAsync("/v1/assessments/demo"));

    private static void AssertSameAsReflection(string written)
    {
        var report = JsonSerializer.Deserialize<AssessmentReport>(written, Reflection)!;
        Assert.Equal(JsonSerializer.Serialize(report, Reflection), written);
        Assert.Equal(JsonSerializer.Serialize(report, ReportJson.Write), written);
    }
}
