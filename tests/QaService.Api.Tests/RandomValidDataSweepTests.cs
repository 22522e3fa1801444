using System.Net;
using System.Text.Json.Nodes;
using QaService.Api.Tests.Support;

namespace QaService.Api.Tests;

/// <summary>
/// Seeded sweep of valid collections with extreme shapes — residual scales from a micrometre to a
/// kilometre, strong correlation, lopsided axes, large offsets, 1–40 points, every standard, with and
/// without a confidence level: every one must give a 201 report, never a 5xx.
/// </summary>
public sealed class RandomValidDataSweepTests(ServiceHost host) : IClassFixture<ServiceHost>
{
    /// <summary>Enough cases to cross every branch (standards, confidence, offsets, scales) in a few seconds.</summary>
    private const int Cases = 80;
    private readonly HttpClient client = host.Factory.CreateClient();

    [Fact]
    public async Task Extreme_but_valid_collections_always_get_a_report()
    {
        var random = new Random(20261202);
        string[] standards = ["nssda", "asprs-2023", "nmas-1947", "nga-ce90"];
        var failures = new List<string>();
        for (var c = 0; c < Cases; c++)
        {
            var count = random.Next(1, 41);
            var scale = Math.Pow(10, random.NextDouble() * 9 - 6);          // 1e-6 … 1e3 m
            var ratio = Math.Pow(10, -random.NextDouble() * 6);              // minor/major 1 … 1e-6
            var offset = random.NextDouble() < 0.3 ? scale * Math.Pow(10, random.NextDouble() * 8) : 0.0;
            var rho = random.NextDouble() * 2 - 1;
            var marks = new JsonArray();
            var fixes = new JsonArray();
            for (var i = 0; i < count; i++)
            {
                double e = 500000.0 + 53 * i, n = 5400000.0 + 37 * (i % 7);
                double u1 = Gauss(random), u2 = Gauss(random);
                var de = offset + scale * u1;
                var dn = -offset / 2 + scale * ratio * (rho * u1 + Math.Sqrt(1 - rho * rho) * u2);
                marks.Add(new JsonObject { ["id"] = $"M{i}", ["e"] = e, ["n"] = n, ["h"] = 150.0, ["sigmaH"] = 0.005 });
                fixes.Add(new JsonObject { ["id"] = $"F{i}", ["mark"] = $"M{i}", ["e"] = e + de, ["n"] = n + dn, ["h"] = 150.0 + scale * Gauss(random) });
            }
            var standard = standards[random.Next(standards.Length)];
            var spec = new JsonObject { ["standard"] = standard, ["horizontal"] = 0.5, ["vertical"] = 1.0 };
            if (standard == "nmas-1947") { spec["mapScale"] = 2400; spec["contourInterval"] = 1.0; spec.Remove("horizontal"); spec.Remove("vertical"); }
            if (random.NextDouble() < 0.5) spec["confidence"] = 0.9;
            var body = new JsonObject
            {
                ["marks"] = new JsonObject { ["crs"] = "EPSG:32633", ["heights"] = "ellipsoidal", ["points"] = marks },
                ["fixes"] = new JsonObject { ["crs"] = "EPSG:32633", ["heights"] = "ellipsoidal", ["points"] = fixes },
                ["spec"] = spec,
            };
            var response = await client.PostJsonAsync(body);
            if ((int)response.StatusCode >= 500)
                failures.Add($"case {c}: n {count}, scale {scale:G3}, ratio {ratio:G3}, offset {offset:G3}, rho {rho:F2}, {standard}: {(int)response.StatusCode}");
        }
        Assert.True(failures.Count == 0, string.Join("\n", failures));
    }

    private static double Gauss(Random random) =>
        Math.Sqrt(-2 * Math.Log(1 - random.NextDouble())) * Math.Cos(2 * Math.PI * random.NextDouble());
}
