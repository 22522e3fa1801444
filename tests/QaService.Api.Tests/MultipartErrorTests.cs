using System.Net;
using System.Text;
using System.Text.Json;
using QaService.Api.Tests.Support;

namespace QaService.Api.Tests;

/// <summary>
/// Broken and hostile field files: each is a 400 problem with a pointer to the part and row (never a 5xx),
/// and lenient mode assesses the rest. Invented scenario: Tollbridge Parish hydrant survey (marks in
/// WGS 84 lat/lon/h; fixes 0.1–0.3 m away).
/// </summary>
public sealed class MultipartErrorTests(ServiceHost host) : IClassFixture<ServiceHost>
{
    private const string Marks = "id,lat,lon,h\nTP-01,52.1,-1.2,80\nTP-02,52.2,-1.3,82\n";
    private const string Options = """{ "marks": { "crs": "EPSG:4979" }, "fixes": { "crs": "EPSG:4979" } }""";
    private const string Fixes = "id,mark,lat,lon,h\nF1,TP-01,52.100001,-1.2,80.1\nF2,TP-02,52.2,-1.300002,82.2\nF3,TP-01,52.1000005,-1.2000010,80.05\n";

    private readonly HttpClient client = host.Factory.CreateClient();

    private Task<HttpResponseMessage> Post(string fixes, string? options = Options, string marks = Marks) =>
        client.PostFormAsync(Uploads.Form(options, marks, fixes));

    private Task<HttpResponseMessage> Post(byte[] fixes, string? options = Options) =>
        client.PostFormAsync(Uploads.Form(options, Encoding.UTF8.GetBytes(Marks), fixes));

    [Fact]
    public async Task A_valid_upload_is_created()
    {
        var response = await Post(Fixes);
        Assert.Equal(HttpStatusCode.Created, response.StatusCode);
    }

    [Fact]
    public async Task A_broken_csv_row_is_400_naming_its_line_and_column()
    {
        var problem = await ProblemAssert.IsBadInputAsync(await Post(Fixes.Replace("52.2,-1.300002", "52.2,-1.3x")), "/fixes/line/3/lon", "column 4 (\"lon\")");
        Assert.Contains("line/3", problem.GetProperty("detail").GetString());
    }

    [Fact]
    public async Task A_value_the_validator_refuses_points_at_the_file_line_and_column()
    {
        var options = """{ "marks": { "crs": "EPSG:4979" }, "fixes": { "crs": "EPSG:4979", "columns": { "lat": "Breite" } } }""";
        var fixes = "id,mark,Breite,lon,h\nF1,TP-01,95,-1.2,80.1\n";
        await ProblemAssert.IsBadInputAsync(await Post(fixes, options), "/fixes/line/2/lat", "column \"Breite\"");
    }

    [Fact]
    public async Task An_unknown_mark_id_points_at_the_fix_line() =>
        await ProblemAssert.IsBadInputAsync(await Post(Fixes.Replace("F2,TP-02", "F2,TP-99")), "/fixes/line/3/mark", "TP-99");

    [Fact]
    public async Task Options_errors_point_into_the_options_part()
    {
        await ProblemAssert.IsBadInputAsync(await Post(Fixes, """{ "marks": { "crs": "EPSG:4979" }, "fixes": { "crs": "EPSG:4979" }, "spec": { "horizontal": -1 } }"""), "/options/spec/horizontal", "positive");
        await ProblemAssert.IsBadInputAsync(await Post(Fixes, """{ "marks": { "crs": "EPSG:4979" }, "fixes": { "crs": "EPSG:4979", "colums": {} } }"""), "/options/fixes/colums", "not a field");
        await ProblemAssert.IsBadInputAsync(await Post(Fixes, """{ "marks": { "crs": "EPSG:4979" }, "fixes": { "crs": "EPSG:4979", "lengthUnit": "yard" } }"""), "/options/fixes/lengthUnit", "yard");
        await ProblemAssert.IsBadInputAsync(await Post(Fixes, "{ not json"), "/options", "not valid JSON");
    }

