using System.Net;
using System.Text;
using System.Text.Json;
using System.Text.Json.Nodes;
using QaService.Api.Tests.Support;

namespace QaService.Api.Tests;

/// <summary>
/// Fix attributes through the whole route: request → validation → pairing → report <c>groups</c> and residuals → HTML, and the
/// receiver calibration of POST /v1/screenings from the stored report. Reference: tests/reference-data/group-cases.json, made by
/// make-group-reference.py (numpy 1.24.2, scipy 1.10.1: scipy.stats.levene(center='median'), Welch 1951 by formula with
/// scipy.stats.f.sf, cross-checked there against scipy.stats.ttest_ind(equal_var=False) for two groups). Tolerances: figures
/// 1e-6 m (the service's ENU residuals agree with the script's vector algebra far below that), test statistics and p-values
/// 1e-7 relative, calibration ratios 1e-5 relative (the stored report holds dH to 1 µm).
/// </summary>
public sealed class AttributeGroupTests(ServiceHost host) : IClassFixture<ServiceHost>
{
    private readonly HttpClient client = host.Factory.CreateClient();

    private static JsonElement Reference { get; } = JsonDocument.Parse(File.ReadAllText(ReferenceData.PathOf("group-cases.json"))).RootElement;

    private static JsonObject Request() => JsonNode.Parse(Reference.GetProperty("request").GetRawText())!.AsObject();

    private async Task<JsonElement> Create(JsonNode body)
    {
        var response = await client.PostJsonAsync(body);
        var text = await response.Content.ReadAsStringAsync();
        Assert.True(response.StatusCode == HttpStatusCode.Created, text);
        return JsonDocument.Parse(text).RootElement;
    }

    [Fact]
    public async Task Group_figures_and_tests_of_difference_agree_with_numpy_and_scipy()
    {
        var report = await Create(Request());
        var groups = report.GetProperty("groups").EnumerateArray().ToDictionary(g => g.GetProperty("attribute").GetString()!);
        Assert.Equal(["featureClass", "crew", "receiver"], groups.Keys);
        foreach (var attribute in Reference.GetProperty("groups").EnumerateObject())
        {
            var actual = groups[attribute.Name];
            var byValue = actual.GetProperty("groups").EnumerateArray().ToDictionary(g => g.GetProperty("value").GetString()!);
            foreach (var expected in attribute.Value.GetProperty("groups").EnumerateArray())
            {
                var group = byValue[expected.GetProperty("value").GetString()!];
                Assert.Equal(expected.GetProperty("n").GetInt32(), group.GetProperty("n").GetInt32());
                var h = group.GetProperty("horizontal");
                var v = group.GetProperty("vertical");
                foreach (var (name, value) in new[] { ("rmseE", h.GetProperty("rmseE")), ("rmseN", h.GetProperty("rmseN")), ("rmseR", h.GetProperty("rmseR")),
                    ("nssda95", h.GetProperty("nssda95")), ("meanE", h.GetProperty("meanE")), ("meanN", h.GetProperty("meanN")),
                    ("verticalRmse", v.GetProperty("rmse")), ("verticalNssda95", v.GetProperty("nssda95")) })
                    Assert.True(Math.Abs(expected.GetProperty(name).GetDouble() - value.GetDouble()) <= 1e-6, $"{attribute.Name}/{group.GetProperty("value")} {name}");
            }
            var tests = actual.GetProperty("tests").EnumerateArray()
                .ToDictionary(t => $"{t.GetProperty("hypothesis").GetString()} {t.GetProperty("quantity").GetString()}");
            foreach (var expected in attribute.Value.GetProperty("tests").EnumerateObject())
            {
                var test = tests[expected.Name];
                Close(expected.Value.GetProperty("statistic").GetDouble(), test.GetProperty("statistic").GetDouble(), $"{attribute.Name} {expected.Name} F");
                Close(expected.Value.GetProperty("df2").GetDouble(), test.GetProperty("degreesOfFreedom2").GetDouble(), $"{attribute.Name} {expected.Name} df2");
                Close(expected.Value.GetProperty("pValue").GetDouble(), test.GetProperty("pValue").GetDouble(), $"{attribute.Name} {expected.Name} p");
                Assert.Contains(expected.Name.StartsWith("equal-spread", StringComparison.Ordinal) ? "Brown–Forsythe" : "Welch", test.GetProperty("method").GetString());
            }
        }
    }

