using System.Net;
using System.Net.Http.Headers;
using System.Text;
using System.Text.Json.Nodes;
using QaService.Api.Tests.Support;

namespace QaService.Api.Tests;

/// <summary>Every bad request is a 4xx problem (api-v1 "Errors") with a pointer to the offending item.</summary>
public sealed class AssessmentErrorTests : IClassFixture<ServiceHost>
{
    private readonly HttpClient client;

    public AssessmentErrorTests(ServiceHost host) => client = host.Factory.CreateClient();

    private static JsonObject With(Action<JsonObject> change)
    {
        var body = Requests.Minimal();
        change(body);
        return body;
    }

    private static JsonObject Fix0(JsonObject body) => body["fixes"]!["points"]![0]!.AsObject();

    private static JsonObject Mark0(JsonObject body) => body["marks"]!["points"]![0]!.AsObject();

    [Fact]
    public async Task Minimal_request_is_accepted()
    {
        var response = await client.PostJsonAsync(Requests.Minimal());
        Assert.Equal(HttpStatusCode.Created, response.StatusCode);
    }

    [Fact]
    public async Task Latitude_out_of_range_points_at_the_field() =>
        await ProblemAssert.IsBadInputAsync(await client.PostJsonAsync(With(b => Fix0(b)["lat"] = 95)), "/fixes/points/0/lat", "outside -90..90");

    [Fact]
    public async Task Longitude_out_of_range_points_at_the_field() =>
        await ProblemAssert.IsBadInputAsync(await client.PostJsonAsync(With(b => Fix0(b)["lon"] = -181)), "/fixes/points/0/lon", "outside -180..180");

    [Fact]
    public async Task Coordinate_fields_that_do_not_fit_the_crs_kind_are_rejected()
    {
        var body = With(b => { Mark0(b).Remove("e"); Mark0(b).Remove("n"); Mark0(b)["lat"] = 48.7; Mark0(b)["lon"] = 15.0; });
        var problem = await ProblemAssert.IsBadInputAsync(await client.PostJsonAsync(body), "/marks/points/0/lat", "does not fit");
        Assert.Contains(problem.GetProperty("errors").EnumerateArray(), e => e.GetProperty("pointer").GetString() == "/marks/points/0/e");
    }

    [Fact]
    public async Task Geocentric_point_with_h_is_rejected()
    {
        var body = With(b =>
        {
            b["fixes"]!["crs"] = "EPSG:4978";
            b["fixes"]!["points"] = JsonNode.Parse("""[{ "id": "F1", "mark": "A", "x": 4069937.4, "y": 1090536.4, "z": 4772423.7, "h": 3 }]""");
        });
        await ProblemAssert.IsBadInputAsync(await client.PostJsonAsync(body), "/fixes/points/0/h", "geocentric");
    }

    [Fact]
    public async Task Geocentric_point_far_from_the_earth_is_rejected()
    {
        var body = With(b =>
        {
            b["fixes"]!["crs"] = "EPSG:4978";
            b["fixes"]!["points"] = JsonNode.Parse("""[{ "id": "F1", "mark": "A", "x": 4069.9374, "y": 1090.5364, "z": 4772.4237 }]""");
        });
        await ProblemAssert.IsBadInputAsync(await client.PostJsonAsync(body), "/fixes/points/0", "from the ellipsoid");
    }

    [Fact]
    public async Task Missing_coordinate_is_named() =>
        await ProblemAssert.IsBadInputAsync(await client.PostJsonAsync(With(b => Fix0(b).Remove("lon"))), "/fixes/points/0/lon", "required");

    [Fact]
    public async Task Easting_far_outside_the_zone_is_rejected() =>
        await ProblemAssert.IsBadInputAsync(await client.PostJsonAsync(With(b => Mark0(b)["e"] = 5400000.0)), "/marks/points/0/e", "zone");

    [Fact]
    public async Task Metre_values_in_a_foot_state_plane_zone_are_caught() =>
        // UTM-like metre values read as EPSG:2227 US survey feet land ~1 800 km west of California (area of use: projinfo EPSG:2227).
        await ProblemAssert.IsBadInputAsync(await client.PostJsonAsync(With(b => b["marks"]!["crs"] = "EPSG:2227")), "/marks/points/0/e", "area of use");

