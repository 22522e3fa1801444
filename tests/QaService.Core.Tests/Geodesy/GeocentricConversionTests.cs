using QaService.Core.Geodesy;
using Xunit.Abstractions;

namespace QaService.Core.Tests.Geodesy;

/// <summary>
/// Geodetic ↔ geocentric on WGS 84 against PROJ 9.1.1 (tests/reference-data/geocentric-proj.tsv:
/// cs2cs EPSG:4979 → EPSG:4978, 2 380 points, h from −10 km to 100 000 km, including the poles).
/// </summary>
public sealed class GeocentricConversionTests(ITestOutputHelper output)
{
    /// <summary>0.1 mm: PROJ's forward is the same closed form; the file is rounded to 1e-6 m.</summary>
    private const double LengthToleranceMetres = 1e-4;

    /// <summary>1e-10° (≈ 11 µm); the file's 1e-6 m rounding of X, Y, Z is ≤ 1e-11° at the surface.</summary>
    private const double AngleToleranceDegrees = 1e-10;

    private static IEnumerable<(GeodeticCoordinate Geodetic, GeocentricCoordinate Geocentric)> Rows()
        => ReferenceData.Load("geocentric-proj.tsv").Select(r => (
            new GeodeticCoordinate(ReferenceData.D(r[0]), ReferenceData.D(r[1]), ReferenceData.D(r[2])),
            new GeocentricCoordinate(ReferenceData.D(r[3]), ReferenceData.D(r[4]), ReferenceData.D(r[5]))));

    [Fact]
    public void ToGeocentric_MatchesProj()
    {
        double max = 0;
        int count = 0;
        foreach (var (geodetic, expected) in Rows())
        {
            GeocentricCoordinate c = GeocentricConversion.ToGeocentric(geodetic, Ellipsoid.Wgs84);
            double error = Math.Sqrt(Sq(c.XMetres - expected.XMetres) + Sq(c.YMetres - expected.YMetres) + Sq(c.ZMetres - expected.ZMetres));
            max = Math.Max(max, error);
            // Outside source: PROJ 9.1.1 cs2cs EPSG:4979 -> EPSG:4978, geocentric-proj.tsv.
            Assert.True(error < LengthToleranceMetres, $"{geodetic}: {error:E3} m vs PROJ");
            count++;
        }

        Assert.True(count >= 2000);
        output.WriteLine($"geodetic→geocentric vs PROJ 9.1.1: {count} points, max |ΔXYZ| = {max:E3} m");
    }

    [Fact]
    public void ToGeodetic_OfProjEcef_RecoversTheGeneratingLatLonH()
    {
        double maxLat = 0, maxLon = 0, maxH = 0;
        foreach (var (expected, ecef) in Rows())
        {
            GeodeticCoordinate g = GeocentricConversion.ToGeodetic(ecef, Ellipsoid.Wgs84);
            double dLat = Math.Abs(g.LatitudeDegrees - expected.LatitudeDegrees);
            // Longitude is undefined on the polar axis; there compare horizontal position instead (X = Y = 0).
            double dLon = Math.Abs(expected.LatitudeDegrees) == 90
                ? 0
                : Math.Abs(Math.IEEERemainder(g.LongitudeDegrees - expected.LongitudeDegrees, 360.0))
                  * Math.Cos(expected.LatitudeDegrees * Math.PI / 180);
            double dH = Math.Abs(g.EllipsoidalHeightMetres - expected.EllipsoidalHeightMetres);
            maxLat = Math.Max(maxLat, dLat);
            maxLon = Math.Max(maxLon, dLon);
            maxH = Math.Max(maxH, dH);
            // Outside source: the lat/lon/h that PROJ 9.1.1 converted into this ECEF (geocentric-proj.tsv).
            Assert.True(dLat < AngleToleranceDegrees, $"{expected}: Δlat {dLat:E3}°");
            Assert.True(dLon < AngleToleranceDegrees, $"{expected}: Δlon·cosφ {dLon:E3}°");
            Assert.True(dH < LengthToleranceMetres, $"{expected}: Δh {dH:E3} m");
        }

        output.WriteLine($"geocentric→geodetic of PROJ ECEF: max |Δlat| = {maxLat:E3}°, max |Δlon|·cosφ = {maxLon:E3}°, max |Δh| = {maxH:E3} m");
    }

