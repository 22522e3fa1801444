using QaService.Core.Assessment;
using QaService.Core.Diagnosis;
using QaService.Core.Geodesy;
using QaService.Core.Geodesy.Catalog;
using QaService.Core.Reporting;
using QaService.Core.Statistics;

namespace QaService.Core.Tests.Diagnosis;

/// <summary>
/// The diagnoses added for signing: each is given data carrying its blunder's signature (it must fire) and clean data
/// (it must stay quiet). Signatures come from outside tools where they are geodetic (PROJ 9.1.1, GeographicLib 2.1.2).
/// </summary>
public sealed class DiagnosisSignatureTests
{
    /// <summary>Marks on a grid round (lat0, lon0); fixes = mark + residual (east/north metres) in the fixes' frame.</summary>
    private static CheckContext Build(double lat0, double lon0, IReadOnlyList<(double DE, double DN, double? DU)> residuals,
        int marksEpsg = 4979, int fixesEpsg = 4979, double? epoch = null, RequiredAccuracy? spec = null,
        Func<GeodeticCoordinate, GeodeticCoordinate>? fixOverride = null)
    {
        var side = (int)Math.Ceiling(Math.Sqrt(residuals.Count));
        var marks = residuals.Select((_, i) => new FramedPoint(i, $"M{i:00}", null,
            new GeodeticCoordinate(lat0 + (i / side) * 0.002, lon0 + (i % side) * 0.003, 200.0), true, null, null, null)).ToList();
        var fixes = new List<FramedPoint>();
        var rows = new List<Residual>();
        for (var i = 0; i < residuals.Count; i++)
        {
            var (de, dn, du) = residuals[i];
            var m = marks[i].Geodetic;
            var shifted = Offset(m, de, dn, du ?? 0);
            var fix = fixOverride?.Invoke(shifted) ?? shifted;
            fixes.Add(new FramedPoint(i, $"F{i:00}", marks[i].Id, fix, true, null, null, null));
            var (re, rn) = EastNorth(m, fix);
            rows.Add(new Residual(marks[i].Id, $"F{i:00}", re, rn, du, Math.Sqrt(re * re + rn * rn), MarkPairing.ById, null, m.LatitudeDegrees, m.LongitudeDegrees));
        }
        var marksFrame = new PointSetFrame(CrsCatalog.ByCode(marksEpsg)!, HeightReference.Ellipsoidal, null, null, true);
        var fixesFrame = new PointSetFrame(CrsCatalog.ByCode(fixesEpsg)!, HeightReference.Ellipsoidal, null, epoch, true);
        var input = new ValidatedAssessment("signature", marksFrame, fixesFrame, marks, fixes, spec, null, new Dictionary<string, string>());
        var horizontal = HorizontalAccuracy.Compute(rows.Select(r => r.DE).ToArray(), rows.Select(r => r.DN).ToArray());
        var up = rows.Where(r => r.DU is not null).Select(r => r.DU!.Value).ToArray();
        return new CheckContext(input, rows, horizontal, up.Length == 0 ? null : VerticalAccuracy.Compute(up));
    }

    private static GeodeticCoordinate Offset(GeodeticCoordinate g, double east, double north, double up)
    {
        const double MetresPerDegree = 111_320.0; // first guess; refined below so the ENU residual is exact to 1e-6 m
        var guess = g with { LatitudeDegrees = g.LatitudeDegrees + north / MetresPerDegree, LongitudeDegrees = g.LongitudeDegrees + east / (MetresPerDegree * Math.Cos(g.LatitudeDegrees * Math.PI / 180)), EllipsoidalHeightMetres = g.EllipsoidalHeightMetres + up };
        for (var k = 0; k < 3; k++)
        {
            var (e, n) = EastNorth(g, guess);
            guess = guess with { LatitudeDegrees = guess.LatitudeDegrees + (north - n) / MetresPerDegree, LongitudeDegrees = guess.LongitudeDegrees + (east - e) / (MetresPerDegree * Math.Cos(g.LatitudeDegrees * Math.PI / 180)) };
        }
        return guess;
    }

