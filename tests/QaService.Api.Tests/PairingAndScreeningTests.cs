using System.Net;
using System.Net.Http.Json;
using System.Text.Json;
using System.Text.Json.Nodes;
using QaService.Api.Tests.Support;

namespace QaService.Api.Tests;

/// <summary>
/// Ambiguous proximity pairing, repeat-occupation precision, the mean-of-occupations option and the
/// screening endpoint. Precision is checked against its definition computed here from the report's own
/// residuals (sample SD, n − 1, by plain arithmetic); positions are invented (Fallowmere survey).
/// </summary>
public sealed class PairingAndScreeningTests(ServiceHost host) : IClassFixture<ServiceHost>
{
    private readonly HttpClient client = host.Factory.CreateClient();

    private static JsonObject Request(string fixes, string pairing) => JsonNode.Parse($$"""
        {
          "marks": { "crs": "EPSG:4979", "points": [
            { "id": "FM-01", "lat": 52.000000, "lon": 0.100000, "h": 20.0 },
            { "id": "FM-02", "lat": 52.000027, "lon": 0.100000, "h": 20.0 },
            { "id": "FM-03", "lat": 52.010000, "lon": 0.110000, "h": 21.0 } ] },
          "fixes": { "crs": "EPSG:4979", "points": [ {{fixes}} ] },
          "pairing": {{pairing}}
        }
        """)!.AsObject();

    private async Task<JsonElement> Create(JsonObject body)
    {
        var response = await client.PostJsonAsync(body);
        var text = await response.Content.ReadAsStringAsync();
        Assert.True(response.StatusCode == HttpStatusCode.Created, text);
        return JsonDocument.Parse(text).RootElement;
    }

    [Fact]
    public async Task A_fix_within_the_radius_of_two_marks_is_flagged_ambiguous_and_the_nearest_wins()
    {
        // FM-01 and FM-02 are about 3 m apart (0.000027° of latitude); the fix lies 1 m from FM-01.
        var report = await Create(Request("""{ "id": "X1", "lat": 52.000009, "lon": 0.1, "h": 20.0 }""", """{ "radius": 5 }"""));
        var ambiguous = Assert.Single(report.GetProperty("pairing").GetProperty("ambiguous").EnumerateArray());
        Assert.Equal("X1", ambiguous.GetProperty("fix").GetString());
        Assert.Equal("FM-01", ambiguous.GetProperty("mark").GetString());
        Assert.Equal("FM-02", Assert.Single(ambiguous.GetProperty("alsoWithin").EnumerateArray()).GetString());
    }

    [Fact]
    public async Task A_request_without_ambiguity_or_repeats_has_no_pairing_block()
    {
        var report = await Create(Request("""{ "id": "X1", "mark": "FM-03", "lat": 52.010001, "lon": 0.11, "h": 21.0 }""", "null"));
        Assert.Equal(JsonValueKind.Null, report.GetProperty("pairing").ValueKind);
        Assert.Equal(JsonValueKind.Null, report.GetProperty("ingest").ValueKind);
    }

    private const string Repeats = """
        { "id": "R1", "mark": "FM-03", "lat": 52.0100010, "lon": 0.1100000, "h": 21.10 },
        { "id": "R2", "mark": "FM-03", "lat": 52.0100016, "lon": 0.1100021, "h": 21.04 },
        { "id": "R3", "mark": "FM-03", "lat": 52.0100004, "lon": 0.1099990, "h": 21.16 },
        { "id": "S1", "mark": "FM-01", "lat": 52.0000020, "lon": 0.1000010, "h": 20.02 }
        """;

    /// <summary>Half a unit of the last decimal the report writes for residual components (1 µm), plus rounding.</summary>
    private const double ResidualResolutionMetres = 1e-6;

    [Fact]
    public async Task Repeat_occupations_report_precision_about_their_own_mean()
    {
        var report = await Create(Request(Repeats, "null"));
        var residuals = report.GetProperty("residuals").EnumerateArray().Where(r => r.GetProperty("mark").GetString() == "FM-03").ToList();
        var precision = Assert.Single(report.GetProperty("pairing").GetProperty("repeatOccupations").EnumerateArray());
        Assert.Equal("FM-03", precision.GetProperty("mark").GetString());
        Assert.Equal(3, precision.GetProperty("n").GetInt32());
        foreach (var (component, sd, mean) in new[] { ("dE", "sdE", "meanE"), ("dN", "sdN", "meanN"), ("dU", "sdU", "meanU") })
        {
            var values = residuals.Select(r => r.GetProperty(component).GetDouble()).ToArray();
            var average = values.Sum() / values.Length;
            var sampleSd = Math.Sqrt(values.Sum(v => (v - average) * (v - average)) / (values.Length - 1));
            // The report's residuals are written to the micrometre (ResidualJsonConverter); the figures use the unrounded values.
            Assert.Equal(average, precision.GetProperty(mean).GetDouble(), ResidualResolutionMetres);
            Assert.Equal(sampleSd, precision.GetProperty(sd).GetDouble(), ResidualResolutionMetres);
        }
        Assert.Equal("each", report.GetProperty("pairing").GetProperty("occupations").GetString());
    }