    [Fact]
    public async Task Height_in_millimetres_is_caught() =>
        await ProblemAssert.IsBadInputAsync(await client.PostJsonAsync(With(b => Mark0(b)["h"] = 200000.0)), "/marks/points/0/h", "outside");

    [Theory]
    [InlineData("EPSG:27572", "not supported yet")]
    [InlineData("EPSG:99999", "not supported yet")]
    [InlineData("PROJCS[\"NZGD2000 / New Zealand Transverse Mercator 2000\",GEOGCS[\"NZGD2000\"]]", "has no DATUM")]
    [InlineData("PROJCS[\"x\",GEOGCS[\"g\",DATUM[\"d\",SPHEROID[\"s\",6378137,298.257222101]],PRIMEM[\"Greenwich\",0],UNIT[\"degree\",0.0174532925199433]],PROJECTION[\"Cassini_Soldner\"],UNIT[\"metre\",1]]", "not supported yet")]
    [InlineData("utm33", "not a CRS identifier")]
    [InlineData("", "required")]
    public async Task Unsupported_crs_is_a_clear_400(string crs, string fragment) =>
        await ProblemAssert.IsBadInputAsync(await client.PostJsonAsync(With(b => b["marks"]!["crs"] = crs)), "/marks/crs", fragment);

    [Fact]
    public async Task Missing_marks_is_named() =>
        await ProblemAssert.IsBadInputAsync(await client.PostJsonAsync(With(b => b.Remove("marks"))), "/marks", "required");

    [Fact]
    public async Task Empty_points_is_named() =>
        await ProblemAssert.IsBadInputAsync(await client.PostJsonAsync(With(b => b["fixes"]!["points"] = new JsonArray())), "/fixes/points", "at least one");

    [Fact]
    public async Task Null_point_is_named() =>
        await ProblemAssert.IsBadInputAsync(await client.PostJsonAsync(With(b => b["fixes"]!["points"]!.AsArray().Add(null))), "/fixes/points/1", "null");

    [Fact]
    public async Task Fix_naming_an_unknown_mark_is_rejected() =>
        await ProblemAssert.IsBadInputAsync(await client.PostJsonAsync(With(b => Fix0(b)["mark"] = "ZZ")), "/fixes/points/0/mark", "no mark has the id");

    [Fact]
    public async Task Duplicate_mark_ids_are_rejected() =>
        await ProblemAssert.IsBadInputAsync(await client.PostJsonAsync(With(b => b["marks"]!["points"]![1]!["id"] = "A")), "/marks/points/1/id", "more than once");

    [Fact]
    public async Task Mark_without_id_is_rejected() =>
        await ProblemAssert.IsBadInputAsync(await client.PostJsonAsync(With(b => Mark0(b).Remove("id"))), "/marks/points/0/id", "needs an id");

    [Fact]
    public async Task Unknown_heights_value_is_rejected() =>
        await ProblemAssert.IsBadInputAsync(await client.PostJsonAsync(With(b => b["fixes"]!["heights"] = "geoidal")), "/fixes/heights", "not one of");

    [Fact]
    public async Task Orthometric_without_geoid_is_rejected() =>
        await ProblemAssert.IsBadInputAsync(await client.PostJsonAsync(With(b => b["marks"]!["heights"] = "orthometric")), "/marks/geoid", "geoid");

    [Fact]
    public async Task Mixed_height_references_need_a_geoid_the_service_knows()
    {
        // egm96 is built in (FrameAssessmentTests covers the conversion); any other name is a bad request.
        var body = With(b => { b["marks"]!["heights"] = "orthometric"; b["marks"]!["geoid"] = "osgm15"; });
        await ProblemAssert.IsBadInputAsync(await client.PostJsonAsync(body), "/marks/geoid", "not known");
    }

    [Fact]
    public async Task Negative_sigma_is_rejected() =>
        await ProblemAssert.IsBadInputAsync(await client.PostJsonAsync(With(b => Mark0(b)["sigmaH"] = -0.01)), "/marks/points/0/sigmaH", "standard deviation");

