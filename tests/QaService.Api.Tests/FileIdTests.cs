using System.Globalization;
using System.Net;
using System.Text;
using System.Text.Json;
using System.Text.Json.Nodes;
using QaService.Api.Tests.Support;

namespace QaService.Api.Tests;

/// <summary>
/// Fix ids of a file upload are kept in place (characters in shared chunks, no string per fix), while a JSON request's
/// ids are strings: the two routes must still give every fix the same id. Reference case 0's points
/// (tests/reference-data/assessment-cases.json) are sent both ways with ids that need trimming, a missing id, ids the
/// JSON writer escapes and a non-ASCII id, and an exclusion naming a trimmed id; the residual arrays must be the same
/// bytes. The contract's rules (api-v1 "Points"): ids are trimmed, a fix without one is "#" and its position, an id
/// over 200 characters is refused with a pointer to its row.
/// </summary>
public sealed class FileIdTests(ServiceHost host) : IClassFixture<ServiceHost>
{
    private readonly HttpClient client = host.Factory.CreateClient();

    /// <summary>Ids given to the first fixes of case 0 (the rest keep theirs).</summary>
    private static readonly string?[] SpecialIds = ["  F 0001  ", null, "Ü<3>&\"q\"", "tab\tinside", "\u00a0nbsp-trimmed\u00a0", "+plus`tick'"];

    private const string Exclusion = """[{ "fix": " F 0001 ", "reason": "pole leaned in the photo" }]""";

    [Theory]
    [InlineData("csv")] // the CSV reader trims every field itself
    [InlineData("geojson")] // GeoJSON properties arrive untrimmed: validation trims the id in place
    public async Task File_ids_give_the_same_residuals_as_json_ids(string format)
    {
        var (marks, fixes) = CaseZero();
        var json = new JsonObject
        {
            ["marks"] = new JsonObject { ["crs"] = "EPSG:32633", ["heights"] = "ellipsoidal", ["points"] = marks.DeepClone() },
            ["fixes"] = new JsonObject { ["crs"] = "EPSG:4979", ["heights"] = "ellipsoidal", ["points"] = fixes.DeepClone() },
            ["spec"] = new JsonObject { ["standard"] = "nssda", ["horizontal"] = 1.0, ["vertical"] = 1.0 },
            ["exclusions"] = JsonNode.Parse(Exclusion),
        };
        var fromJson = await CreatedAsync(await client.PostJsonAsync(json));

        var options = $$"""{ "marks": { "crs": "EPSG:32633", "heights": "ellipsoidal" }, "fixes": { "crs": "EPSG:4979", "heights": "ellipsoidal" }, "spec": { "standard": "nssda", "horizontal": 1.0, "vertical": 1.0 }, "exclusions": {{Exclusion}} }""";
        var fromFile = await CreatedAsync(await client.PostFormAsync(Uploads.Form(options, MarksCsv(marks), format == "csv" ? FixesCsv(fixes) : FixesGeoJson(fixes))));
        Assert.Equal(format, fromFile.GetProperty("ingest").GetProperty("fixes").GetProperty("format").GetString());

        var residuals = fromFile.GetProperty("residuals");
        Assert.Equal(fromJson.GetProperty("residuals").GetRawText(), residuals.GetRawText());
        var ids = residuals.EnumerateArray().Select(r => r.GetProperty("fix").GetString()).ToList();
        Assert.Equal(["F 0001", "#2", "Ü<3>&\"q\"", "tab\tinside", "nbsp-trimmed", "+plus`tick'"], ids.Take(SpecialIds.Length));
        Assert.Equal("pole leaned in the photo", residuals[0].GetProperty("excluded").GetString());
        Assert.Equal(1, fromFile.GetProperty("counts").GetProperty("excluded").GetInt32());
    }