    /// <summary>
    /// 1e-7 relative, and 1e-7 absolute for values below 1: the service's residuals and the script's agree to ~1e-9 m, which
    /// moves an F statistic near 0 (two groups with almost equal means) by ~1e-9 absolute but more than 1e-7 of itself.
    /// </summary>
    private static void Close(double expected, double actual, string what) =>
        Assert.True(Math.Abs(expected - actual) <= 1e-7 * Math.Max(1, Math.Abs(expected)), $"{what}: expected {expected:R}, got {actual:R}");

    [Fact]
    public async Task Each_feature_class_is_judged_against_its_own_spec()
    {
        var report = await Create(Request());
        var classes = report.GetProperty("groups")[0];
        Assert.Equal("featureClass", classes.GetProperty("attribute").GetString());
        var byValue = classes.GetProperty("groups").EnumerateArray().ToDictionary(g => g.GetProperty("value").GetString()!);
        // valve: nssda95 ≈ 0.116 m against its tight 0.10 m → fail; hydrant: ≈ 0.405 m against its loose 0.50 m → pass.
        Assert.Equal("fail", byValue["valve"].GetProperty("verdict").GetString());
        Assert.Equal("spec.featureClasses.valve", byValue["valve"].GetProperty("specSource").GetString());
        Assert.False(byValue["valve"].GetProperty("spec").GetProperty("horizontalMet").GetBoolean());
        Assert.Equal(0.10, byValue["valve"].GetProperty("spec").GetProperty("horizontal").GetDouble());
        Assert.Equal("pass", byValue["hydrant"].GetProperty("verdict").GetString());
        Assert.Equal(JsonValueKind.Null, byValue["hydrant"].GetProperty("spec").GetProperty("vertical").ValueKind);
        // pole: no class spec → the top-level spec, and 6 points are fewer than NSSDA's 20 → inconclusive, as at top level.
        Assert.Equal("inconclusive", byValue["pole"].GetProperty("verdict").GetString());
        Assert.Equal("spec", byValue["pole"].GetProperty("specSource").GetString());
        Assert.True(byValue["pole"].GetProperty("spec").GetProperty("horizontalMet").GetBoolean());
    }

    [Fact]
    public async Task Residuals_carry_the_attributes_and_the_page_shows_the_groups()
    {
        var report = await Create(Request());
        var first = report.GetProperty("residuals")[0];
        var fix = Reference.GetProperty("request").GetProperty("fixes").GetProperty("points")[0];
        foreach (var name in new[] { "featureClass", "crew", "receiver", "quality" })
            Assert.Equal(fix.GetProperty(name).GetString(), first.GetProperty(name).GetString());
        Assert.Equal(fix.GetProperty("sigmaH").GetDouble(), first.GetProperty("fixSigmaH").GetDouble(), 9);
        Assert.Equal(fix.GetProperty("hdop").GetDouble(), first.GetProperty("hdop").GetDouble(), 9);

        var html = await client.GetStringAsync($"/v1/assessments/{report.GetProperty("id").GetString()}/report.html");
        Assert.Contains("id=\"groups-featureClass\"", html);
        Assert.Contains("id=\"groups-receiver\"", html);
        Assert.Contains("spec.featureClasses.valve", html);
        Assert.Contains("Brown–Forsythe", html);
    }

    [Fact]
    public async Task A_report_without_attributes_has_no_groups_and_no_attribute_fields()
    {
        var response = await client.PostJsonAsync(Requests.Minimal());
        var text = await response.Content.ReadAsStringAsync();
        Assert.Equal(HttpStatusCode.Created, response.StatusCode);
        Assert.DoesNotContain("\"groups\"", text);
        Assert.DoesNotContain("featureClass", text);
        Assert.DoesNotContain("fixSigmaH", text);
    }

    [Theory]
    [InlineData("/fixes/points/0/featureClass", "featureClass", "\"\"")]
    [InlineData("/fixes/points/0/crew", "crew", "\"12345678901234567890123456789012345678901234567890123456789012345\"")]
    [InlineData("/fixes/points/0/hdop", "hdop", "0")]
    [InlineData("/fixes/points/0/quality", "quality", "\"rtk-magic\"")]
    public async Task Bad_attributes_get_a_pointer(string pointer, string field, string value)
    {
        var body = Requests.Minimal();
        body["fixes"]!["points"]![0]![field] = JsonNode.Parse(value);
        var response = await client.PostJsonAsync(body);
        await ProblemAssert.IsBadInputAsync(response, pointer, "");
    }

