using System.Net;
using System.Text.Json;
using System.Text.Json.Nodes;
using QaService.Api.Tests.Support;

namespace QaService.Api.Tests;

/// <summary>
/// Assessments across frames and height references (issue acceptance), on tests/reference-data/frame-cases.json
/// made by make-frame-cases.py with PROJ 9.1.1: designed centimetre residuals placed with cct's topocentric
/// conversion, fixes carried to ITRF2014 at epoch 2026.4 with cct and projinfo's pipeline (EPSG:8970 inverse),
/// marks' orthometric heights from vgridshift on egm96_15.gtx.
/// </summary>
public sealed class FrameAssessmentTests : IClassFixture<FrameAssessmentTests.Host>
{
    public sealed class Host : IDisposable
    {
        public QaServiceFactory Factory { get; } = new();
        public JsonElement Cases { get; } = JsonDocument.Parse(File.ReadAllText(ReferenceData.PathOf("frame-cases.json"))).RootElement.GetProperty("cases");
        public void Dispose() => Factory.Dispose();
    }

    /// <summary>
    /// 2 mm horizontally: the datum step agrees with PROJ within 1 mm (TimeDependentProjReferenceTests), the UTM
    /// inverse within 1e-6 m; the fixture rounds heights to 1e-6 m and degrees to 1e-12.
    /// </summary>
    private const double HorizontalToleranceMetres = 0.002;

    /// <summary>The acceptance for orthometric marks against ellipsoidal fixes: within 2 cm of truth.</summary>
    private const double GeoidVerticalToleranceMetres = 0.02;

    private readonly Host host;
    private readonly HttpClient client;

    public FrameAssessmentTests(Host host)
    {
        this.host = host;
        client = host.Factory.CreateClient();
    }

    private JsonElement Case(string name) => host.Cases.EnumerateArray().Single(c => c.GetProperty("name").GetString() == name);

    private async Task<JsonElement> RunAsync(JsonNode request)
    {
        var response = await client.PostJsonAsync(request);
        var text = await response.Content.ReadAsStringAsync();
        Assert.True(response.StatusCode == HttpStatusCode.Created, text);
        return JsonDocument.Parse(text).RootElement;
    }

    [Fact]
    public async Task Nad83_utm10_marks_against_itrf2014_fixes_at_2026_4_show_centimetre_residuals()
    {
        var testCase = Case("nad83-utm10-vs-itrf2014");
        var report = await RunAsync(JsonNode.Parse(testCase.GetProperty("request").GetRawText())!);
        var residuals = report.GetProperty("residuals").EnumerateArray().ToDictionary(r => r.GetProperty("fix").GetString()!);
        foreach (var designed in testCase.GetProperty("designedResiduals").EnumerateArray())
        {
            var r = residuals[designed.GetProperty("fix").GetString()!];
            Assert.Equal(designed.GetProperty("dE").GetDouble(), r.GetProperty("dE").GetDouble(), HorizontalToleranceMetres);
            Assert.Equal(designed.GetProperty("dN").GetDouble(), r.GetProperty("dN").GetDouble(), HorizontalToleranceMetres);
            Assert.Equal(designed.GetProperty("dU").GetDouble(), r.GetProperty("dU").GetDouble(), HorizontalToleranceMetres);
        }
        Assert.True(report.GetProperty("horizontal").GetProperty("rmseR").GetDouble() < 0.1);
        var operation = report.GetProperty("frames").GetProperty("operation").GetString()!;
        Assert.Contains("EPSG:8970", operation, StringComparison.Ordinal);
        Assert.Contains("2026.4", operation, StringComparison.Ordinal);
        Assert.Contains("accuracy", operation, StringComparison.Ordinal);
    }

    [Fact]
    public async Task Ignoring_the_datum_change_would_have_shown_about_a_metre_and_a_half()
    {
        // Control: the same fixes labelled NAD83(2011) (EPSG:6319) skip the ITRF2014 → NAD83(2011) step; EPSG:8970
        // moves points in Oregon by about 1–1.5 m at 2026.4 (cct output above), so the residuals jump to that size.
        var request = JsonNode.Parse(Case("nad83-utm10-vs-itrf2014").GetProperty("request").GetRawText())!;
        request["fixes"]!["crs"] = "EPSG:6319";
        var report = await RunAsync(request);
        Assert.InRange(report.GetProperty("horizontal").GetProperty("rmseR").GetDouble(), 0.8, 2.0);
    }

    [Fact]
    public async Task Orthometric_egm96_marks_against_ellipsoidal_fixes_recover_the_designed_heights()
    {
        var testCase = Case("egm96-orthometric-marks");
        var report = await RunAsync(JsonNode.Parse(testCase.GetProperty("request").GetRawText())!);
        var residuals = report.GetProperty("residuals").EnumerateArray().ToDictionary(r => r.GetProperty("fix").GetString()!);
        foreach (var designed in testCase.GetProperty("designedResiduals").EnumerateArray())
        {
            var r = residuals[designed.GetProperty("fix").GetString()!];
            Assert.Equal(designed.GetProperty("dU").GetDouble(), r.GetProperty("dU").GetDouble(), GeoidVerticalToleranceMetres);
            Assert.Equal(designed.GetProperty("dE").GetDouble(), r.GetProperty("dE").GetDouble(), HorizontalToleranceMetres);
        }
        Assert.DoesNotContain(report.GetProperty("checks").EnumerateArray(), c => c.GetProperty("id").GetString() == "height-reference" && c.GetProperty("status").GetString() == "fail");
        Assert.Contains("egm96", report.GetProperty("frames").GetProperty("operation").GetString()!, StringComparison.OrdinalIgnoreCase);
    }

    [Fact]
    public async Task Unknown_geoid_is_a_bad_request()
    {
        var request = JsonNode.Parse(Case("egm96-orthometric-marks").GetProperty("request").GetRawText())!;
        request["marks"]!["geoid"] = "geoid12b";
        await ProblemAssert.IsBadInputAsync(await client.PostJsonAsync(request), "/marks/geoid", "not known");
    }
}