    [Fact]
    public async Task An_id_over_200_characters_points_at_its_file_row()
    {
        var (marks, fixes) = CaseZero();
        fixes[3]!["id"] = new string('L', 201);
        var options = """{ "marks": { "crs": "EPSG:32633", "heights": "ellipsoidal" }, "fixes": { "crs": "EPSG:4979", "heights": "ellipsoidal" }, "spec": { "standard": "nssda", "horizontal": 1.0 } }""";
        // Header on line 1, so the fourth fix is on line 5.
        await ProblemAssert.IsBadInputAsync(await client.PostFormAsync(Uploads.Form(options, MarksCsv(marks), FixesCsv(fixes))), "/fixes/line/5/id", "longer than 200");
    }

    [Fact]
    public async Task An_exclusion_naming_no_file_fix_points_at_itself()
    {
        var (marks, fixes) = CaseZero();
        var options = """{ "marks": { "crs": "EPSG:32633", "heights": "ellipsoidal" }, "fixes": { "crs": "EPSG:4979", "heights": "ellipsoidal" }, "spec": { "standard": "nssda", "horizontal": 1.0 }, "exclusions": [{ "fix": "F 0001", "reason": "x" }, { "fix": "F-9999", "reason": "y" }] }""";
        await ProblemAssert.IsBadInputAsync(await client.PostFormAsync(Uploads.Form(options, MarksCsv(marks), FixesCsv(fixes))), "/options/exclusions/1/fix", "no fix has the id");
    }

    private static async Task<JsonElement> CreatedAsync(HttpResponseMessage response)
    {
        var text = await response.Content.ReadAsStringAsync();
        Assert.True(response.StatusCode == HttpStatusCode.Created, text);
        return JsonDocument.Parse(text).RootElement.Clone();
    }

    private static (JsonArray Marks, JsonArray Fixes) CaseZero()
    {
        var request = JsonNode.Parse(File.ReadAllText(ReferenceData.PathOf("assessment-cases.json")))!["cases"]![0]!["request"]!;
        var fixes = request["fixes"]!["points"]!.AsArray();
        for (var i = 0; i < SpecialIds.Length; i++)
        {
            if (SpecialIds[i] is { } id)
                fixes[i]!["id"] = id;
            else
                fixes[i]!.AsObject().Remove("id");
        }
        return (request["marks"]!["points"]!.AsArray(), fixes);
    }

    private static string MarksCsv(JsonArray marks) =>
        "id,e,n,h\n" + string.Concat(marks.Select(m => Row(Text(m!["id"]), Number(m!["e"]), Number(m!["n"]), Number(m!["h"]))));

    private static string FixesCsv(JsonArray fixes) =>
        "id,mark,lat,lon,h\n" + string.Concat(fixes.Select(f => Row(Text(f!["id"]), Text(f!["mark"]), Number(f!["lat"]), Number(f!["lon"]), Number(f!["h"]))));

    /// <summary>RFC 7946 Point features, lon/lat/h, the id and mark as properties (an id left out where the fix has none).</summary>
    private static string FixesGeoJson(JsonArray fixes) => new JsonObject
    {
        ["type"] = "FeatureCollection",
        ["features"] = new JsonArray(fixes.Select(f => (JsonNode)new JsonObject
        {
            ["type"] = "Feature",
            ["geometry"] = new JsonObject { ["type"] = "Point", ["coordinates"] = new JsonArray(f!["lon"]!.DeepClone(), f["lat"]!.DeepClone(), f["h"]!.DeepClone()) },
            ["properties"] = f["id"] is { } id ? new JsonObject { ["id"] = id.DeepClone(), ["mark"] = f["mark"]!.DeepClone() } : new JsonObject { ["mark"] = f["mark"]!.DeepClone() },
        }).ToArray()),
    }.ToJsonString();

    /// <summary>A CSV row; every text quoted (RFC 4180 §2: a quote inside is doubled) so spaces and tabs stay part of it.</summary>
    private static string Row(params string[] cells) => string.Join(",", cells) + "\n";

    private static string Text(JsonNode? node) => node is null ? "" : "\"" + node.GetValue<string>().Replace("\"", "\"\"", StringComparison.Ordinal) + "\"";

    private static string Number(JsonNode? node) => node!.GetValue<double>().ToString("R", CultureInfo.InvariantCulture);
}