    [Fact]
    public async Task A_mark_carrying_a_fix_attribute_gets_a_pointer()
    {
        var body = Requests.Minimal();
        body["marks"]!["points"]![1]!["receiver"] = "GX-10";
        await ProblemAssert.IsBadInputAsync(await client.PostJsonAsync(body), "/marks/points/1/receiver", "");
    }

    [Theory]
    [InlineData("""{ "valve": { "horizontal": -1 } }""", "/spec/featureClasses/valve/horizontal")]
    [InlineData("""{ "valve": {} }""", "/spec/featureClasses/valve")]
    [InlineData("""{ "a/b": null }""", "/spec/featureClasses/a~1b")]
    public async Task Bad_feature_class_specs_get_a_pointer(string classes, string pointer)
    {
        var body = Requests.Minimal();
        body["spec"]!["featureClasses"] = JsonNode.Parse(classes);
        await ProblemAssert.IsBadInputAsync(await client.PostJsonAsync(body), pointer, "");
    }

    [Fact]
    public async Task Csv_attribute_columns_reach_the_report_by_header_name_and_by_column_map()
    {
        const string marks = "id,e,n,h\nA,500000.000,5400000.000,200.000\nB,500100.000,5400100.000,201.000\n";
        const string fixes = "id,mark,e,n,h,featureClass,Team,receiver,hdop,quality\n" +
                             "F1,A,500000.030,5400000.020,200.050,valve,north,GX-10,0.9,rtk-fixed\n" +
                             "F2,B,500100.010,5400099.960,201.020,hydrant,south,TR-3,1.4,rtk-float\n";
        const string options = """{ "marks": { "crs": "EPSG:32633" }, "fixes": { "crs": "EPSG:32633", "columns": { "crew": "Team" } } }""";
        var response = await client.PostFormAsync(Uploads.Form(options, marks, fixes));
        var text = await response.Content.ReadAsStringAsync();
        Assert.True(response.StatusCode == HttpStatusCode.Created, text);
        var report = JsonDocument.Parse(text).RootElement;
        var second = report.GetProperty("residuals")[1];
        Assert.Equal("hydrant", second.GetProperty("featureClass").GetString());
        Assert.Equal("south", second.GetProperty("crew").GetString());
        Assert.Equal("TR-3", second.GetProperty("receiver").GetString());
        Assert.Equal(1.4, second.GetProperty("hdop").GetDouble());
        Assert.Equal("rtk-float", second.GetProperty("quality").GetString());
        var crews = report.GetProperty("groups").EnumerateArray().Single(g => g.GetProperty("attribute").GetString() == "crew");
        Assert.Equal(["north", "south"], crews.GetProperty("groups").EnumerateArray().Select(g => g.GetProperty("value").GetString()));
    }

    [Fact]
    public async Task A_csv_attribute_too_long_is_pointed_at_its_line()
    {
        const string marks = "id,e,n\nA,500000.000,5400000.000\n";
        var fixes = "id,mark,e,n,featureClass\nF1,A,500000.030,5400000.020," + new string('v', 65) + "\n";
        const string options = """{ "marks": { "crs": "EPSG:32633", "heights": "none" }, "fixes": { "crs": "EPSG:32633", "heights": "none" } }""";
        await ProblemAssert.IsBadInputAsync(await client.PostFormAsync(Uploads.Form(options, marks, fixes)), "/fixes/line/2/featureClass", "");
    }

    [Fact]
    public async Task Gpx_type_and_src_become_feature_class_and_receiver()
    {
        const string marks = "id,lat,lon,h\nA,49.8215,18.1630,250.0\n";
        const string gpx = """
            <?xml version="1.0" encoding="UTF-8"?>
            <gpx version="1.1" creator="test" xmlns="http://www.topografix.com/GPX/1/1">
              <wpt lat="49.8215003" lon="18.1630002"><ele>250.04</ele><name>F1</name><src>GX-10</src><type>valve</type><fix>dgps</fix><hdop>1.2</hdop></wpt>
            </gpx>
            """;
        const string options = """{ "marks": { "crs": "EPSG:4979" }, "pairing": { "radius": 5 } }""";
        var response = await client.PostFormAsync(Uploads.Form(options, marks, gpx));
        var text = await response.Content.ReadAsStringAsync();
        Assert.True(response.StatusCode == HttpStatusCode.Created, text);
        var residual = JsonDocument.Parse(text).RootElement.GetProperty("residuals")[0];
        Assert.Equal("valve", residual.GetProperty("featureClass").GetString());
        Assert.Equal("GX-10", residual.GetProperty("receiver").GetString());
        Assert.Equal("dgnss", residual.GetProperty("quality").GetString());
        Assert.Equal(1.2, residual.GetProperty("hdop").GetDouble());
    }

