using System.Net;
using System.Text.Json;
using System.Text.Json.Nodes;
using QaService.Api.Tests.Support;

namespace QaService.Api.Tests;

/// <summary>
/// Pairing, exclusions, missing heights and the other input forms of api-v1. Positions are made with
/// PROJ 9.1.1 (cs2cs) where a value matters; the values quoted beside each request say how.
/// </summary>
public sealed class AssessmentBehaviourTests : IClassFixture<ServiceHost>
{
    private readonly HttpClient client;

    public AssessmentBehaviourTests(ServiceHost host) => client = host.Factory.CreateClient();

    private async Task<JsonElement> CreateAsync(JsonNode body)
    {
        var response = await client.PostJsonAsync(body);
        var text = await response.Content.ReadAsStringAsync();
        Assert.True(response.StatusCode == HttpStatusCode.Created, text);
        return JsonDocument.Parse(text).RootElement;
    }

    // Mark A at EPSG:32633 (500000, 5400000) is 48.753013004 N, 15.000000000 E (PROJ 9.1.1: cs2cs -f %.9f EPSG:32633 EPSG:4979),
    // h 200.0; the point 0.30 m north of it is 48.753015702 N (GeographicLib 2.1.2: echo "0 0.30 0" | CartConvert -r -l 48.753013004 15.0 200).
    private static JsonObject TwoMarks(string fixesJson, string? extra = null) => JsonNode.Parse($$"""
        {
          "marks": { "crs": "EPSG:32633", "heights": "ellipsoidal", "points": [
            { "id": "A", "e": 500000.0, "n": 5400000.0, "h": 200.0 },
            { "id": "B", "e": 500100.0, "n": 5400000.0, "h": 200.0 } ] },
          "fixes": {{fixesJson}}
          {{extra}}
        }
        """)!.AsObject();

    [Fact]
    public async Task Fix_without_mark_pairs_with_the_nearest_mark_inside_the_radius()
    {
        var body = TwoMarks("""{ "crs": "EPSG:4979", "heights": "ellipsoidal", "points": [ { "id": "near-A", "lat": 48.753015702, "lon": 15.0, "h": 200.0 } ] }""",
            """, "pairing": { "radius": 1.0 }""");
        var report = await CreateAsync(body);
        var residual = report.GetProperty("residuals")[0];
        Assert.Equal("A", residual.GetProperty("mark").GetString());
        Assert.Equal("proximity", residual.GetProperty("pairedBy").GetString());
        Assert.Equal(0.30, residual.GetProperty("dN").GetDouble(), 0.002);
        Assert.Equal(1, report.GetProperty("counts").GetProperty("paired").GetInt32());
    }

    [Fact]
    public async Task Fix_without_mark_and_without_pairing_is_unpaired()
    {
        var body = TwoMarks("""{ "crs": "EPSG:4979", "points": [ { "lat": 48.753015702, "lon": 15.0, "h": 200.0 }, { "mark": "A", "lat": 48.753015702, "lon": 15.0, "h": 200.0 } ] }""");
        var report = await CreateAsync(body);
        var counts = report.GetProperty("counts");
        Assert.Equal(2, counts.GetProperty("fixes").GetInt32());
        Assert.Equal(1, counts.GetProperty("paired").GetInt32());
        Assert.Equal(1, counts.GetProperty("unpaired").GetInt32());
        Assert.Equal("#2", report.GetProperty("residuals")[0].GetProperty("fix").GetString());
    }

    [Fact]
    public async Task Fix_outside_the_pairing_radius_is_unpaired()
    {
        var body = TwoMarks("""{ "crs": "EPSG:4979", "points": [ { "lat": 48.753015702, "lon": 15.0, "h": 200.0 } ] }""", """, "pairing": { "radius": 0.1 }""");
        var report = await CreateAsync(body);
        Assert.Equal(1, report.GetProperty("counts").GetProperty("unpaired").GetInt32());
        Assert.Equal(JsonValueKind.Null, report.GetProperty("horizontal").ValueKind);
        Assert.Equal("inconclusive", report.GetProperty("verdict").GetString());
    }

    [Fact]
    public async Task Excluded_fix_is_listed_but_not_counted()
    {
        var body = TwoMarks("""{ "crs": "EPSG:4979", "points": [ { "id": "F1", "mark": "A", "lat": 48.753015702, "lon": 15.0, "h": 200.0 }, { "id": "F2", "mark": "B", "lat": 48.7530, "lon": 15.0014, "h": 200.0 } ] }""",
            """, "exclusions": [ { "fix": "F2", "reason": "float solution noted in the field book" } ]""");
        var report = await CreateAsync(body);
        Assert.Equal(1, report.GetProperty("counts").GetProperty("excluded").GetInt32());
        Assert.Equal(1, report.GetProperty("horizontal").GetProperty("n").GetInt32());
        var excluded = report.GetProperty("residuals").EnumerateArray().Single(r => r.GetProperty("fix").GetString() == "F2");
        Assert.Equal("float solution noted in the field book", excluded.GetProperty("excluded").GetString());
    }

