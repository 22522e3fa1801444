using System.Net;
using System.Text.Json;
using QaService.Api.Tests.Support;

namespace QaService.Api.Tests;

/// <summary>
/// Issue acceptance: reference case 0 of tests/reference-data/assessment-cases.json (answer computed
/// outside the project with PROJ 9.1.1, GeographicLib 2.1.2, numpy/scipy) uploaded as CSV, GPX, GeoJSON
/// and NMEA GGA (with geoid separation) under a neutral file name gives the expected figures within
/// 3 mm. The files are made from the case by tests/reference-data/make-field-files.py.
/// </summary>
public sealed class MultipartAcceptanceTests(ServiceHost host) : IClassFixture<ServiceHost>
{
    /// <summary>Issue acceptance tolerance: 3 mm on every figure.</summary>
    private const double FigureToleranceMetres = 0.003;

    private const string Spec = "\"spec\": { \"standard\": \"nssda\", \"horizontal\": 1.0, \"vertical\": 1.0 }";
    private const string MarksUtm = "\"marks\": { \"crs\": \"EPSG:32633\", \"heights\": \"ellipsoidal\" }";

    private readonly HttpClient client = host.Factory.CreateClient();

    public static TheoryData<string, string, string> Uploads_of_case_0 => new()
    {
        // The CSV uses ; and decimal comma and its own headers, mapped in the options.
        { "case0-fixes.csv", "csv", $$"""{ {{MarksUtm}}, "fixes": { "crs": "EPSG:4979", "heights": "ellipsoidal", "columns": { "id": "Punkt", "mark": "Marke", "lat": "Breite", "lon": "Laenge", "h": "Hoehe", "time": "Zeit" } }, {{Spec}} }""" },
        { "case0-fixes.geojson", "geojson", $$"""{ {{MarksUtm}}, "fixes": { "heights": "ellipsoidal" }, {{Spec}} }""" },
        // GPX and NMEA carry no mark id: fixes pair with the nearest mark within 5 m (marks are kilometres apart).
        { "case0-fixes.gpx", "gpx", $$"""{ {{MarksUtm}}, "fixes": { "heights": "ellipsoidal" }, "pairing": { "radius": 5 }, {{Spec}} }""" },
        { "case0-fixes.nmea", "nmea", $$"""{ {{MarksUtm}}, "pairing": { "radius": 5 }, {{Spec}} }""" },
    };

    [Theory]
    [MemberData(nameof(Uploads_of_case_0))]
    public async Task Every_format_reproduces_the_figures_of_the_json_request(string fixesFile, string format, string options)
    {
        var response = await client.PostFormAsync(Uploads.Form(options, Uploads.FieldFile("case0-marks.csv"), Uploads.FieldFile(fixesFile)));
        var text = await response.Content.ReadAsStringAsync();
        Assert.True(response.StatusCode == HttpStatusCode.Created, text);
        var report = JsonDocument.Parse(text).RootElement;

        Assert.Equal(format, report.GetProperty("ingest").GetProperty("fixes").GetProperty("format").GetString());
        Assert.Equal("csv", report.GetProperty("ingest").GetProperty("marks").GetProperty("format").GetString());
        Assert.Equal(24, report.GetProperty("counts").GetProperty("paired").GetInt32());
        AssertFiguresMatchCase0(report);
    }

    [Fact]
    public async Task Marks_as_geojson_in_a_projected_crs_give_the_same_figures()
    {
        var options = $$"""{ {{MarksUtm}}, "fixes": { "heights": "ellipsoidal" }, {{Spec}} }""";
        var response = await client.PostFormAsync(Uploads.Form(options, Uploads.FieldFile("case0-marks.geojson"), Uploads.FieldFile("case0-fixes.geojson")));
        var text = await response.Content.ReadAsStringAsync();
        Assert.True(response.StatusCode == HttpStatusCode.Created, text);
        AssertFiguresMatchCase0(JsonDocument.Parse(text).RootElement);
    }

    [Fact]
    public async Task Nmea_quality_zero_sentence_is_counted_not_assessed()
    {
        var options = $$"""{ {{MarksUtm}}, "pairing": { "radius": 5 }, {{Spec}} }""";
        var response = await client.PostFormAsync(Uploads.Form(options, Uploads.FieldFile("case0-marks.csv"), Uploads.FieldFile("case0-fixes.nmea")));
        var report = JsonDocument.Parse(await response.Content.ReadAsStringAsync()).RootElement;
        Assert.Equal(1, report.GetProperty("ingest").GetProperty("fixes").GetProperty("sentencesWithoutFix").GetInt64());
        Assert.Equal(24, report.GetProperty("counts").GetProperty("fixes").GetInt32());
    }

    private static void AssertFiguresMatchCase0(JsonElement report)
    {
        var expected = JsonDocument.Parse(File.ReadAllText(ReferenceData.PathOf("assessment-cases.json"))).RootElement
            .GetProperty("cases")[0].GetProperty("expected");
        foreach (var block in new[] { "horizontal", "vertical" })
        {
            foreach (var figure in expected.GetProperty(block).EnumerateObject())
            {
                var actual = report.GetProperty(block).GetProperty(figure.Name);
                if (figure.Value.ValueKind == JsonValueKind.String)
                    Assert.Equal(figure.Value.GetString(), actual.GetString());
                else
                    Assert.True(Math.Abs(figure.Value.GetDouble() - actual.GetDouble()) <= FigureToleranceMetres,
                        $"{block}.{figure.Name}: expected {figure.Value.GetDouble()}, got {actual.GetDouble()}");
            }
        }
    }
}