    [Fact]
    public async Task Nmea_quality_hdop_and_gst_sigma_reach_the_residual()
    {
        // GST (NMEA 0183 v4.10): σ_lat 0.011 m, σ_lon 0.010 m → per-axis sigmaH √((0.011² + 0.010²)/2) = 0.0105119 m.
        const string nmea = "$GNRMC,101500.00,A,5530.00000000,N,00315.00000000,W,0.0,0.0,020426,,,R*42\n" +
                            "$GNGGA,101500.00,5530.00000000,N,00315.00000000,W,4,17,0.6,52.300,M,48.100,M,1.2,0012*73\n" +
                            "$GNGSA,A,3,01,02,03,04,05,06,07,08,,,,,1.2,0.6,1.0*20\n" +
                            "$GNGST,101500.00,0.010,0.012,0.009,45.0,0.011,0.010,0.018*7E\n";
        const string marks = "id,lat,lon,h\nA,55.5000001,-3.2500001,100.40\n";
        const string options = """{ "marks": { "crs": "EPSG:4979" }, "pairing": { "radius": 5 } }""";
        var response = await client.PostFormAsync(Uploads.Form(options, marks, nmea));
        var text = await response.Content.ReadAsStringAsync();
        Assert.True(response.StatusCode == HttpStatusCode.Created, text);
        var residual = JsonDocument.Parse(text).RootElement.GetProperty("residuals")[0];
        Assert.Equal("rtk-fixed", residual.GetProperty("quality").GetString());
        Assert.Equal(0.6, residual.GetProperty("hdop").GetDouble());
        Assert.Equal(Math.Sqrt((0.011 * 0.011 + 0.010 * 0.010) / 2), residual.GetProperty("fixSigmaH").GetDouble(), 6);
        Assert.False(residual.TryGetProperty("featureClass", out _));
    }

    private Task<HttpResponseMessage> Screen(string body) =>
        client.PostAsync("/v1/screenings", new StringContent(body, Encoding.UTF8, "application/json"));

    [Fact]
    public async Task Screening_calibrates_receivers_from_a_stored_assessment_and_falls_back_below_the_minimum()
    {
        var report = await Create(Request());
        var id = report.GetProperty("id").GetString();
        var response = await Screen($$"""
            { "profile": "utility-locating-rtk", "calibration": { "assessments": ["{{id}}"] }, "fixes": [
              { "id": "S1", "receiver": "GX-10", "quality": "rtk-fixed", "satellites": 14, "horizontalError": 0.007 },
              { "id": "S2", "receiver": "TR-3", "quality": "rtk-fixed", "satellites": 14, "horizontalError": 0.012 },
              { "id": "S3", "receiver": "GX-10", "quality": "rtk-fixed", "satellites": 14, "horizontalError": 0.030 } ] }
            """);
        var text = await response.Content.ReadAsStringAsync();
        Assert.True(response.StatusCode == HttpStatusCode.OK, text);
        var screening = JsonDocument.Parse(text).RootElement;

        var expected = AssertCalibrationMatchesReference(screening);

        // GX-10 rtk-fixed has 18 pairs (< 20), so GX-10 over all fix types (36 pairs) is used: ratio ≈ 2.165.
        var gx10 = expected.Single(e => e.GetProperty("receiver").GetString() == "GX-10" && e.GetProperty("quality").ValueKind == JsonValueKind.Null
            && e.GetProperty("basis").GetString() == "sigma").GetProperty("ratio").GetDouble();
        var results = screening.GetProperty("results");
        var s1 = results[0];
        Assert.Contains("36 pairs", s1.GetProperty("calibration").GetString());
        Assert.Equal(2 * gx10 * Math.Sqrt(2) * 0.007, s1.GetProperty("expectedHorizontalError").GetDouble(), 6);
        Assert.Equal("accept", s1.GetProperty("decision").GetString());
        // TR-3 rtk-fixed and TR-3 overall: 18 pairs each → the profile's rule, said in words.
        var s2 = results[1].GetProperty("calibration").GetString()!;
        Assert.Contains("18 pairs, fewer than the 20 required; the profile's expected-error rule was used", s2);
        Assert.Equal(JsonValueKind.Null, results[1].GetProperty("expectedHorizontalError").ValueKind);
        // S3: 2 · 2.165 · √2 · 0.030 ≈ 0.184 m > the profile's 0.05 m flag: the reason says it uses the calibration and on how many pairs.
        var reason = Assert.Single(results[2].GetProperty("reasons").EnumerateArray(), r => r.GetProperty("rule").GetString() == "expected-error");
        Assert.Equal("flag", reason.GetProperty("decision").GetString());
        Assert.Contains("calibration", reason.GetProperty("message").GetString());
        Assert.Contains("36 pairs", reason.GetProperty("message").GetString());
        Assert.Contains("36 assessed pairs", reason.GetProperty("basis").GetString());
    }