    private static (double E, double N) EastNorth(GeodeticCoordinate from, GeodeticCoordinate to)
    {
        var origin = GeocentricConversion.ToGeocentric(from, Ellipsoid.Wgs84);
        var enu = LocalTangentPlane.Difference(origin, from, GeocentricConversion.ToGeocentric(to with { EllipsoidalHeightMetres = from.EllipsoidalHeightMetres }, Ellipsoid.Wgs84));
        return (enu.EastMetres, enu.NorthMetres);
    }

    private static List<(double DE, double DN, double? DU)> Shifted(List<(double DE, double DN, double? DU)> data, double e, double n, double u = 0) =>
        data.Select(r => (r.DE + e, r.DN + n, r.DU + u)).ToList();

    [Fact]
    public void Bias_fires_on_a_one_metre_offset_and_fails_when_it_uses_up_the_spec()
    {
        var data = Shifted(CheckContexts.Quantiles(24, 0.05), 0.6, -0.8);
        var warn = new BiasCheck().Evaluate(CheckContexts.From(data));
        Assert.Equal(CheckStatus.Warn, warn.Status);
        Assert.Contains("horizontal offset 1.000 m towards 143°", warn.Message);
        var fail = new BiasCheck().Evaluate(CheckContexts.From(data, new RequiredAccuracy("nssda", 1.5, null)));
        Assert.Equal(CheckStatus.Fail, fail.Status);
    }

    [Fact]
    public void Bias_threshold_is_the_F_quantile_of_Hotellings_test()
    {
        // F(0.95; 2, 22) = 3.44336 (scipy 1.10 stats.f.ppf; NIST/SEMATECH e-Handbook §1.3.6.7.3 table 3.443).
        var result = new BiasCheck().Evaluate(CheckContexts.From(CheckContexts.Normal(24, 0.05, 4)));
        Assert.Equal(3.44336, result.Threshold!.Value, 4);
    }

    [Fact]
    public void Hotelling_T2_matches_scipy()
    {
        // numpy 1.24 / scipy 1.10: T² = 519.37805, F = 222.59059, p = 2.3518e-06 for these eight residuals.
        double[] e = [0.31, 0.12, 0.25, 0.40, 0.18, 0.22, 0.35, 0.28], n = [-0.05, 0.10, 0.02, -0.08, 0.06, 0.01, -0.03, 0.04];
        var result = HotellingTest.AgainstZero(e, n, 0.05)!;
        Assert.Equal(519.37805, result.TSquared, 4);
        Assert.Equal(222.59059, result.F, 4);
        Assert.Equal(2.3518e-06, result.PValue, 9);
        Assert.True(result.Significant);
    }

    [Fact]
    public void Datum_mismatch_names_itrf2014_labelled_as_nad83_2011()
    {
        // Signature: PROJ 9.1.1 `cs2cs EPSG:6319 EPSG:7912` at 39 N 105 W, 1600 m, epoch 2026.4, then GeographicLib 2.1.2
        // CartConvert -l: ITRF2014 − NAD83(2011) = dE −1.3380 m, dN +0.5050 m. Marks in NAD83(2011), fixes declared the same.
        var data = Shifted(CheckContexts.Quantiles(24, 0.03), -1.3380, 0.5050);
        var result = new DatumMismatchCheck().Evaluate(Build(39.0, -105.0, data, marksEpsg: 6319, fixesEpsg: 6319, epoch: 2026.4));
        Assert.Equal(CheckStatus.Warn, result.Status);
        Assert.Contains("fixes in International Terrestrial Reference Frame 2014 labelled as NAD83 (National Spatial Reference System 2011)", result.Message);
        Assert.True(result.Measured < 0.05, result.Message);
    }

    [Fact]
    public void Datum_mismatch_is_quiet_without_an_offset() =>
        Assert.Equal(CheckStatus.Pass, new DatumMismatchCheck().Evaluate(Build(39.0, -105.0, CheckContexts.Quantiles(24, 0.03), 6319, 6319, 2026.4)).Status);

