using System.Globalization;
using QaService.Core.Assessment;
using QaService.Core.Geodesy;
using QaService.Core.Geodesy.Catalog;
using QaService.Core.Geodesy.Transformations;

namespace QaService.Core.Tests.Geodesy.Transformations;

/// <summary>
/// Marks carried between epochs by ITRF2014-PMM / ITRF2020-PMM (<see cref="EpochPropagation"/>) against PROJ 9.1.1's
/// <c>cct</c> running <c>+proj=helmert +drx +dry +drz +t_epoch=t0 +convention=position_vector</c> with the same
/// rotation rates (tests/reference-data/plate-motion-proj.tsv, make-plate-motion-reference.py).
/// </summary>
public sealed class PlateMotionTests
{
    /// <summary>The tolerance: 1 mm in 3D (cct output is rounded to 1e-12°, 1e-12 m).</summary>
    private const double ToleranceMetres = 1e-3;

    [Fact]
    public void EveryPlateOfBothModels_MatchesCctHelmertRates()
    {
        var rows = ReferenceData.Load("plate-motion-proj.tsv");
        Assert.Equal(2 * (11 + 13) * 4, rows.Count);
        var crs = CrsCatalog.Resolve("EPSG:7912").Crs!; // ITRF2014 geographic 3D, GRS 1980 as in the cct pipeline
        foreach (var r in rows)
        {
            var model = PlateMotionModel.Find(r[0])!;
            var plate = model.Plate(r[1])!;
            var frame = new PointSetFrame(crs, HeightReference.Ellipsoidal, null, D(r[5]), true) { PlateMotion = (model, plate) };
            var mark = new FramedPoint(0, "m", null, new GeodeticCoordinate(D(r[2]), D(r[3]), D(r[4])), true, null, null, null);
            var (moved, note) = EpochPropagation.CarryMarks([mark], frame, D(r[5]), D(r[6]));
            var expected = GeocentricConversion.ToGeocentric(new GeodeticCoordinate(D(r[7]), D(r[8]), D(r[9])), Ellipsoid.Grs80);
            var got = GeocentricConversion.ToGeocentric(moved[0].Geodetic, Ellipsoid.Grs80);
            var error = Math.Sqrt(Math.Pow(got.XMetres - expected.XMetres, 2) + Math.Pow(got.YMetres - expected.YMetres, 2) + Math.Pow(got.ZMetres - expected.ZMetres, 2));
            Assert.True(error <= ToleranceMetres, $"{r[0]} {r[1]} ({r[2]}, {r[3]}) {r[5]}→{r[6]}: {error:E2} m");
            Assert.Contains(r[1], note, StringComparison.Ordinal);
            Assert.Contains("doi:10.", note, StringComparison.Ordinal);
        }
    }

    [Fact]
    public void OwnVelocities_MoveAMarkByVelocityTimesYears()
    {
        // 2 cm/yr east, 1 cm/yr north, 3 mm/yr up over 10 years at 48° N: the ENU displacement is (0.2, 0.1, 0.03) m
        // (linear station motion, ITRF convention); the ENU of the move measured back at the mark must match to 0.1 mm.
        var crs = CrsCatalog.Resolve("EPSG:7912").Crs!;
        var frame = new PointSetFrame(crs, HeightReference.Ellipsoidal, null, 2016.0, true);
        var start = new GeodeticCoordinate(48.0, 11.0, 500.0);
        var mark = new FramedPoint(0, "m", null, start, true, null, null, null) { VelocityMetresPerYear = new EnuVector(0.02, 0.01, 0.003) };
        var (moved, note) = EpochPropagation.CarryMarks([mark], frame, 2016.0, 2026.0);
        var enu = LocalTangentPlane.Difference(GeocentricConversion.ToGeocentric(start, Ellipsoid.Grs80), start, GeocentricConversion.ToGeocentric(moved[0].Geodetic, Ellipsoid.Grs80));
        Assert.Equal(0.2, enu.EastMetres, 1e-4);
        Assert.Equal(0.1, enu.NorthMetres, 1e-4);
        Assert.Equal(0.03, enu.UpMetres, 1e-4);
        Assert.Contains("own velocity", note, StringComparison.Ordinal);
    }

    private static double D(string s) => double.Parse(s, NumberStyles.Float, CultureInfo.InvariantCulture);
}