    [Fact]
    public async Task Screening_with_a_project_calibrates_from_its_deliveries()
    {
        var name = $"Larkfield hydrants {Guid.NewGuid():N}";
        var created = await client.PostAsync("/v1/projects", new StringContent(
            $$"""{ "name": "{{name}}", "spec": { "horizontal": 0.5 } }""", Encoding.UTF8, "application/json"));
        var projectText = await created.Content.ReadAsStringAsync();
        Assert.True(created.StatusCode == HttpStatusCode.Created, projectText);
        var projectId = JsonDocument.Parse(projectText).RootElement.GetProperty("id").GetString()!;
        var request = Request();
        request["projectId"] = projectId;
        await Create(request);

        var response = await Screen($$"""
            { "profile": "utility-locating-rtk", "projectId": "{{projectId}}", "fixes": [
              { "id": "S1", "receiver": "GX-10", "quality": "rtk-fixed", "satellites": 14, "horizontalError": 0.007 } ] }
            """);
        var text = await response.Content.ReadAsStringAsync();
        Assert.True(response.StatusCode == HttpStatusCode.OK, text);
        var screening = JsonDocument.Parse(text).RootElement;
        // The project's one delivery is the reference request: the same ratios as numpy's (group-cases.json).
        AssertCalibrationMatchesReference(screening);
        Assert.Contains(name, screening.GetProperty("calibration").GetRawText());
        Assert.Contains("36 pairs", screening.GetProperty("results")[0].GetProperty("calibration").GetString());

        var unknown = await Screen("""{ "projectId": "no-such-project", "fixes": [ { "id": "S1", "receiver": "GX-10", "hdop": 1.0 } ] }""");
        Assert.Equal("/projectId", await ProblemPointer(unknown));
        var both = await Screen($$"""{ "projectId": "{{projectId}}", "calibration": { "entries": [] }, "fixes": [ { "id": "S1", "hdop": 1.0 } ] }""");
        Assert.Equal("/calibration", await ProblemPointer(both));
    }

    /// <summary>Every calibration entry of a screening against numpy's (group-cases.json); returns the reference entries.</summary>
    private static List<JsonElement> AssertCalibrationMatchesReference(JsonElement screening)
    {
        var entries = screening.GetProperty("calibration").GetProperty("entries").EnumerateArray().ToList();
        var expected = Reference.GetProperty("calibration").GetProperty("entries").EnumerateArray().ToList();
        Assert.Equal(expected.Count, entries.Count);
        for (var i = 0; i < expected.Count; i++)
        {
            Assert.Equal(expected[i].GetProperty("receiver").GetString(), entries[i].GetProperty("receiver").GetString());
            Assert.Equal(expected[i].GetProperty("quality").ToString(), entries[i].GetProperty("quality").ToString());
            Assert.Equal(expected[i].GetProperty("basis").GetString(), entries[i].GetProperty("basis").GetString());
            Assert.Equal(expected[i].GetProperty("pairs").GetInt32(), entries[i].GetProperty("pairs").GetInt32());
            var ratio = expected[i].GetProperty("ratio").GetDouble();
            Assert.True(Math.Abs(ratio - entries[i].GetProperty("ratio").GetDouble()) <= 1e-5 * ratio, $"entry {i}");
        }
        return expected;
    }

