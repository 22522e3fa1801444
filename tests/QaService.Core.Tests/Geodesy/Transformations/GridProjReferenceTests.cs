using QaService.Core.Geodesy.Transformations;
using QaService.Core.Geodesy.Vertical;
using Xunit.Abstractions;

namespace QaService.Core.Tests.Geodesy.Transformations;

/// <summary>
/// NTv2 shifts and EGM96 undulations against PROJ 9.1.1 (<c>cct +proj=hgridshift</c>, <c>+proj=vgridshift</c>;
/// tests/reference-data/ntv2-proj.tsv and geoid-proj.tsv, made by make-datum-reference.py). The NTv2 grids and
/// egm96_15.gtx are read from Debian's proj-data (/usr/share/proj; CI installs it); without them those tests
/// say so and return. The shipped EGM96 grid needs no file and always runs.
/// </summary>
public sealed class GridProjReferenceTests(ITestOutputHelper output)
{
    private const string ProjData = "/usr/share/proj";
    private const double MetresPerDegree = 111_320.0;

    /// <summary>1 mm: same bilinear rule and float32 nodes as PROJ, so only the file's 1e-11° rounding and float arithmetic remain.</summary>
    private const double NtV2ToleranceMetres = 1e-3;

    /// <summary>
    /// 1 cm (the geoid tolerance): bilinear interpolation of the same nodes; the shipped grid rounds nodes to
    /// 1 mm (≤ 0.5 mm), so a real difference in the interpolation rule (cell indexing, wrap) would show as cm–m.
    /// </summary>
    private const double GeoidToleranceMetres = 0.01;

    [Fact]
    public void NtV2_ForwardAndInverse_MatchHgridshift()
    {
        var rows = ReferenceData.Load("ntv2-proj.tsv");
        Assert.True(rows.Count >= 1000);
        foreach (var group in rows.GroupBy(r => r[0]))
        {
            var path = Path.Combine(ProjData, group.Key);
            if (!File.Exists(path))
            {
                output.WriteLine($"SKIPPED (not a failure): {path} missing; install Debian proj-data.");
                continue;
            }
            using var file = File.OpenRead(path);
            var grid = NtV2Grid.Read(file, group.Key);
            foreach (var r in group)
            {
                var (lon, lat) = (ReferenceData.D(r[2]), ReferenceData.D(r[3]));
                var (outLat, outLon) = r[1] == "forward" ? grid.Forward(lat, lon) : grid.Reverse(lat, lon);
                var error = Math.Sqrt(Math.Pow((outLat - ReferenceData.D(r[5])) * MetresPerDegree, 2)
                                      + Math.Pow((outLon - ReferenceData.D(r[4])) * MetresPerDegree * Math.Cos(lat * Math.PI / 180), 2));
                Assert.True(error < NtV2ToleranceMetres, $"{r[0]} {r[1]} ({lat}, {lon}): {error:E2} m");
            }
        }
    }

    [Fact]
    public void ShippedEgm96_MatchesVgridshift()
    {
        var worst = 0.0;
        foreach (var r in ReferenceData.Load("geoid-proj.tsv"))
        {
            var n = Egm96.Grid.UndulationMetres(ReferenceData.D(r[0]), ReferenceData.D(r[1]));
            var error = Math.Abs(n - ReferenceData.D(r[2]));
            worst = Math.Max(worst, error);
            Assert.True(error < GeoidToleranceMetres, $"({r[0]}, {r[1]}): N {n} vs PROJ {r[2]}");
        }
        output.WriteLine($"worst |N − PROJ| = {worst:E2} m");
    }

    [Fact]
    public void GtxReader_ReadsProjsEgm96File_AndMatchesVgridshift()
    {
        var path = Path.Combine(ProjData, "egm96_15.gtx");
        if (!File.Exists(path))
        {
            output.WriteLine($"SKIPPED (not a failure): {path} missing; install Debian proj-data.");
            return;
        }
        using var file = File.OpenRead(path);
        var grid = GtxReader.Read(file, "egm96_15.gtx");
        Assert.Equal((721, 1440), (grid.Rows, grid.Columns));
        foreach (var r in ReferenceData.Load("geoid-proj.tsv"))
        {
            var n = grid.UndulationMetres(ReferenceData.D(r[0]), ReferenceData.D(r[1]));
            // Same float32 nodes as PROJ: only the file's 1e-6 m rounding separates the results.
            Assert.True(Math.Abs(n - ReferenceData.D(r[2])) < 1e-4, $"({r[0]}, {r[1]}): N {n} vs PROJ {r[2]}");
        }
    }

    [Fact]
    public void GtxReader_RejectsNonsense()
    {
        using var stream = new MemoryStream(new byte[40]);
        Assert.Throws<InvalidDataException>(() => GtxReader.Read(stream, "zeros"));
    }
}
