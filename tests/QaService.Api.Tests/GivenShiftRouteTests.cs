using System.Globalization;
using System.Net;
using System.Text;
using System.Text.Json;
using System.Text.Json.Nodes;
using QaService.Api.Tests.Support;

namespace QaService.Api.Tests;

/// <summary>
/// CRSs given as WKT on datums EPSG does not know, carrying their shift to WGS 84 (WKT1 TOWGS84, WKT2 BOUNDCRS with a
/// coordinate-frame Helmert), through POST /v1/transform and through an assessment, against PROJ 9.1.1 cs2cs on the
/// same WKT strings (tests/reference-data/towgs84-proj.tsv, made by make-towgs84-reference.py).
/// </summary>
public sealed class GivenShiftRouteTests(ServiceHost host) : IClassFixture<ServiceHost>
{
    /// <summary>The brief's acceptance: within 1 mm of PROJ (cs2cs prints 1e-10°, about 1e-5 m).</summary>
    private const double ToleranceMetres = 0.001;

    /// <summary>Metres per degree of latitude, an upper bound for both angles (WGS 84 meridian arc, 111.7 km at the pole).</summary>
    private const double MetresPerDegree = 111_700;

    private readonly HttpClient client = host.Factory.CreateClient();

    private static readonly string[] Lines = File.ReadAllLines(ReferenceData.PathOf("towgs84-proj.tsv"));

    private static readonly Dictionary<string, string> Wkts = Lines.Where(l => l.StartsWith("wkt\t", StringComparison.Ordinal))
        .Select(l => l.Split('\t')).ToDictionary(f => "wkt:" + f[1], f => f[2]);

    public static TheoryData<string, string> Cases()
    {
        var data = new TheoryData<string, string>();
        foreach (var pair in Lines.Where(l => l.StartsWith("row\t", StringComparison.Ordinal)).Select(l => l.Split('\t')).Select(f => (f[1], f[2])).Distinct())
            data.Add(pair.Item1, pair.Item2);
        return data;
    }

    private static string Crs(string name) => Wkts.TryGetValue(name, out var wkt) ? wkt : name;

    private static bool IsGeographic(string name) => name is "EPSG:4326" || name.EndsWith("-geog", StringComparison.Ordinal) || name.Contains("bound", StringComparison.Ordinal);

    private static double D(string s) => double.Parse(s, NumberStyles.Float, CultureInfo.InvariantCulture);

    [Theory]
    [MemberData(nameof(Cases))]
    public async Task Transform_matches_cs2cs_within_a_millimetre(string from, string to)
    {
        var rows = Lines.Where(l => l.StartsWith($"row\t{from}\t{to}\t", StringComparison.Ordinal)).Select(l => l.Split('\t')).ToList();
        var (a, b) = IsGeographic(from) ? ("lat", "lon") : ("e", "n");
        var points = new JsonArray(rows.Select(r => (JsonNode)new JsonObject { [a] = D(r[3]), [b] = D(r[4]) }).ToArray());
        var body = new JsonObject { ["from"] = Crs(from), ["to"] = Crs(to), ["points"] = points };
        var response = await client.PostAsync("/v1/transform", new StringContent(body.ToJsonString(), Encoding.UTF8, "application/json"));
        var text = await response.Content.ReadAsStringAsync();
        Assert.True(response.StatusCode == HttpStatusCode.OK, text);
        var result = JsonDocument.Parse(text).RootElement;
        var (c, d) = IsGeographic(to) ? ("lat", "lon") : ("e", "n");
        var scale = IsGeographic(to) ? MetresPerDegree : to.Contains("ftus", StringComparison.Ordinal) ? 1200.0 / 3937 : 1.0;
        for (var i = 0; i < rows.Count; i++)
        {
            var p = result.GetProperty("points")[i];
            var dc = Math.Abs(p.GetProperty(c).GetDouble() - D(rows[i][5])) * scale;
            var dd = Math.Abs(p.GetProperty(d).GetDouble() - D(rows[i][6])) * scale;
            Assert.True(dc <= ToleranceMetres && dd <= ToleranceMetres, $"{from} → {to} row {i} ({rows[i][3]}, {rows[i][4]}): off by {dc:0.000000} m, {dd:0.000000} m");
        }
        var operation = result.GetProperty("operation").GetString()!;
        Assert.Contains("accuracy as given, unknown", operation, StringComparison.Ordinal);
        Assert.Contains(from.StartsWith("wkt:", StringComparison.Ordinal) && !to.StartsWith("wkt:", StringComparison.Ordinal) ? "the shift given with the CRS" : "inverse of the shift given with the CRS", operation, StringComparison.Ordinal);
        Assert.Equal(JsonValueKind.Null, result.GetProperty("accuracy").ValueKind);
    }

    [Fact]
    public async Task An_assessment_with_marks_on_a_towgs84_grid_and_wgs84_fixes_shows_no_offset()
    {
        // Marks on the Kestrel Bay grid (WKT1 TOWGS84, invented datum), fixes at the same places in WGS 84 as cs2cs put
        // them: residuals within the 1 mm of the transform plus the file's 1e-3 m rounding of the grid values.
        var rows = Lines.Where(l => l.StartsWith("row\twkt:kestrel-grid\tEPSG:4326\t", StringComparison.Ordinal)).Select(l => l.Split('\t')).Take(30).ToList();
        var marks = new JsonArray(rows.Select((r, i) => (JsonNode)new JsonObject { ["id"] = $"KB-{i:00}", ["e"] = D(r[3]), ["n"] = D(r[4]) }).ToArray());
        var fixes = new JsonArray(rows.Select((r, i) => (JsonNode)new JsonObject { ["id"] = $"F-{i:00}", ["mark"] = $"KB-{i:00}", ["lat"] = D(r[5]), ["lon"] = D(r[6]) }).ToArray());
        var request = new JsonObject
        {
            ["title"] = "Kestrel Bay hydrants, local grid",
            ["marks"] = new JsonObject { ["crs"] = Wkts["wkt:kestrel-grid"], ["heights"] = "none", ["points"] = marks },
            ["fixes"] = new JsonObject { ["crs"] = "EPSG:4326", ["heights"] = "none", ["points"] = fixes },
            ["spec"] = new JsonObject { ["standard"] = "nssda", ["horizontal"] = 0.5 },
        };
        var response = await client.PostJsonAsync(request);
        var text = await response.Content.ReadAsStringAsync();
        Assert.True(response.StatusCode == HttpStatusCode.Created, text);
        var report = JsonDocument.Parse(text).RootElement;
        foreach (var r in report.GetProperty("residuals").EnumerateArray())
        {
            Assert.InRange(r.GetProperty("dE").GetDouble(), -0.0015, 0.0015);
            Assert.InRange(r.GetProperty("dN").GetDouble(), -0.0015, 0.0015);
        }
        var operation = report.GetProperty("frames").GetProperty("operation").GetString()!;
        Assert.Contains("inverse of the shift given with the CRS, Kestrel_Bay_Datum_1962 → WGS 84 (WKT1 TOWGS84", operation, StringComparison.Ordinal);
        Assert.Contains("accuracy as given, unknown", operation, StringComparison.Ordinal);
    }
}