    private static async Task<string?> ProblemPointer(HttpResponseMessage response)
    {
        Assert.Equal(HttpStatusCode.BadRequest, response.StatusCode);
        var problem = JsonDocument.Parse(await response.Content.ReadAsStringAsync()).RootElement;
        return problem.GetProperty("errors")[0].GetProperty("pointer").GetString();
    }

    [Fact]
    public async Task Exports_carry_each_fixs_attributes()
    {
        var report = await Create(Request());
        var id = report.GetProperty("id").GetString();
        var residuals = report.GetProperty("residuals").EnumerateArray().ToList();
        string? Text(JsonElement r, string name) => r.TryGetProperty(name, out var v) ? v.GetString() : null;

        // CSV (RFC 4180): the three attribute columns after the standard ones, row by row as in the report's residuals.
        var lines = (await client.GetStringAsync($"/v1/assessments/{id}/residuals.csv")).Split("\r\n", StringSplitOptions.RemoveEmptyEntries);
        Assert.EndsWith(",featureClass,crew,receiver", lines[0]);
        Assert.Equal(residuals.Count + 1, lines.Length);
        for (var i = 0; i < residuals.Count; i++)
        {
            var cells = lines[i + 1].Split(',');
            Assert.Equal(Text(residuals[i], "featureClass") ?? "", cells[^3]);
            Assert.Equal(Text(residuals[i], "crew") ?? "", cells[^2]);
            Assert.Equal(Text(residuals[i], "receiver") ?? "", cells[^1]);
        }

        // GeoJSON (RFC 7946): the same values as feature properties.
        var features = JsonDocument.Parse(await client.GetStringAsync($"/v1/assessments/{id}/residuals.geojson")).RootElement.GetProperty("features").EnumerateArray().ToList();
        Assert.Equal(residuals.Count, features.Count);
        for (var i = 0; i < residuals.Count; i++)
        {
            var properties = features[i].GetProperty("properties");
            Assert.Equal(Text(residuals[i], "featureClass"), Text(properties, "featureClass"));
            Assert.Equal(Text(residuals[i], "receiver"), Text(properties, "receiver"));
        }
        Assert.Contains(residuals, r => Text(r, "featureClass") is not null);
    }

    [Fact]
    public async Task Screening_takes_inline_calibration_entries()
    {
        var response = await Screen("""
            { "calibration": { "entries": [ { "receiver": "H-7", "quality": "sbas", "basis": "hdop", "pairs": 40, "ratio": 0.25 } ] }, "fixes": [
              { "id": "S1", "receiver": "H-7", "quality": "sbas", "satellites": 9, "hdop": 1.0 } ] }
            """);
        var text = await response.Content.ReadAsStringAsync();
        Assert.True(response.StatusCode == HttpStatusCode.OK, text);
        var result = JsonDocument.Parse(text).RootElement.GetProperty("results")[0];
        // 2 · 0.25 · HDOP 1.0 · 15.7 / 1.959964 = 4.005 m > the default profile's 1 m flag.
        Assert.Equal(2 * 0.25 * 15.7 / 1.959964, result.GetProperty("expectedHorizontalError").GetDouble(), 6);
        Assert.Contains("40 pairs", result.GetProperty("calibration").GetString());
        Assert.Contains(result.GetProperty("reasons").EnumerateArray(), r => r.GetProperty("rule").GetString() == "expected-error");
    }

    [Theory]
    [InlineData("""{ "assessments": ["does-not-exist-000000000000"] }""", "/calibration/assessments/0")]
    [InlineData("""{ "entries": [ { "receiver": "H-7", "basis": "guess", "pairs": 40, "ratio": 1 } ] }""", "/calibration/entries/0/basis")]
    [InlineData("""{ "entries": [ { "receiver": "H-7", "basis": "hdop", "pairs": 40, "ratio": -1 } ] }""", "/calibration/entries/0/ratio")]
    [InlineData("""{ }""", "/calibration")]
    public async Task Bad_calibration_inputs_get_a_pointer(string calibration, string pointer)
    {
        var response = await Screen($$"""{ "calibration": {{calibration}}, "fixes": [ { "id": "S1", "receiver": "H-7", "hdop": 1.0 } ] }""");
        await ProblemAssert.IsBadInputAsync(response, pointer, "");
    }
}
