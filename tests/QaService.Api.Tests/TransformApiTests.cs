using System.Net;
using System.Text;
using System.Text.Json;
using System.Text.Json.Nodes;
using QaService.Api.Tests.Support;

namespace QaService.Api.Tests;

/// <summary>POST /v1/transform (api-v1): results against PROJ 9.1.1, and a problem with a pointer for every error path.</summary>
public sealed class TransformApiTests(ServiceHost host) : IClassFixture<ServiceHost>
{
    private readonly HttpClient client = host.Factory.CreateClient();

    private Task<HttpResponseMessage> PostAsync(string json) =>
        client.PostAsync("/v1/transform", new StringContent(json, Encoding.UTF8, "application/json"));

    private async Task<JsonElement> OkAsync(string json)
    {
        var response = await PostAsync(json);
        var text = await response.Content.ReadAsStringAsync();
        Assert.True(response.StatusCode == HttpStatusCode.OK, text);
        return JsonDocument.Parse(text).RootElement;
    }

    [Fact]
    public async Task Wgs84_to_utm_matches_cs2cs_and_says_projection_only()
    {
        // PROJ 9.1.1: echo "48.75 15.0 200" | cs2cs -f %.6f EPSG:4979 EPSG:32633 → 500000.000000 5399665.073117 200.000000
        var body = await OkAsync("""{ "from": "EPSG:4326", "to": "EPSG:32633", "points": [ { "lat": 48.75, "lon": 15.0, "h": 200.0 }, { "lat": 48.75, "lon": 15.0 } ] }""");
        var p = body.GetProperty("points")[0];
        Assert.Equal(500000.000000, p.GetProperty("e").GetDouble(), 1e-6 * 1000); // 1 mm
        Assert.Equal(5399665.073117, p.GetProperty("n").GetDouble(), 1e-3);
        Assert.Equal(200.0, p.GetProperty("h").GetDouble(), 1e-9);
        Assert.False(body.GetProperty("points")[1].TryGetProperty("h", out _)); // 2D in, 2D out
        Assert.Contains("projection only, same datum", body.GetProperty("operation").GetString(), StringComparison.Ordinal);
        Assert.Equal("EPSG:4326", body.GetProperty("from").GetString());
    }

    [Fact]
    public async Task Itrf2014_to_nad83_2011_at_epoch_matches_cct_within_a_millimetre()
    {
        // PROJ 9.1.1: echo "45.5 -122.6 100 2026.4" | cct -d 10 $(projinfo -s EPSG:7912 -t EPSG:6319 -o PROJ -q --single-line)
        //   → 45.4999980302 -122.5999797766 100.3440998401
        var body = await OkAsync("""{ "from": "EPSG:7912", "to": "EPSG:6319", "epoch": 2026.4, "points": [ { "lat": 45.5, "lon": -122.6, "h": 100.0 } ] }""");
        var p = body.GetProperty("points")[0];
        Assert.Equal(45.4999980302, p.GetProperty("lat").GetDouble(), 1e-8); // 1e-8° ≈ 1.1 mm
        Assert.Equal(-122.5999797766, p.GetProperty("lon").GetDouble(), 1e-8);
        Assert.Equal(100.3440998401, p.GetProperty("h").GetDouble(), 1e-3);
        var operation = body.GetProperty("operation").GetString()!;
        Assert.Contains("EPSG:8970", operation, StringComparison.Ordinal);
        Assert.Contains("2026.4", operation, StringComparison.Ordinal);
        Assert.Contains("reference epoch 2010", operation, StringComparison.Ordinal);
    }

    [Fact]
    public async Task Points_come_back_in_request_order()
    {
        var body = await OkAsync("""{ "from": "EPSG:4979", "to": "EPSG:4978", "points": [ { "lat": 0, "lon": 0, "h": 0 }, { "lat": 90, "lon": 0, "h": 0 }, { "lat": 0, "lon": 90, "h": 0 } ] }""");
        var points = body.GetProperty("points");
        // WGS 84 (NIMA TR8350.2 Table 3.1): a = 6 378 137 m, b = 6 356 752.3142 m.
        Assert.Equal(6378137.0, points[0].GetProperty("x").GetDouble(), 1e-6);
        Assert.Equal(6356752.3142, points[1].GetProperty("z").GetDouble(), 1e-4);
        Assert.Equal(6378137.0, points[2].GetProperty("y").GetDouble(), 1e-6);
    }