    [Fact]
    public async Task Lenient_mode_lists_bad_rows_and_assesses_the_rest()
    {
        var options = """{ "marks": { "crs": "EPSG:4979" }, "fixes": { "crs": "EPSG:4979" }, "rowErrors": "lenient" }""";
        var fixes = Fixes + "F4,TP-01,not-a-number,-1.2,80\nF5,TP-01,95,-1.2,80\n";
        var response = await Post(fixes, options);
        var text = await response.Content.ReadAsStringAsync();
        Assert.True(response.StatusCode == HttpStatusCode.Created, text);
        var report = JsonDocument.Parse(text).RootElement;
        var ingest = report.GetProperty("ingest");
        Assert.Equal("lenient", ingest.GetProperty("rowErrors").GetString());
        Assert.Equal(2, ingest.GetProperty("skippedRows").GetInt32());
        var pointers = ingest.GetProperty("skipped").EnumerateArray().Select(e => e.GetProperty("pointer").GetString()).ToList();
        Assert.Contains("/fixes/line/5/lat", pointers);
        Assert.Contains("/fixes/line/6/lat", pointers);
        Assert.Equal(3, report.GetProperty("counts").GetProperty("fixes").GetInt32());
    }

    [Fact]
    public async Task Length_unit_feet_is_scaled_to_the_crs_unit()
    {
        // 80.1 m = 262.7952756 international feet (0.3048 m exactly): the fix must come back 0.1 m above its mark.
        var options = """{ "marks": { "crs": "EPSG:4979" }, "fixes": { "crs": "EPSG:4979", "lengthUnit": "foot" } }""";
        var response = await Post("id,mark,lat,lon,h\nF1,TP-01,52.1,-1.2,262.79527559055\n", options);
        var report = JsonDocument.Parse(await response.Content.ReadAsStringAsync()).RootElement;
        Assert.Equal(0.1, report.GetProperty("residuals")[0].GetProperty("dU").GetDouble(), 1e-6);
    }

