using System.Net;
using System.Text;
using System.Text.Json;
using System.Text.Json.Nodes;
using QaService.Api.Tests.Support;

namespace QaService.Api.Tests;

/// <summary>
/// A GIS team's CRS on a national datum, end to end: DHDN / 3-degree Gauss-Krüger zone 3 (EPSG:31467; NTv2 grid
/// BETA2007.gsb from Debian proj-data) and ED50 / UTM zone 30N (EPSG:23030; 7-parameter Helmert), in POST /v1/transform
/// and in an assessment with fixes in WGS 84; operationCode, area-of-use warnings; marks carried between epochs by a plate.
/// Expected values: PROJ 9.1.1 cs2cs / cct as written beside each.
/// </summary>
public sealed class NationalDatumTests(ServiceHost host) : IClassFixture<ServiceHost>
{
    /// <summary>1e-8° ≈ 1.1 mm: the 2 mm for the same operation, with cs2cs's 1e-10° output rounding far below.</summary>
    private const double DegreeTolerance = 1e-8;

    private readonly HttpClient client = host.Factory.CreateClient();

    // PROJ 9.1.1: echo "<n> <e>" | cs2cs -d 10 EPSG:31467 EPSG:4326 (first candidate: DHDN to WGS 84 (4), EPSG:15949, BETA2007)
    private static readonly (double E, double N, double Lat, double Lon)[] GaussKruger =
    [
        (3500000, 5400000, 48.7375348737, 8.9989754850),
        (3450000, 5500000, 49.6346355674, 8.3067953198),
        (3550000, 5350000, 48.2859279838, 9.6727307683),
        (3520000, 5450000, 49.1868153727, 9.2733247571),
    ];

    private async Task<JsonElement> TransformAsync(string json, HttpStatusCode expected = HttpStatusCode.OK)
    {
        var response = await client.PostAsync("/v1/transform", new StringContent(json, Encoding.UTF8, "application/json"));
        var text = await response.Content.ReadAsStringAsync();
        Assert.True(response.StatusCode == expected, text);
        return JsonDocument.Parse(text).RootElement;
    }

    [Fact]
    public async Task Gauss_kruger_on_dhdn_goes_through_the_beta2007_grid_as_cs2cs_does()
    {
        var points = string.Join(",", GaussKruger.Select(p => $$"""{ "e": {{p.E}}, "n": {{p.N}} }"""));
        var body = await TransformAsync($$"""{ "from": "EPSG:31467", "to": "EPSG:4326", "points": [ {{points}} ] }""");
        for (var i = 0; i < GaussKruger.Length; i++)
        {
            var p = body.GetProperty("points")[i];
            Assert.Equal(GaussKruger[i].Lat, p.GetProperty("lat").GetDouble(), DegreeTolerance);
            Assert.Equal(GaussKruger[i].Lon, p.GetProperty("lon").GetDouble(), DegreeTolerance);
        }
        var operation = body.GetProperty("operation").GetString()!;
        Assert.Contains("EPSG:15949", operation, StringComparison.Ordinal);
        Assert.Contains("BETA2007.gsb", operation, StringComparison.Ordinal);
        Assert.Contains("Germany - onshore", operation, StringComparison.Ordinal);
        Assert.Equal(0, body.GetProperty("warnings").GetArrayLength());
    }