    [Theory]
    [InlineData(-10_000.0)]
    [InlineData(0.0)]
    [InlineData(8_848.0)]
    [InlineData(35_786_000.0)]
    [InlineData(100_000_000.0)]
    public void RoundTrip_IsSubMicrometre_OverTheHeightRange(double heightMetres)
    {
        double max = 0;
        for (double lat = -90; lat <= 90; lat += 0.25)
        {
            var g = new GeodeticCoordinate(lat, 37.5, heightMetres);
            GeocentricCoordinate c = GeocentricConversion.ToGeocentric(g, Ellipsoid.Wgs84);
            GeodeticCoordinate back = GeocentricConversion.ToGeodetic(c, Ellipsoid.Wgs84);
            // Position error of the round trip, metres (arc on the ellipsoid-scale sphere + height).
            double r = Ellipsoid.Wgs84.SemiMajorAxisMetres + Math.Abs(heightMetres);
            double horizontal = r * (back.LatitudeDegrees - lat) * Math.PI / 180;
            double error = double.Hypot(horizontal, back.EllipsoidalHeightMetres - heightMetres);
            max = Math.Max(max, error);
            Assert.True(error < 1e-6 + (2e-16 * r), $"lat {lat}, h {heightMetres}: {error:E3} m");
        }

        output.WriteLine($"h = {heightMetres} m: max round-trip error {max:E3} m");
    }

    [Fact]
    public void SpecialPoints_PolesAxisAndCentre()
    {
        Ellipsoid e = Ellipsoid.Wgs84;

        // On the polar axis: latitude ±90, height = |Z| − b (b from EPSG::7030 parameters).
        GeodeticCoordinate north = GeocentricConversion.ToGeodetic(new GeocentricCoordinate(0, 0, e.SemiMinorAxisMetres + 1000), e);
        Assert.Equal(90.0, north.LatitudeDegrees);
        Assert.Equal(1000.0, north.EllipsoidalHeightMetres, 1e-8); // 1e-8 m ≈ 10 ulp of Z
        GeodeticCoordinate south = GeocentricConversion.ToGeodetic(new GeocentricCoordinate(0, 0, -e.SemiMinorAxisMetres), e);
        Assert.Equal(-90.0, south.LatitudeDegrees);
        Assert.Equal(0.0, south.EllipsoidalHeightMetres, 1e-8);

        // Centre of the Earth: nearest surface points are the poles, at distance b.
        GeodeticCoordinate centre = GeocentricConversion.ToGeodetic(new GeocentricCoordinate(0, 0, 0), e);
        Assert.Equal(90.0, Math.Abs(centre.LatitudeDegrees));
        Assert.Equal(-e.SemiMinorAxisMetres, centre.EllipsoidalHeightMetres, 6);

        // Equator, on the X axis: X = a + h exactly (EPSG GN 7-2 §4.1.1 with φ = λ = 0).
        GeocentricCoordinate x = GeocentricConversion.ToGeocentric(new GeodeticCoordinate(0, 0, 123.0), e);
        Assert.Equal(new GeocentricCoordinate(e.SemiMajorAxisMetres + 123.0, 0, 0), x);
    }

    [Fact]
    public void InvalidInput_Throws()
    {
        Assert.Throws<ArgumentOutOfRangeException>(() => GeocentricConversion.ToGeocentric(new GeodeticCoordinate(90.5, 0, 0), Ellipsoid.Wgs84));
        Assert.Throws<ArgumentOutOfRangeException>(() => GeocentricConversion.ToGeocentric(new GeodeticCoordinate(double.NaN, 0, 0), Ellipsoid.Wgs84));
        Assert.Throws<ArgumentOutOfRangeException>(() => GeocentricConversion.ToGeodetic(new GeocentricCoordinate(double.NaN, 0, 0), Ellipsoid.Wgs84));
        Assert.Throws<ArgumentOutOfRangeException>(() => GeocentricConversion.ToGeodetic(new GeocentricCoordinate(1, 2, 3), default));
    }

    private static double Sq(double x) => x * x;
}