    [Fact]
    public void Height_reference_names_the_local_geoid_undulation_for_orthometric_marks_declared_ellipsoidal()
    {
        // Marks hold H but are declared ellipsoidal: dU = h_fix − H_mark = +N. N at 48.75 N 15 E = 46.6365 m
        // (PROJ 9.1.1 `cct +proj=vgridshift +grids=egm96_15.gtx`); the marks span 0.01°, N varies by centimetres there.
        var data = Shifted(CheckContexts.Quantiles(20, 0.03), 0, 0, 46.6365);
        var result = new HeightReferenceCheck().Evaluate(CheckContexts.From(data));
        Assert.Equal(CheckStatus.Fail, result.Status);
        Assert.Equal(46.6365, result.Threshold!.Value, 1);
        Assert.Equal(46.6365, result.Measured!.Value, 1);
        Assert.Contains("marks declared \"ellipsoidal\" but holding H", result.Message);
    }

    [Fact]
    public void Height_reference_reads_the_opposite_sign_as_orthometric_fixes()
    {
        var result = new HeightReferenceCheck().Evaluate(CheckContexts.From(Shifted(CheckContexts.Quantiles(20, 0.03), 0, 0, -46.6)));
        Assert.Equal(CheckStatus.Fail, result.Status);
        Assert.Contains("fixes declared \"ellipsoidal\" but holding H", result.Message);
    }

    [Fact]
    public void Height_reference_is_quiet_on_clean_heights() =>
        Assert.Equal(CheckStatus.Pass, new HeightReferenceCheck().Evaluate(CheckContexts.From(CheckContexts.Quantiles(20, 0.03))).Status);

    [Fact]
    public void Units_spots_us_survey_feet_read_as_international_feet()
    {
        // Residual = 1.999996e-6 × grid coordinates (0.3048·3937/1200 − 1, check-values §6) in UTM 33N (EPSG:32633).
        var utm = CrsCatalog.ByCode(32633)!.Projection!;
        var clean = CheckContexts.Quantiles(25, 0.002);
        var side = 5;
        var data = clean.Select((r, i) =>
        {
            var grid = utm.Forward(48.75 + (i / side) * 0.002, 15.0 + (i % side) * 0.003);
            return (r.DE + UnitsCheck.SurveyFootScale * grid.EastingMetres, r.DN + UnitsCheck.SurveyFootScale * grid.NorthingMetres, r.DU);
        }).ToList();
        var result = new UnitsCheck().Evaluate(Build(48.75, 15.0, data, fixesEpsg: 32633));
        Assert.Equal(CheckStatus.Fail, result.Status);
        Assert.Contains("US survey feet", result.Message);
        Assert.Equal(UnitsCheck.SurveyFootScale, result.Measured!.Value, 7);
    }

    [Fact]
    public void Units_spots_swapped_latitude_and_longitude()
    {
        var result = new UnitsCheck().Evaluate(Build(48.75, 15.0, CheckContexts.Quantiles(20, 0.5),
            fixOverride: g => g with { LatitudeDegrees = g.LongitudeDegrees, LongitudeDegrees = g.LatitudeDegrees }));
        Assert.Equal(CheckStatus.Fail, result.Status);
        Assert.Contains("swapped", result.Message);
    }

    [Fact]
    public void Units_spots_a_neighbouring_utm_zone()
    {
        // Fixes given in zone 32 grid values but declared zone 33 (EPSG:32633): re-read them in zone 32.
        var zone33 = Utm.Zone(33, false);
        var zone32 = Utm.Zone(32, false);
        var result = new UnitsCheck().Evaluate(Build(48.75, 15.0, CheckContexts.Quantiles(20, 0.5), fixesEpsg: 32633,
            fixOverride: g =>
            {
                var grid = zone32.Forward(g.LatitudeDegrees, g.LongitudeDegrees);
                var (lat, lon) = zone33.Inverse(grid.EastingMetres, grid.NorthingMetres);
                return g with { LatitudeDegrees = lat, LongitudeDegrees = lon };
            }));
        Assert.Equal(CheckStatus.Fail, result.Status);
        Assert.Contains("UTM zone 32, not 33", result.Message);
    }

    [Fact]
    public void Units_is_quiet_on_clean_data() =>
        Assert.Equal(CheckStatus.Pass, new UnitsCheck().Evaluate(Build(48.75, 15.0, CheckContexts.Quantiles(25, 0.02), fixesEpsg: 32633)).Status);
}