    /// <summary>
    /// A batch large enough to be carried and rendered in blocks side by side must come back exactly as the same points
    /// sent in batches small enough for one pass: the same text for every point, in order, heights only where given.
    /// </summary>
    [Fact]
    public async Task A_large_batch_gives_the_same_points_as_small_batches()
    {
        const int count = 70_001, smallBatch = 30_000;
        var random = new Random(3);
        var points = Enumerable.Range(0, count).Select(i => i % 5 == 0
            ? $"{{\"lat\":{40 + 15 * random.NextDouble():R},\"lon\":{12 + 6 * random.NextDouble():R}}}"
            : $"{{\"lat\":{40 + 15 * random.NextDouble():R},\"lon\":{12 + 6 * random.NextDouble():R},\"h\":{1000 * random.NextDouble():R}}}").ToArray();
        string Body(IEnumerable<string> batch) => $$"""{ "from": "EPSG:4326", "to": "EPSG:32633", "points": [{{string.Join(",", batch)}}] }""";

        var large = (await OkAsync(Body(points))).GetProperty("points").EnumerateArray().Select(p => p.GetRawText()).ToList();
        var small = new List<string>();
        for (var start = 0; start < count; start += smallBatch)
            small.AddRange((await OkAsync(Body(points.Skip(start).Take(smallBatch)))).GetProperty("points").EnumerateArray().Select(p => p.GetRawText()));

        Assert.Equal(count, large.Count);
        Assert.Equal(small, large);
    }

    [Fact]
    public async Task Orthometric_output_uses_egm96()
    {
        // PROJ 9.1.1 vgridshift on egm96_15.gtx at 47.1 N 11.4 E gives N; h = 0 → H = −N. Cross-checked against the
        // shipped grid in Core tests (GridProjReferenceTests); here only the sign and field flow are checked: H = h − N.
        var ellipsoidal = await OkAsync("""{ "from": "EPSG:4979", "to": "EPSG:4979", "points": [ { "lat": 47.1, "lon": 11.4, "h": 1000 } ] }""");
        var orthometric = await OkAsync("""{ "from": "EPSG:4979", "to": "EPSG:4979", "toGeoid": "egm96", "points": [ { "lat": 47.1, "lon": 11.4, "h": 1000 } ] }""");
        var h = ellipsoidal.GetProperty("points")[0].GetProperty("h").GetDouble();
        var bigH = orthometric.GetProperty("points")[0].GetProperty("h").GetDouble();
        Assert.InRange(h - bigH, 45.0, 50.0); // EGM96 N in the Tyrol is about +47 m (NGA EGM96 map)
    }

    [Theory]
    [InlineData("""{ "to": "EPSG:32633", "points": [ { "lat": 1, "lon": 2 } ] }""", "/from", "required")]
    [InlineData("""{ "from": "EPSG:4326", "to": "EPSG:999999", "points": [ { "lat": 1, "lon": 2 } ] }""", "/to", "not supported")]
    [InlineData("""{ "from": "EPSG:4326", "to": "EPSG:32633", "points": [] }""", "/points", "at least one")]
    [InlineData("""{ "from": "EPSG:4326", "to": "EPSG:32633" }""", "/points", "at least one")]
    [InlineData("""{ "from": "EPSG:4326", "to": "EPSG:32633", "epoch": 3000, "points": [ { "lat": 1, "lon": 2 } ] }""", "/epoch", "decimal year")]
    [InlineData("""{ "from": "EPSG:4326", "to": "EPSG:32633", "fromGeoid": "geoid99", "points": [ { "lat": 1, "lon": 2 } ] }""", "/fromGeoid", "not known")]
    [InlineData("""{ "from": "EPSG:4978", "to": "EPSG:4326", "fromGeoid": "egm96", "points": [ { "x": 6378137, "y": 0, "z": 0 } ] }""", "/fromGeoid", "geocentric")]
    [InlineData("""{ "from": "EPSG:4326", "to": "EPSG:32633", "points": [ { "lat": 1, "lon": 2 }, { "lat": 95, "lon": 2 } ] }""", "/points/1/lat", "outside -90..90")]
    [InlineData("""{ "from": "EPSG:4326", "to": "EPSG:32633", "points": [ { "lat": 1, "lon": 200 } ] }""", "/points/0/lon", "outside -180..180")]
    [InlineData("""{ "from": "EPSG:4326", "to": "EPSG:32633", "points": [ { "lat": 1 } ] }""", "/points/0/lon", "required")]
    [InlineData("""{ "from": "EPSG:4326", "to": "EPSG:32633", "points": [ { "e": 500000, "n": 1 } ] }""", "/points/0/e", "does not fit")]
    [InlineData("""{ "from": "EPSG:32633", "to": "EPSG:4326", "points": [ { "lat": 1, "lon": 2 } ] }""", "/points/0/lat", "does not fit")]
    [InlineData("""{ "from": "EPSG:32633", "to": "EPSG:4326", "points": [ { "e": 500000 } ] }""", "/points/0/n", "required")]
    [InlineData("""{ "from": "EPSG:4978", "to": "EPSG:4326", "points": [ { "x": 1, "y": 2, "z": 3, "h": 4 } ] }""", "/points/0/h", "geocentric")]
    [InlineData("""{ "from": "EPSG:4978", "to": "EPSG:4326", "points": [ { "x": 1, "y": 2 } ] }""", "/points/0/z", "required")]
    [InlineData("""{ "from": "EPSG:4326", "to": "EPSG:32633", "points": [ { "lat": 1, "lon": 2, "h": 1e9 } ] }""", "/points/0/h", "outside")]
    [InlineData("""{ "from": "EPSG:4326", "to": "EPSG:32633", "points": [ null ] }""", "/points/0", "not null")]
    [InlineData("""{ "from": "EPSG:4326", "to": "EPSG:32633", "points": [ { "lat": "north", "lon": 2 } ] }""", "/points/0/lat", "wrong type")]
    [InlineData("""{ "from": "EPSG:4326", "to": "EPSG:32633", "points": [ { "lat": 1, "lon": 2, "q": 3 } ] }""", "/points/0/q", "not a field")]
    [InlineData("""{ "from": "EPSG:4326", "to": "EPSG:32633", "points": [ { "lat": 1, "lon": 2 }, { "lat": 1, "lon": 2, "lat": 3 } ] }""", "/points/1/lat", "appears twice")]
    [InlineData("""{ "from": "EPSG:4326", "to": "EPSG:32633", "points": [ { "Lat": 1, "lon": 2 } ] }""", "/points/0/Lat", "not a field")]
    [InlineData("""{ "from": "EPSG:4326", "to": "EPSG:32633", "points": [ { "lat": 1e999, "lon": 2 } ] }""", "/points/0/lat", "outside -90..90")]
    [InlineData("""{ "from": "EPSG:4326", "to": "EPSG:32633", "points": [ { "lat": [1], "lon": 2 } ] }""", "/points/0/lat", "wrong type")]
    [InlineData("""{ "from": "EPSG:4326", "to": "EPSG:32633", "points": [ 7 ] }""", "/points/0", "wrong type")]
    [InlineData("""{ "from": "EPSG:4326", "to": "EPSG:32633", "points": [ { "lat": 1, "lon": 2 } """, "/points/1", "not valid JSON")]
    public async Task Bad_input_gets_a_problem_with_a_pointer(string json, string pointer, string fragment)
    {
        await ProblemAssert.IsBadInputAsync(await PostAsync(json), pointer, fragment);
    }