    [Fact]
    public async Task Ed50_utm_in_madrid_takes_the_spanish_helmert_and_operation_code_pins_another()
    {
        // PROJ 9.1.1: echo "440000 4473000" | cs2cs -d 10 EPSG:23030 EPSG:4326 → 40.4035758157 -3.7083708768 (ED50 to WGS 84 (28), EPSG:1633)
        var chosen = await TransformAsync("""{ "from": "EPSG:23030", "to": "EPSG:4326", "points": [ { "e": 440000, "n": 4473000 } ] }""");
        Assert.Equal(40.4035758157, chosen.GetProperty("points")[0].GetProperty("lat").GetDouble(), DegreeTolerance);
        Assert.Equal(-3.7083708768, chosen.GetProperty("points")[0].GetProperty("lon").GetDouble(), DegreeTolerance);
        Assert.Contains("EPSG:1633", chosen.GetProperty("operation").GetString()!, StringComparison.Ordinal);
        Assert.Contains("another can be chosen with operationCode", chosen.GetProperty("operation").GetString()!, StringComparison.Ordinal);

        // PROJ 9.1.1: cs2cs EPSG:23030 EPSG:4230, then cct $(projinfo -k operation EPSG:1133 -o PROJ -q) → 40.4035850200 -3.7082837969
        var pinned = await TransformAsync("""{ "from": "EPSG:23030", "to": "EPSG:4326", "operationCode": "EPSG:1133", "points": [ { "e": 440000, "n": 4473000 } ] }""");
        Assert.Equal(40.4035850200, pinned.GetProperty("points")[0].GetProperty("lat").GetDouble(), DegreeTolerance);
        Assert.Equal(-3.7082837969, pinned.GetProperty("points")[0].GetProperty("lon").GetDouble(), DegreeTolerance);
        Assert.Contains("EPSG:1133", pinned.GetProperty("operation").GetString()!, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("\"EPSG:99999999\"", "not a datum transformation the service knows")]
    [InlineData("\"EPSG:15948\"", "does not join")]
    [InlineData("\"ED50 (1)\"", "not an EPSG code")]
    public async Task Unknown_or_inapplicable_operation_code_is_a_400_at_the_pointer(string code, string fragment)
    {
        var response = await client.PostAsync("/v1/transform", new StringContent(
            $$"""{ "from": "EPSG:4230", "to": "EPSG:4326", "operationCode": {{code}}, "points": [ { "lat": 40.4, "lon": -3.7 } ] }""", Encoding.UTF8, "application/json"));
        await ProblemAssert.IsBadInputAsync(response, "/operationCode", fragment);
    }

    [Fact]
    public async Task A_point_outside_the_chosen_operations_area_is_warned_about_by_index()
    {
        // EPSG:1633 covers Spain's mainland except the north-west (EPSG extent); the second point is in Galicia (north-west).
        var body = await TransformAsync("""{ "from": "EPSG:4230", "to": "EPSG:4326", "operationCode": "EPSG:1633", "points": [ { "lat": 40.4, "lon": -3.7 }, { "lat": 42.9, "lon": -8.5 } ] }""");
        var warning = body.GetProperty("warnings").EnumerateArray().Single(w => w.GetProperty("message").GetString()!.Contains("EPSG:1633", StringComparison.Ordinal));
        Assert.Equal("outside-area-of-use", warning.GetProperty("code").GetString());
        Assert.Equal([1], warning.GetProperty("points").EnumerateArray().Select(p => p.GetInt32()));
    }

    [Fact]
    public async Task Geographic_to_projected_warns_from_the_input_positions_not_the_output_grid_values()
    {
        // EPSG:32633's area of use is 12..18 E, 0..84 N (EPSG extent via PROJ 9.1.1 proj.db): the first point lies inside every
        // area, the second (25 E) outside the zone only. The warnings must judge the input lat/lon, not the eastings the batch wrote.
        var body = await TransformAsync("""{ "from": "EPSG:4326", "to": "EPSG:32633", "points": [ { "lat": 50, "lon": 15, "h": 100 }, { "lat": 45, "lon": 25 } ] }""");
        var warning = Assert.Single(body.GetProperty("warnings").EnumerateArray());
        Assert.Contains("EPSG:32633", warning.GetProperty("message").GetString()!, StringComparison.Ordinal);
        Assert.Equal([1], warning.GetProperty("points").EnumerateArray().Select(p => p.GetInt32()));
    }

    [Fact]
    public async Task Assessment_with_gauss_kruger_marks_and_wgs84_fixes_joins_them_through_the_grid()
    {
        var marks = new JsonArray(GaussKruger.Select((p, i) => (JsonNode)new JsonObject { ["id"] = $"GK{i}", ["e"] = p.E, ["n"] = p.N }).ToArray());
        var fixes = new JsonArray(GaussKruger.Select((p, i) => (JsonNode)new JsonObject { ["id"] = $"F{i}", ["mark"] = $"GK{i}", ["lat"] = p.Lat, ["lon"] = p.Lon }).ToArray());
        var request = new JsonObject
        {
            ["marks"] = new JsonObject { ["crs"] = "EPSG:31467", ["heights"] = "none", ["points"] = marks },
            ["fixes"] = new JsonObject { ["crs"] = "EPSG:4326", ["heights"] = "none", ["points"] = fixes },
        };
        var report = await CreatedAsync(request);
        foreach (var r in report.GetProperty("residuals").EnumerateArray())
            Assert.True(Math.Abs(r.GetProperty("dE").GetDouble()) < 0.002 && Math.Abs(r.GetProperty("dN").GetDouble()) < 0.002, r.ToString());
        Assert.Contains("EPSG:15949", report.GetProperty("frames").GetProperty("operation").GetString()!, StringComparison.Ordinal);
        Assert.Equal("pass", Check(report, "area-of-use").GetProperty("status").GetString());

        // The same request pinned to the 3 m Helmert EPSG:1777 (DHDN to WGS 84 (2)) moves the marks by decimetres to a metre.
        request["fixes"]!["operationCode"] = "EPSG:1777";
        var helmert = await CreatedAsync(request);
        Assert.Contains("EPSG:1777", helmert.GetProperty("frames").GetProperty("operation").GetString()!, StringComparison.Ordinal);
        Assert.True(helmert.GetProperty("residuals").EnumerateArray().Max(r => Math.Abs(r.GetProperty("dE").GetDouble()) + Math.Abs(r.GetProperty("dN").GetDouble())) > 0.05);

        request["fixes"]!["operationCode"] = "EPSG:1133";
        await ProblemAssert.IsBadInputAsync(await client.PostJsonAsync(request), "/fixes/operationCode", "does not join");
    }

    [Fact]
    public async Task A_marks_own_velocity_given_as_vE_vN_vU_carries_it_to_the_fixes_epoch()
    {
        // Invented velocities (m/yr) on a mark at 2010; the fix sits on the mark's 2010 position and is observed at 2026.5. A
        // linear station velocity moves the mark by v·Δt (common practice, as ITRF station velocities are applied), so the
        // residual fix − mark is −v·16.5 years in east, north and up (to well under a millimetre over 0.4 m of motion).
        const double ve = 0.02, vn = 0.015, vu = 0.001, years = 16.5;
        var request = new JsonObject
        {
            ["marks"] = new JsonObject
            {
                ["crs"] = "EPSG:7912", ["epoch"] = 2010.0,
                ["points"] = new JsonArray(new JsonObject { ["id"] = "M0", ["lat"] = 48.1, ["lon"] = 11.6, ["h"] = 520.0, ["vE"] = ve, ["vN"] = vn, ["vU"] = vu }),
            },
            ["fixes"] = new JsonObject
            {
                ["crs"] = "EPSG:7912", ["epoch"] = 2026.5,
                ["points"] = new JsonArray(new JsonObject { ["id"] = "F0", ["mark"] = "M0", ["lat"] = 48.1, ["lon"] = 11.6, ["h"] = 520.0 }),
            },
        };
        var residual = (await CreatedAsync(request)).GetProperty("residuals")[0];
        Assert.Equal(-ve * years, residual.GetProperty("dE").GetDouble(), 0.001);
        Assert.Equal(-vn * years, residual.GetProperty("dN").GetDouble(), 0.001);
        Assert.Equal(-vu * years, residual.GetProperty("dU").GetDouble(), 0.001);
    }

    [Fact]
    public async Task Marks_at_2010_are_carried_to_the_fixes_epoch_by_the_named_plate()
    {
        // tests/reference-data/plate-motion-proj.tsv (cct, ITRF2014-PMM EURA rates, +t_epoch=2010 with time 2026.5).
        (double Lat, double Lon, double H, double Lat1, double Lon1, double H1)[] rows =
        [
            (48.1, 11.6, 520.0, 48.100002304058, 11.600004493414, 520.000855704769),
            (-33.9, 151.2, 40.0, -33.900002326313, 151.200002974447, 40.000801350921),
            (39.7, -105.0, 1600.0, 39.699999746092, -104.999998492613, 1599.999907014892),
            (-1.3, 36.8, 1700.0, -1.299998273044, 36.800003489273, 1699.999971020035),
        ];
        var request = new JsonObject
        {
            ["marks"] = new JsonObject
            {
                ["crs"] = "EPSG:7912", ["epoch"] = 2010.0, ["plate"] = "EURA", ["plateModel"] = "itrf2014-pmm",
                ["points"] = new JsonArray(rows.Select((r, i) => (JsonNode)new JsonObject { ["id"] = $"M{i}", ["lat"] = r.Lat, ["lon"] = r.Lon, ["h"] = r.H }).ToArray()),
            },
            ["fixes"] = new JsonObject
            {
                ["crs"] = "EPSG:7912", ["epoch"] = 2026.5,
                ["points"] = new JsonArray(rows.Select((r, i) => (JsonNode)new JsonObject { ["id"] = $"F{i}", ["mark"] = $"M{i}", ["lat"] = r.Lat1, ["lon"] = r.Lon1, ["h"] = r.H1 }).ToArray()),
            },
        };
        var carried = await CreatedAsync(request);
        foreach (var r in carried.GetProperty("residuals").EnumerateArray())
            Assert.True(Math.Abs(r.GetProperty("dE").GetDouble()) < 0.001 && Math.Abs(r.GetProperty("dN").GetDouble()) < 0.001 && Math.Abs(r.GetProperty("dU").GetDouble()) < 0.001, r.ToString());
        var operation = carried.GetProperty("frames").GetProperty("operation").GetString()!;
        Assert.Contains("EURA", operation, StringComparison.Ordinal);
        Assert.Contains("doi:10.1093/gji/ggx136", operation, StringComparison.Ordinal);
        Assert.Contains("2026.5", operation, StringComparison.Ordinal);

        // Control: without the plate the marks stay at 2010 and 16.5 years of plate motion (decimetres) show as residuals.
        request["marks"]!.AsObject().Remove("plate");
        request["marks"]!.AsObject().Remove("plateModel");
        var uncorrected = await CreatedAsync(request);
        Assert.True(uncorrected.GetProperty("horizontal").GetProperty("rmseR").GetDouble() > 0.1);

        request["marks"]!["plate"] = "ATLANTIS";
        await ProblemAssert.IsBadInputAsync(await client.PostJsonAsync(request), "/marks/plate", "EURA");
    }

    private async Task<JsonElement> CreatedAsync(JsonNode request)
    {
        var response = await client.PostJsonAsync(request);
        var text = await response.Content.ReadAsStringAsync();
        Assert.True(response.StatusCode == HttpStatusCode.Created, text);
        return JsonDocument.Parse(text).RootElement;
    }

    private static JsonElement Check(JsonElement report, string id) =>
        report.GetProperty("checks").EnumerateArray().Single(c => c.GetProperty("id").GetString() == id);
}
