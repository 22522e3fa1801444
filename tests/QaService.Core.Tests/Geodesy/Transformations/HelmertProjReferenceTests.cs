using QaService.Core.Geodesy;
using QaService.Core.Geodesy.Transformations;

namespace QaService.Core.Tests.Geodesy.Transformations;

/// <summary>
/// 7-parameter Helmert in both conventions against PROJ 9.1.1 <c>cct +proj=helmert … +convention=…</c>
/// (tests/reference-data/helmert-proj.tsv, made by make-datum-reference.py; 1 440 points, forward and inverse).
/// Tolerance 1 mm (the tolerance for Helmert): the same small-angle matrix as PROJ is used, so the real
/// differences are the file's 1 µm rounding; a convention swapped would be off by hundreds of metres.
/// </summary>
public sealed class HelmertProjReferenceTests
{
    private const double ToleranceMetres = 1e-3;

    /// <summary>The parameter sets of make-datum-reference.py (translations m, rotations ″, scale ppm).</summary>
    private static readonly Dictionary<string, double[]> Sets = new()
    {
        ["helmert-a"] = [-87.1, -98.2, -121.3, 0.59, -0.24, 1.3, 3.2],
        ["helmert-b"] = [446.448, -125.157, 542.06, 0.15, 0.247, 0.842, -20.489],
        ["helmert-5s"] = [0.5, -0.4, 0.3, 5, -5, 5, 1.5],
    };

    private static HelmertMatrix Matrix(string set, HelmertConvention convention)
    {
        var p = Sets[set];
        return new HelmertParameters(convention, p[0], p[1], p[2], p[3], p[4], p[5], p[6]).AtEpoch(null);
    }

    private static HelmertConvention Convention(string text) =>
        text == "position_vector" ? HelmertConvention.PositionVector : HelmertConvention.CoordinateFrame;

    [Fact]
    public void BothConventions_ForwardAndInverse_MatchCct()
    {
        var rows = ReferenceData.Load("helmert-proj.tsv");
        Assert.True(rows.Count >= 1400, $"expected the full reference file, got {rows.Count} rows");
        var worst = 0.0;
        foreach (var r in rows)
        {
            var matrix = Matrix(r[0], Convention(r[1]));
            var input = new GeocentricCoordinate(ReferenceData.D(r[3]), ReferenceData.D(r[4]), ReferenceData.D(r[5]));
            var output = r[2] == "forward" ? matrix.Forward(input) : matrix.Reverse(input);
            var error = Distance(output, ReferenceData.D(r[6]), ReferenceData.D(r[7]), ReferenceData.D(r[8]));
            worst = Math.Max(worst, error);
            Assert.True(error < ToleranceMetres, $"{string.Join(' ', r[..3])}: {error:E2} m");
        }
        Assert.True(worst < 1e-5, $"worst {worst:E2} m should be at the file's rounding"); // PROJ 9.1.1 cct, 1e-6 m output
    }

    [Fact]
    public void SwappedConvention_IsTheClassicSignError_AndPROJSeesIt()
    {
        // Outside source: PROJ 9.1.1 cct output for the 5″ set. Applying the position-vector numbers with the
        // coordinate-frame rule reverses the rotation: 2 × 5″ ≈ 48 µrad, ~300 m at the Earth's surface.
        var rows = ReferenceData.Load("helmert-proj.tsv").Where(r => r[0] == "helmert-5s" && r[2] == "forward").ToList();
        Assert.NotEmpty(rows);
        foreach (var r in rows)
        {
            var input = new GeocentricCoordinate(ReferenceData.D(r[3]), ReferenceData.D(r[4]), ReferenceData.D(r[5]));
            var wrong = Matrix("helmert-5s", Convention(r[1]) == HelmertConvention.PositionVector ? HelmertConvention.CoordinateFrame : HelmertConvention.PositionVector);
            Assert.True(Distance(wrong.Forward(input), ReferenceData.D(r[6]), ReferenceData.D(r[7]), ReferenceData.D(r[8])) > 50.0);
        }
    }

    [Fact]
    public void SmallAngleMatrix_DiffersFromAnExactRotation_ByAbout2MillimetresAt5ArcSeconds()
    {
        // EPSG Guidance Note 7-2 §4.3.3 (and PROJ's helmert without +exact) linearise the rotation: cos θ → 1,
        // sin θ → θ. For a 5″ rotation about Z of a point on the equator (a = 6 378 137 m) the exact rotation moves
        // x by a(1 − cos θ) ≈ aθ²/2 = 1.87 mm more than the linear one (arithmetic from the definitions).
        var matrix = new HelmertParameters(HelmertConvention.PositionVector, 0, 0, 0, 0, 0, 5, 0).AtEpoch(null);
        const double a = 6_378_137.0;
        var linear = matrix.Forward(new GeocentricCoordinate(a, 0, 0));
        var theta = 5 * HelmertMatrix.RadiansPerArcSecond;
        var exact = new GeocentricCoordinate(a * Math.Cos(theta), a * Math.Sin(theta), 0); // position vector: rotates the point
        var difference = Distance(linear, exact.XMetres, exact.YMetres, exact.ZMetres);
        Assert.Equal(a * theta * theta / 2, difference, 9);
        Assert.InRange(difference, 1.8e-3, 1.9e-3);
    }

    private static double Distance(GeocentricCoordinate a, double x, double y, double z) =>
        Math.Sqrt((a.XMetres - x) * (a.XMetres - x) + (a.YMetres - y) * (a.YMetres - y) + (a.ZMetres - z) * (a.ZMetres - z));
}