    /// <summary>A large body (read in pieces side by side when it is sound) still gets the exact pointer for a bad point deep inside.</summary>
    [Theory]
    [InlineData("""{ "lat": 1, "lon": 2, "q": 3 }""", "/points/45678/q", "not a field")]
    [InlineData("""{ "lat": "north", "lon": 2 }""", "/points/45678/lat", "wrong type")]
    [InlineData("""{ "lat": 1, "lon": 2, "lat": 3 }""", "/points/45678/lat", "appears twice")]
    [InlineData("""{ "lat": 95, "lon": 2 }""", "/points/45678/lat", "outside -90..90")]
    public async Task A_bad_point_deep_in_a_large_body_gets_its_pointer(string badPoint, string pointer, string fragment)
    {
        var points = string.Join(",", Enumerable.Range(0, 70_000).Select(i => i == 45_678 ? badPoint : """{"lat":48.5,"lon":15.25,"h":300}"""));
        await ProblemAssert.IsBadInputAsync(await PostAsync($$"""{ "from": "EPSG:4326", "to": "EPSG:32633", "points": [{{points}}] }"""), pointer, fragment);
    }

    [Fact]
    public async Task Every_bad_point_is_listed()
    {
        var points = string.Join(",", Enumerable.Range(0, 5).Select(i => i % 2 == 0 ? """{ "lat": 91, "lon": 0 }""" : """{ "lat": 1, "lon": 0 }"""));
        var problem = await ProblemAssert.IsProblemAsync(await PostAsync($$"""{ "from": "EPSG:4326", "to": "EPSG:32633", "points": [ {{points}} ] }"""), HttpStatusCode.BadRequest);
        var pointers = problem.GetProperty("errors").EnumerateArray().Select(e => e.GetProperty("pointer").GetString()).ToList();
        Assert.Equal(["/points/0/lat", "/points/2/lat", "/points/4/lat"], pointers);
    }

    [Fact]
    public async Task Point_outside_the_projection_domain_is_a_bad_point_not_a_500()
    {
        var response = await PostAsync("""{ "from": "EPSG:32633", "to": "EPSG:4326", "points": [ { "e": 500000, "n": 5400000 }, { "e": 9e15, "n": 5400000 } ] }""");
        await ProblemAssert.IsBadInputAsync(response, "/points/1", "cannot be carried");
    }

    [Fact]
    public async Task Wrong_media_type_is_415()
    {
        var response = await client.PostAsync("/v1/transform", new StringContent("from=EPSG:4326", Encoding.UTF8, "text/plain"));
        await ProblemAssert.IsProblemAsync(response, HttpStatusCode.UnsupportedMediaType);
    }

    [Fact]
    public async Task Too_large_body_is_413()
    {
        using var factory = new QaServiceFactory(extra: new Dictionary<string, string?> { ["Limits:MaxBodyBytes"] = "1024" });
        var small = factory.CreateClient();
        var json = JsonSerializer.Serialize(new { from = "EPSG:4326", to = "EPSG:32633", points = Enumerable.Range(0, 200).Select(i => new { lat = 1.0 * i, lon = 2.0 }) });
        var response = await small.PostAsync("/v1/transform", new StringContent(json, Encoding.UTF8, "application/json"));
        await ProblemAssert.IsProblemAsync(response, HttpStatusCode.RequestEntityTooLarge);
    }
}
