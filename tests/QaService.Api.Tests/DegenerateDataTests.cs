using System.Net;
using System.Text.Json.Nodes;
using QaService.Api.Tests.Support;

namespace QaService.Api.Tests;

/// <summary>
/// Valid but degenerate collections (every residual identical, all zero, one point, residuals on a line)
/// must give a report, never a 5xx: spread-free data is where root finders and ratios break.
/// </summary>
public sealed class DegenerateDataTests(ServiceHost host) : IClassFixture<ServiceHost>
{
    private readonly HttpClient client = host.Factory.CreateClient();

    /// <summary>24 marks on a grid (UTM 33N) and fixes at mark + (dE(i), dN(i), dU(i)) in grid units.</summary>
    private static JsonObject Collection(int count, Func<int, (double E, double N, double U)> offset)
    {
        var marks = new JsonArray();
        var fixes = new JsonArray();
        for (var i = 0; i < count; i++)
        {
            double e = 500000.0 + 40 * i, n = 5400000.0 + 25 * (i % 5);
            var (de, dn, du) = offset(i);
            marks.Add(new JsonObject { ["id"] = $"M{i}", ["e"] = e, ["n"] = n, ["h"] = 200.0 });
            fixes.Add(new JsonObject { ["id"] = $"F{i}", ["mark"] = $"M{i}", ["e"] = e + de, ["n"] = n + dn, ["h"] = 200.0 + du });
        }
        return new JsonObject
        {
            ["marks"] = new JsonObject { ["crs"] = "EPSG:32633", ["heights"] = "ellipsoidal", ["points"] = marks },
            ["fixes"] = new JsonObject { ["crs"] = "EPSG:32633", ["heights"] = "ellipsoidal", ["points"] = fixes },
            ["spec"] = new JsonObject { ["standard"] = "nssda", ["horizontal"] = 0.5, ["vertical"] = 1.0, ["confidence"] = 0.9 },
        };
    }

    public static TheoryData<string> Shapes => ["identical", "zero", "single", "east-only", "two"];

    [Theory]
    [MemberData(nameof(Shapes))]
    public async Task Spread_free_collections_get_a_report(string shape)
    {
        var body = shape switch
        {
            "identical" => Collection(24, _ => (0.012, -0.008, 0.03)),
            "zero" => Collection(24, _ => (0, 0, 0)),
            "single" => Collection(1, _ => (0.01, 0.02, 0.03)),
            "east-only" => Collection(24, i => (0.001 * (i - 12), 0, 0.01)),
            _ => Collection(2, i => (0.01 * i, -0.01 * i, 0)),
        };
        var response = await client.PostJsonAsync(body);
        Assert.True(response.StatusCode == HttpStatusCode.Created, $"{shape}: {(int)response.StatusCode} {await response.Content.ReadAsStringAsync()}");
    }

    public static TheoryData<string, string> StandardsAndShapes()
    {
        var data = new TheoryData<string, string>();
        foreach (var standard in new[] { "nssda", "asprs-2023", "nmas-1947", "nga-ce90" })
        foreach (var shape in new[] { "identical", "zero", "single", "east-only", "two" })
            data.Add(standard, shape);
        return data;
    }

    [Theory]
    [MemberData(nameof(StandardsAndShapes))]
    public async Task Spread_free_collections_get_a_report_under_every_standard(string standard, string shape)
    {
        var body = shape switch
        {
            "identical" => Collection(30, _ => (0.012, -0.008, 0.03)),
            "zero" => Collection(30, _ => (0, 0, 0)),
            "single" => Collection(1, _ => (0.01, 0.02, 0.03)),
            "east-only" => Collection(30, i => (0.001 * (i - 15), 0, 0.01)),
            _ => Collection(2, i => (0.01 * i, -0.01 * i, 0)),
        };
        body["spec"]!["standard"] = standard;
        if (standard == "nmas-1947")
        {
            body["spec"]!["mapScale"] = 1200;
            body["spec"]!["contourInterval"] = 0.5;
        }
        var response = await client.PostJsonAsync(body);
        Assert.True(response.StatusCode == HttpStatusCode.Created, $"{(int)response.StatusCode} {await response.Content.ReadAsStringAsync()}");
    }
}