    [Fact]
    public async Task Epoch_out_of_range_is_rejected() =>
        await ProblemAssert.IsBadInputAsync(await client.PostJsonAsync(With(b => b["fixes"]!["epoch"] = 26.4)), "/fixes/epoch", "decimal year");

    [Fact]
    public async Task Unknown_standard_is_rejected() =>
        await ProblemAssert.IsBadInputAsync(await client.PostJsonAsync(With(b => b["spec"]!["standard"] = "iso-9000")), "/spec/standard", "not supported; use one of");

    [Fact]
    public async Task Confidence_out_of_range_is_rejected() =>
        await ProblemAssert.IsBadInputAsync(await client.PostJsonAsync(With(b => b["spec"]!["confidence"] = 95)), "/spec/confidence", "between 0.5 and 0.999");

    [Fact]
    public async Task Nmas_without_map_scale_or_contour_interval_is_rejected() =>
        await ProblemAssert.IsBadInputAsync(await client.PostJsonAsync(With(b => b["spec"]!["standard"] = "nmas-1947")), "/spec/mapScale", "mapScale");

    [Fact]
    public async Task Non_positive_map_scale_is_rejected() =>
        await ProblemAssert.IsBadInputAsync(await client.PostJsonAsync(With(b => { b["spec"]!["standard"] = "nmas"; b["spec"]!["mapScale"] = 0; })), "/spec/mapScale", "denominator");

    [Fact]
    public async Task Non_positive_requirement_is_rejected() =>
        await ProblemAssert.IsBadInputAsync(await client.PostJsonAsync(With(b => b["spec"]!["horizontal"] = 0)), "/spec/horizontal", "positive");

    [Fact]
    public async Task Pairing_radius_out_of_range_is_rejected() =>
        await ProblemAssert.IsBadInputAsync(await client.PostJsonAsync(With(b => b["pairing"] = new JsonObject { ["radius"] = -1 })), "/pairing/radius", "radius");

    [Fact]
    public async Task Exclusion_of_an_unknown_fix_is_rejected() =>
        await ProblemAssert.IsBadInputAsync(await client.PostJsonAsync(With(b => b["exclusions"] = JsonNode.Parse("""[{"fix":"nope","reason":"x"}]"""))), "/exclusions/0/fix", "no fix has the id");

    [Fact]
    public async Task Exclusion_without_reason_is_rejected() =>
        await ProblemAssert.IsBadInputAsync(await client.PostJsonAsync(With(b => b["exclusions"] = JsonNode.Parse("""[{"fix":"F1"}]"""))), "/exclusions/0/reason", "why");

    [Fact]
    public async Task Unknown_field_is_named_not_ignored() =>
        await ProblemAssert.IsBadInputAsync(await client.PostJsonAsync(With(b => Fix0(b)["lng"] = 15.0)), "/fixes/points/0/lng", "not a field");

    [Fact]
    public async Task Number_given_as_string_points_at_the_field() =>
        await ProblemAssert.IsBadInputAsync(await client.PostJsonAsync(With(b => Fix0(b)["lat"] = "48.7")), "/fixes/points/0/lat", "wrong type");

    [Fact]
    public async Task Bad_time_points_at_the_field() =>
        await ProblemAssert.IsBadInputAsync(await client.PostJsonAsync(With(b => Fix0(b)["time"] = "yesterday")), "/fixes/points/0/time", "wrong type");

    [Theory]
    [InlineData("{\"marks\": ")]
    [InlineData("not json")]
    [InlineData("")]
    [InlineData("[]")]
    [InlineData("{\"title\": \"a\", \"title\": \"b\"}")]
    public async Task Malformed_json_is_a_400_problem(string body) =>
        await ProblemAssert.IsProblemAsync(await client.PostRawAsync(body), HttpStatusCode.BadRequest);

    [Fact]
    public async Task Null_body_is_a_400_problem() =>
        await ProblemAssert.IsBadInputAsync(await client.PostRawAsync("null"), "", "not null");