    [Fact]
    public async Task Heights_none_gives_no_vertical_block()
    {
        var body = TwoMarks("""{ "crs": "EPSG:4326", "heights": "none", "points": [ { "mark": "A", "lat": 48.753015702, "lon": 15.0 } ] }""");
        var report = await CreateAsync(body);
        Assert.Equal(JsonValueKind.Null, report.GetProperty("vertical").ValueKind);
        Assert.Equal(JsonValueKind.Null, report.GetProperty("residuals")[0].GetProperty("dU").ValueKind);
        Assert.Equal(0.30, report.GetProperty("residuals")[0].GetProperty("dN").GetDouble(), 0.002);
    }

    [Fact]
    public async Task Fix_without_h_has_no_vertical_residual_and_an_unbiased_horizontal_one()
    {
        // The fix has no height: the horizontal residual must not pick up the 200 m height of the mark.
        var body = TwoMarks("""{ "crs": "EPSG:4326", "points": [ { "mark": "A", "lat": 48.753015702, "lon": 15.0 }, { "mark": "A", "lat": 48.753015702, "lon": 15.0, "h": 200.05 } ] }""");
        var report = await CreateAsync(body);
        var residuals = report.GetProperty("residuals");
        Assert.Equal(JsonValueKind.Null, residuals[0].GetProperty("dU").ValueKind);
        Assert.Equal(residuals[1].GetProperty("dN").GetDouble(), residuals[0].GetProperty("dN").GetDouble(), 1e-6);
        Assert.Equal(1, report.GetProperty("vertical").GetProperty("n").GetInt32());
    }

    [Fact]
    public async Task Geocentric_fixes_agree_with_geographic_fixes()
    {
        // PROJ 9.1.1: cs2cs -f %.6f EPSG:4979 EPSG:4978 on "48.753015702 15.0 200.0" → 4069693.849 1090471.180 4772644.876 (rounded to the mm here).
        var geographic = await CreateAsync(TwoMarks("""{ "crs": "EPSG:4979", "points": [ { "mark": "A", "lat": 48.753015702, "lon": 15.0, "h": 200.0 } ] }"""));
        var geocentric = await CreateAsync(TwoMarks("""{ "crs": "EPSG:4978", "points": [ { "mark": "A", "x": 4069693.849, "y": 1090471.180, "z": 4772644.876 } ] }"""));
        foreach (var component in new[] { "dE", "dN", "dU" })
            Assert.Equal(geographic.GetProperty("residuals")[0].GetProperty(component).GetDouble(), geocentric.GetProperty("residuals")[0].GetProperty(component).GetDouble(), 0.002);
    }

    [Fact]
    public async Task Southern_hemisphere_zone_is_read()
    {
        // EPSG:32759 (UTM 59S) e 300000, n 5000000 is 45.125154 S, 168.456877 E (PROJ 9.1.1: cs2cs -f %.6f EPSG:32759 EPSG:4326).
        var body = JsonNode.Parse("""
            { "marks": { "crs": "EPSG:32759", "points": [ { "id": "Q", "e": 300000.0, "n": 5000000.0, "h": 10.0 } ] },
              "fixes": { "crs": "EPSG:32759", "points": [ { "mark": "Q", "e": 300000.1, "n": 5000000.2, "h": 10.0 } ] } }
            """)!;
        var report = await CreateAsync(body);
        var residual = report.GetProperty("residuals")[0];
        Assert.Equal(-45.125154, residual.GetProperty("markLatitude").GetDouble(), 1e-6);
        // Grid offsets of 0.1/0.2 m: rotated by the meridian convergence, divided by the point scale k ≈ 1.0001 200 km off the central meridian
        Assert.Equal(Math.Sqrt(0.05), residual.GetProperty("dH").GetDouble(), 0.001);
    }

    [Fact]
    public async Task Geoid_sized_height_offset_is_flagged()
    {
        var points = string.Join(",", Enumerable.Range(0, 6).Select(i =>
            $$"""{ "mark": "{{(i % 2 == 0 ? "A" : "B")}}", "e": {{500000 + (i % 2) * 100}}.0{{i}}, "n": 5400000.0{{i}}, "h": {{248.0 + i * 0.01}} }"""));
        var body = TwoMarks($$"""{ "crs": "EPSG:32633", "points": [ {{points}} ] }""");
        var report = await CreateAsync(body);
        var check = report.GetProperty("checks").EnumerateArray().Single(c => c.GetProperty("id").GetString() == "height-reference");
        Assert.Equal("fail", check.GetProperty("status").GetString());
        Assert.Contains("geoid", check.GetProperty("message").GetString());
    }

    [Fact]
    public async Task No_spec_is_inconclusive()
    {
        var body = TwoMarks("""{ "crs": "EPSG:4979", "points": [ { "mark": "A", "lat": 48.753015702, "lon": 15.0, "h": 200.0 } ] }""");
        var report = await CreateAsync(body);
        Assert.Equal("inconclusive", report.GetProperty("verdict").GetString());
    }
}
