using System.Diagnostics;
using System.Globalization;
using QaService.Core.Geodesy.Catalog;
using QaService.Core.Geodesy.Transformations;
using Xunit.Abstractions;

namespace QaService.Core.Tests.Geodesy.Transformations;

/// <summary>
/// Every EPSG datum transformation of HelmertTable.g.cs and GridTable.g.cs against PROJ 9.1.1 running the same
/// operation (pinned by code from <c>projinfo --spatial-test intersects</c>, pipeline through <c>cct</c>) at 4 points
/// inside its EPSG area of use: tests/reference-data/datum-sweep-proj.tsv, made by make-datum-sweep.py, which names
/// PROJ's version and each code's pipeline. The service plans the route with <c>operationCode</c> = that code between
/// the same two catalog CRSs, so the planner's pinning, the generated parameters and the steps are all under test.
/// </summary>
public sealed class DatumSweepProjTests(ITestOutputHelper output)
{
    private const string FileName = "datum-sweep-proj.tsv";
    private const string NotSweptPrefix = "# not swept: EPSG:";
    private const double MetresPerDegree = 111_320.0;

    /// <summary>The issue's tolerance for the same operation: 2 mm (file rounding is 1e-12°, far below).</summary>
    private const double ToleranceMetres = 2e-3;

    /// <summary>Epoch the reference file gives cct as the time coordinate.</summary>
    private const double SweepEpochYear = 2020.0;

    private sealed record Sweep(int Code, string Source, string Target, string Pipeline, List<double[]> Points);

    private static List<Sweep> Load() => Load(out _);

    /// <param name="notSwept">Codes the script names as not swept (no PROJ candidate or no geographic CRS), with why.</param>
    private static List<Sweep> Load(out Dictionary<int, string> notSwept)
    {
        var sweeps = new Dictionary<int, Sweep>();
        notSwept = [];
        foreach (var line in File.ReadLines(ReferenceFiles.PathOf(FileName)))
        {
            if (line.StartsWith(NotSweptPrefix, StringComparison.Ordinal))
            {
                var rest = line[NotSweptPrefix.Length..];
                notSwept[int.Parse(rest[..rest.IndexOf(':')], CultureInfo.InvariantCulture)] = rest;
                continue;
            }
            var f = line.Split('\t');
            if (f[0] == "op")
                sweeps[int.Parse(f[1], CultureInfo.InvariantCulture)] = new Sweep(int.Parse(f[1], CultureInfo.InvariantCulture), f[2], f[3], f[5], []);
            else if (f[0] == "pt")
                sweeps[int.Parse(f[1], CultureInfo.InvariantCulture)].Points.Add(f.Skip(2).Select(D).ToArray());
        }
        return sweeps.Values.ToList();
    }

    [Fact]
    public void EveryTableOperation_MatchesProjWithTheSameOperation()
    {
        var sweeps = Load(out var notSwept);
        var tableCodes = HelmertTable.Transformations.Select(t => t.EpsgCode).Concat(GridTable.Transformations.Select(g => g.EpsgCode)).ToHashSet();
        // Every table operation is either swept or named in the file with the reason PROJ could not be pinned to it.
        Assert.Empty(tableCodes.Except(sweeps.Select(s => s.Code)).Except(notSwept.Keys));
        Assert.True(sweeps.Count >= 0.95 * tableCodes.Count, $"only {sweeps.Count} of {tableCodes.Count} operations swept");
        output.WriteLine($"not swept: {string.Join("; ", notSwept.Values)}");
        var worst = new Dictionary<int, double>();
        foreach (var sweep in sweeps)
        {
            Assert.Contains(sweep.Code, tableCodes);
            if (GridTable.Transformations.FirstOrDefault(g => g.EpsgCode == sweep.Code) is { } grid && GridFiles.Find(grid.FileName) is null)
            {
                output.WriteLine($"SKIPPED (not a failure): EPSG:{sweep.Code} needs {grid.FileName} (Debian proj-data)");
                continue;
            }
            var plan = CoordinateOperationPlanner.Plan(Crs(sweep.Source), Crs(sweep.Target), operationCode: sweep.Code);
            Assert.True(plan.Operation is not null, $"EPSG:{sweep.Code}: {plan.Problem}");
            Assert.Equal([sweep.Code], plan.Operation!.DatumEdges.Select(e => e.OperationCode));
            var buffer = new CoordinateBuffer(sweep.Points.Count, withEpochs: true);
            for (var i = 0; i < sweep.Points.Count; i++)
            {
                (buffer.First[i], buffer.Second[i], buffer.EpochYears![i]) = (sweep.Points[i][0], sweep.Points[i][1], SweepEpochYear);
            }
            plan.Operation.Execute(buffer);
            for (var i = 0; i < sweep.Points.Count; i++)
            {
                var p = sweep.Points[i];
                var error = Metres(buffer.First[i] - p[2], buffer.Second[i] - p[3], p[2]);
                worst[sweep.Code] = Math.Max(worst.GetValueOrDefault(sweep.Code), error);
                Assert.True(error <= ToleranceMetres, $"EPSG:{sweep.Code} ({p[0]}, {p[1]}): {error:E2} m from PROJ");
            }
        }
        var top = worst.OrderByDescending(w => w.Value).First();
        output.WriteLine(string.Create(CultureInfo.InvariantCulture, $"{worst.Count} operations; largest difference {top.Value:E2} m at EPSG:{top.Key}"));
    }