    [Fact]
    public async Task Mean_of_occupations_assesses_one_point_per_mark()
    {
        var each = await Create(Request(Repeats, "null"));
        var mean = await Create(Request(Repeats, """{ "occupations": "mean" }"""));
        Assert.Equal(2, mean.GetProperty("horizontal").GetProperty("n").GetInt32());
        Assert.Equal(4, mean.GetProperty("counts").GetProperty("paired").GetInt32());
        var fm03 = each.GetProperty("residuals").EnumerateArray().Where(r => r.GetProperty("mark").GetString() == "FM-03").ToList();
        var meanResidual = mean.GetProperty("residuals").EnumerateArray().Single(r => r.GetProperty("mark").GetString() == "FM-03");
        Assert.Equal(fm03.Average(r => r.GetProperty("dE").GetDouble()), meanResidual.GetProperty("dE").GetDouble(), ResidualResolutionMetres);
        Assert.Equal("mean of 3 occupations", meanResidual.GetProperty("fix").GetString());
    }

    [Fact]
    public async Task Unknown_occupation_mode_points_at_the_field() =>
        await ProblemAssert.IsBadInputAsync(await client.PostJsonAsync(Request(Repeats, """{ "occupations": "median" }""")), "/pairing/occupations", "median");

    [Fact]
    public async Task Screening_returns_a_decision_and_every_reason_per_fix()
    {
        var body = JsonNode.Parse("""
            { "profile": "utility-locating-rtk", "thresholds": { "flagHorizontalError": 0.03 },
              "fixes": [
                { "id": "V1", "quality": "rtk-fixed", "satellites": 18, "pdop": 1.4, "hdop": 0.7, "vdop": 1.2, "horizontalError": 0.012, "verticalError": 0.02, "correctionAge": 1, "elevationMask": 15 },
                { "id": "V2", "quality": "rtk-float", "satellites": 9, "hdop": 1.1, "horizontalError": 0.04 },
                { "id": "V3", "quality": "autonomous", "satellites": 3, "hdop": 2.5 } ] }
            """)!;
        var response = await client.PostAsJsonAsync("/v1/screenings", body);
        var text = await response.Content.ReadAsStringAsync();
        Assert.True(response.StatusCode == HttpStatusCode.OK, text);
        var report = JsonDocument.Parse(text).RootElement;
        var results = report.GetProperty("results").EnumerateArray().ToList();
        Assert.Equal(["accept", "flag", "reject"], results.Select(r => r.GetProperty("decision").GetString()));
        Assert.Contains(results[1].GetProperty("reasons").EnumerateArray(), r => r.GetProperty("rule").GetString() == "horizontal-error");
        var v3 = results[2].GetProperty("reasons").EnumerateArray().Select(r => r.GetProperty("rule").GetString()).ToList();
        Assert.Contains("quality", v3);
        Assert.Contains("satellites", v3);
        Assert.Contains("expected-error", v3);
        Assert.Equal(0.03, report.GetProperty("thresholds").GetProperty("flagHorizontalError").GetDouble());
        Assert.Equal((1, 1, 1), (report.GetProperty("accepted").GetInt32(), report.GetProperty("flagged").GetInt32(), report.GetProperty("rejected").GetInt32()));
    }

    [Fact]
    public async Task Screening_errors_are_problems_with_pointers()
    {
        var response = await client.PostAsJsonAsync("/v1/screenings", JsonNode.Parse("""{ "profile": "none", "fixes": [ { "quality": "rtk" } ] }"""));
        await ProblemAssert.IsBadInputAsync(response, "/fixes/0/quality", "rtk-fixed");
    }

    [Fact]
    public async Task Screening_profiles_are_listed_and_documented_in_openapi()
    {
        var profiles = JsonDocument.Parse(await client.GetStringAsync("/v1/screenings/profiles")).RootElement;
        Assert.Contains(profiles.EnumerateArray(), p => p.GetProperty("name").GetString() == "asset-inventory-sbas");
        var openApi = await client.GetStringAsync("/openapi/v1.json");
        Assert.Contains("utility-locating-rtk", openApi);
        Assert.Contains("common practice", openApi);
    }
}
