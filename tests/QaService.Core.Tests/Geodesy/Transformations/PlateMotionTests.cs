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

    /// <summary>Fresh random points, plates and epochs through the cct on PATH (skips, saying so, without proj-bin).</summary>
    [Fact]
    public void RandomPlatesAndEpochs_AgreeWithInstalledCct()
    {
        var cct = (Environment.GetEnvironmentVariable("PATH") ?? "").Split(':').Select(d => Path.Combine(d, "cct")).FirstOrDefault(File.Exists);
        if (cct is null)
            return;
        var seed = Environment.TickCount;
        var rng = new Random(seed);
        var crs = CrsCatalog.Resolve("EPSG:7912").Crs!;
        foreach (var model in PlateMotionModel.All)
        {
            foreach (var name in model.Plates)
            {
                var plate = model.Plate(name)!;
                var (lat, lon, t0, t1) = ((rng.NextDouble() * 160) - 80, (rng.NextDouble() * 360) - 180, 1995 + (rng.NextDouble() * 30), 1995 + (rng.NextDouble() * 30));
                var pipeline = string.Create(CultureInfo.InvariantCulture,
                    $"+proj=pipeline +step +proj=axisswap +order=2,1 +step +proj=unitconvert +xy_in=deg +xy_out=rad +step +proj=cart +ellps=GRS80 +step +proj=helmert +drx={plate.RxArcSecondsPerYear:R} +dry={plate.RyArcSecondsPerYear:R} +drz={plate.RzArcSecondsPerYear:R} +t_epoch={t0:R} +convention=position_vector +step +inv +proj=cart +ellps=GRS80 +step +proj=unitconvert +xy_in=rad +xy_out=deg +step +proj=axisswap +order=2,1");
                var info = new System.Diagnostics.ProcessStartInfo(cct) { RedirectStandardInput = true, RedirectStandardOutput = true, UseShellExecute = false };
                info.ArgumentList.Add("-d");
                info.ArgumentList.Add("12");
                foreach (var a in pipeline.Split(' '))
                    info.ArgumentList.Add(a);
                using var process = System.Diagnostics.Process.Start(info)!;
                process.StandardInput.WriteLine(string.Create(CultureInfo.InvariantCulture, $"{lat:R} {lon:R} 100 {t1:R}"));
                process.StandardInput.Close();
                var f = process.StandardOutput.ReadToEnd().Split((char[])[' ', '\t', '\n'], StringSplitOptions.RemoveEmptyEntries);
                process.WaitForExit();
                var frame = new PointSetFrame(crs, HeightReference.Ellipsoidal, null, t0, true) { PlateMotion = (model, plate) };
                var mark = new FramedPoint(0, "m", null, new GeodeticCoordinate(lat, lon, 100), true, null, null, null);
                var moved = EpochPropagation.CarryMarks([mark], frame, t0, t1).Marks[0].Geodetic;
                var a1 = GeocentricConversion.ToGeocentric(moved, Ellipsoid.Grs80);
                var b1 = GeocentricConversion.ToGeocentric(new GeodeticCoordinate(D(f[0]), D(f[1]), D(f[2])), Ellipsoid.Grs80);
                var error = Math.Sqrt(Math.Pow(a1.XMetres - b1.XMetres, 2) + Math.Pow(a1.YMetres - b1.YMetres, 2) + Math.Pow(a1.ZMetres - b1.ZMetres, 2));
                Assert.True(error <= ToleranceMetres, $"{model.Id} {name} ({lat}, {lon}) {t0}→{t1}: {error:E2} m, seed {seed}");
            }
        }
    }

    private static double D(string s) => double.Parse(s, NumberStyles.Float, CultureInfo.InvariantCulture);
}