    public static TheoryData<string, byte[], string> Hostile_files => new()
    {
        { "empty", [], "/fixes" },
        { "header only, no delimiter", "lat\n"u8.ToArray(), "/fixes/line/1" },
        { "Latin-1 byte in a row", [.. "id,mark,lat,lon\nF1,TP-01,52.1,-1.2\nF\xE9,TP-01,52.1,-1.2\n".Select(c => (byte)c)], "/fixes/line/3" },
        { "UTF-16 without BOM (NUL bytes)", Encoding.Unicode.GetBytes("id,mark,lat,lon\nF1,TP-01,52.1,-1.2\n"), "/fixes/line/1" },
        { "huge line", Encoding.UTF8.GetBytes("id,mark,lat,lon\nF1,TP-01,52.1," + new string('1', 200_000) + "\n"), "/fixes/line/2" },
        { "unclosed quote", "id,mark,lat,lon\n\"F1,TP-01,52.1,-1.2\n"u8.ToArray(), "/fixes/line/2" },
        { "truncated GeoJSON", "{\"type\":\"FeatureCollection\",\"features\":[{\"type\":\"Feature\",\"geometry\":{\"type\":\"Point\",\"coordinates\":[-1.2,"u8.ToArray(), "/fixes/features/0" },
        { "GeoJSON nesting bomb", Encoding.UTF8.GetBytes("{\"type\":\"FeatureCollection\",\"features\":[" + new string('[', 5000) + new string(']', 5000) + "]}"), "/fixes/features/0" },
        { "GeoJSON array", "[1,2,3]"u8.ToArray(), "/fixes" },
        { "GPX with external entity", "<?xml version=\"1.0\"?><!DOCTYPE gpx [<!ENTITY x SYSTEM \"file:///etc/passwd\">]><gpx version=\"1.1\"><wpt lat=\"52.1\" lon=\"-1.2\"><name>&x;</name></wpt></gpx>"u8.ToArray(), "/fixes/line/1" },
        { "GPX billion laughs", "<?xml version=\"1.0\"?><!DOCTYPE gpx [<!ENTITY a \"aaaa\"><!ENTITY b \"&a;&a;&a;&a;\"><!ENTITY c \"&b;&b;&b;&b;\">]><gpx><wpt lat=\"52.1\" lon=\"-1.2\"><name>&c;</name></wpt></gpx>"u8.ToArray(), "/fixes/line/1" },
        { "truncated GPX", "<gpx version=\"1.1\" xmlns=\"http://www.topografix.com/GPX/1/1\">\n<wpt lat=\"52.1\" lon=\"-1.2\"><ele>80"u8.ToArray(), "/fixes/line/2" },
        { "GPX huge value", Encoding.UTF8.GetBytes("<gpx version=\"1.1\">\n<wpt lat=\"52.1\" lon=\"-1.2\"><name>" + new string('n', 100_000) + "</name></wpt></gpx>"), "/fixes/line/2" },
        { "XML that is not GPX", "<kml xmlns=\"http://www.opengis.net/kml/2.2\"/>"u8.ToArray(), "/fixes" },
        { "NMEA bad checksum", "$GPGGA,101500.00,5206.0000,N,00112.0000,W,1,08,1.1,30.0,M,50.0,M,,*00\n"u8.ToArray(), "/fixes/line/1" },
        { "NMEA truncated sentence", "$GPGGA,101500.00,5206.00\n"u8.ToArray(), "/fixes/line/1" },
        { "binary", [0x00, 0x01, 0x02, 0xFF, 0xFE, 0x00, 0x10], "/fixes/line/1" },
    };

    [Theory]
    [MemberData(nameof(Hostile_files))]
    public async Task Hostile_files_are_400_with_a_pointer_never_5xx(string name, byte[] fixes, string pointer)
    {
        var response = await Post(fixes, """{ "marks": { "crs": "EPSG:4979" }, "fixes": { "crs": "EPSG:4979" }, "pairing": { "radius": 5 } }""");
        var problem = await ProblemAssert.IsProblemAsync(response, HttpStatusCode.BadRequest);
        var pointers = problem.GetProperty("errors").EnumerateArray().Select(e => e.GetProperty("pointer").GetString()).ToList();
        Assert.True(pointers.Contains(pointer), $"{name}: expected {pointer} among {string.Join(", ", pointers)}");
    }

    [Fact]
    public async Task Unknown_and_repeated_parts_are_named()
    {
        var form = Uploads.Form(Options, Marks, Fixes);
        form.Add(Uploads.File("x"u8.ToArray()), "photos", "a.jpg");
        await ProblemAssert.IsBadInputAsync(await client.PostFormAsync(form), "/photos", "not a part");
        var twice = Uploads.Form(Options, Marks, Fixes);
        twice.Add(Uploads.File(Encoding.UTF8.GetBytes(Fixes)), "fixes", "again.csv");
        await ProblemAssert.IsBadInputAsync(await client.PostFormAsync(twice), "/fixes", "twice");
    }

    [Fact]
    public async Task A_multipart_body_without_its_closing_boundary_is_400()
    {
        var content = new StringContent("--b\r\nContent-Disposition: form-data; name=\"fixes\"; filename=\"a\"\r\n\r\nid,lat\n1,2\n", Encoding.UTF8);
        content.Headers.ContentType = System.Net.Http.Headers.MediaTypeHeaderValue.Parse("multipart/form-data; boundary=b");
        var response = await client.PostAsync("/v1/assessments", content);
        await ProblemAssert.IsProblemAsync(response, HttpStatusCode.BadRequest);
    }
}