    /// <summary>Fresh random points inside 25 random operations' areas, through the committed pipelines and the cct on PATH.</summary>
    [Fact]
    public void RandomOperations_AgreeWithInstalledCct()
    {
        var cct = FindOnPath("cct");
        if (cct is null)
        {
            output.WriteLine("SKIPPED (not a failure): cct not on PATH; install proj-bin for the live check.");
            return;
        }
        var seed = Environment.TickCount;
        var rng = new Random(seed);
        var sweeps = Load().Where(s => s.Points.Count > 0 && !s.Pipeline.Contains("grids", StringComparison.Ordinal)).ToList();
        foreach (var sweep in Enumerable.Range(0, 25).Select(_ => sweeps[rng.Next(sweeps.Count)]))
        {
            var plan = CoordinateOperationPlanner.Plan(Crs(sweep.Source), Crs(sweep.Target), operationCode: sweep.Code).Operation!;
            var area = plan.DatumEdges[0].Area!;
            var east = area.EastDegrees < area.WestDegrees ? area.EastDegrees + 360 : area.EastDegrees;
            var points = Enumerable.Range(0, 5).Select(_ => (Lat: area.SouthDegrees + (rng.NextDouble() * (area.NorthDegrees - area.SouthDegrees)),
                Lon: Math.IEEERemainder(area.WestDegrees + (rng.NextDouble() * (east - area.WestDegrees)), 360))).ToArray();
            var lines = Run(cct, ["-d", "12", .. sweep.Pipeline.Split(' ', StringSplitOptions.RemoveEmptyEntries)],
                points.Select(p => string.Create(CultureInfo.InvariantCulture, $"{p.Lat:R} {p.Lon:R} 0 {SweepEpochYear}")));
            var buffer = new CoordinateBuffer(points.Length, withEpochs: true);
            for (var i = 0; i < points.Length; i++)
                (buffer.First[i], buffer.Second[i], buffer.EpochYears![i]) = (points[i].Lat, points[i].Lon, SweepEpochYear);
            plan.Execute(buffer);
            for (var i = 0; i < points.Length; i++)
            {
                var f = lines[i].Split((char[])[' ', '\t'], StringSplitOptions.RemoveEmptyEntries);
                var error = Metres(buffer.First[i] - D(f[0]), buffer.Second[i] - D(f[1]), points[i].Lat);
                Assert.True(error <= ToleranceMetres, $"EPSG:{sweep.Code} ({points[i].Lat}, {points[i].Lon}): {error:E2} m, seed {seed}");
            }
        }
    }

    private static CoordinateReferenceSystem Crs(string id) => CrsCatalog.Resolve(id).Crs ?? throw new InvalidOperationException($"{id} not in the catalog");

    private static double Metres(double dLatDegrees, double dLonDegrees, double latDegrees) =>
        Math.Sqrt(Math.Pow(dLatDegrees * MetresPerDegree, 2) + Math.Pow(Math.IEEERemainder(dLonDegrees, 360) * MetresPerDegree * Math.Cos(latDegrees * Math.PI / 180), 2));

    private static double D(string s) => double.Parse(s, NumberStyles.Float, CultureInfo.InvariantCulture);

    private static string? FindOnPath(string tool) =>
        (Environment.GetEnvironmentVariable("PATH") ?? "").Split(':').Select(d => Path.Combine(d, tool)).FirstOrDefault(File.Exists);

    private static string[] Run(string exe, string[] args, IEnumerable<string> inputLines)
    {
        var info = new ProcessStartInfo(exe) { RedirectStandardInput = true, RedirectStandardOutput = true, UseShellExecute = false };
        foreach (var a in args)
            info.ArgumentList.Add(a);
        using var process = Process.Start(info)!;
        foreach (var line in inputLines)
            process.StandardInput.WriteLine(line);
        process.StandardInput.Close();
        var lines = process.StandardOutput.ReadToEnd().Split('\n', StringSplitOptions.RemoveEmptyEntries);
        process.WaitForExit();
        return lines;
    }
}