    [Fact]
    public async Task Wrong_media_type_is_415() =>
        await ProblemAssert.IsProblemAsync(await client.PostRawAsync(Requests.Minimal().ToJsonString(), "text/plain"), HttpStatusCode.UnsupportedMediaType);

    [Fact]
    public async Task Multipart_without_files_names_the_missing_parts()
    {
        var form = new MultipartFormDataContent { { new StringContent("{}"), "options" } };
        var response = await client.PostAsync("/v1/assessments", form);
        await ProblemAssert.IsBadInputAsync(response, "/marks", "required");
        await ProblemAssert.IsBadInputAsync(await client.PostAsync("/v1/assessments", new MultipartFormDataContent { { new StringContent("{}"), "options" } }), "/fixes", "required");
    }

    [Fact]
    public async Task Unknown_id_is_404_problem()
    {
        var problem = await ProblemAssert.IsProblemAsync(await client.GetAsync("/v1/assessments/AAAAAAAAAAAAAAAAAAAAAA"), HttpStatusCode.NotFound);
        Assert.Contains("no assessment", problem.GetProperty("detail").GetString());
    }

    [Fact]
    public async Task Odd_id_is_404_problem() =>
        await ProblemAssert.IsProblemAsync(await client.GetAsync("/v1/assessments/%27%20OR%201%3D1--"), HttpStatusCode.NotFound);

    [Fact]
    public async Task Unknown_path_is_404_problem() =>
        await ProblemAssert.IsProblemAsync(await client.GetAsync("/v1/nothing-here"), HttpStatusCode.NotFound);

    [Fact]
    public async Task Wrong_method_is_405_problem() =>
        await ProblemAssert.IsProblemAsync(await client.DeleteAsync("/v1/assessments/abc"), HttpStatusCode.MethodNotAllowed);

    [Theory]
    [InlineData(500000.0, 1e15, "/marks/points/0/n")]
    [InlineData(500000.0, -1e15, "/marks/points/0/n")]
    [InlineData(2600000.0, 5400000.0, "/marks/points/0/e")]
    [InlineData(500000.0, 10001000.0, "/marks/points/0/n")]
    public async Task Projected_values_beyond_the_pole_or_zone_are_400(double easting, double northing, string pointer)
    {
        var body = With(b => { Mark0(b)["e"] = easting; Mark0(b)["n"] = northing; });
        await ProblemAssert.IsProblemAsync(await client.PostJsonAsync(body), HttpStatusCode.BadRequest);
        await ProblemAssert.IsBadInputAsync(await client.PostJsonAsync(body), pointer, "");
    }

    [Theory]
    [InlineData(0.0, 0.0, 0.0)]
    [InlineData(1e300, 1e300, 1e300)]
    [InlineData(0.0, 0.0, 6356752.314245)]
    public async Task Geocentric_extremes_are_400(double x, double y, double z)
    {
        var body = With(b =>
        {
            b["fixes"]!["crs"] = "EPSG:4978";
            b["fixes"]!["points"] = new JsonArray(new JsonObject { ["mark"] = "A", ["x"] = x, ["y"] = y, ["z"] = z });
        });
        var response = await client.PostJsonAsync(body);
        Assert.True((int)response.StatusCode is 201 or 400, $"{(int)response.StatusCode}: {await response.Content.ReadAsStringAsync()}");
    }

    [Fact]
    public async Task Pole_and_antimeridian_are_valid_positions()
    {
        var body = With(b =>
        {
            b["marks"] = JsonNode.Parse("""{ "crs": "EPSG:4979", "points": [ { "id": "A", "lat": 90, "lon": 180, "h": 0 }, { "id": "B", "lat": -90, "lon": -180, "h": 0 } ] }""");
            b["fixes"] = JsonNode.Parse("""{ "crs": "EPSG:4979", "points": [ { "mark": "A", "lat": 89.9999999, "lon": -180, "h": 0.1 }, { "mark": "B", "lat": -90, "lon": 0, "h": 0 } ] }""");
        });
        var response = await client.PostJsonAsync(body);
        Assert.Equal(HttpStatusCode.Created, response.StatusCode);
    }
}
