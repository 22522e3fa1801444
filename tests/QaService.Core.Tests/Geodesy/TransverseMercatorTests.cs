using QaService.Core.Geodesy;

namespace QaService.Core.Tests.Geodesy;

public sealed class TransverseMercatorTests
{
    /// <summary>Airy 1830 (EPSG::7001).</summary>
    private static readonly Ellipsoid Airy1830 = new("Airy 1830", 6377563.396, 299.3249646);

    /// <summary>OSGB 1936 / British National Grid (EPSG conversion 19916): non-zero latitude of origin and false northing.</summary>
    private static readonly TransverseMercator BritishNationalGrid = new(Airy1830, -2, 0.9996012717, 400000, -100000, 49);

    [Fact]
    public void NonZeroLatitudeOfOrigin_MatchesProjAndEpsgGuidanceNoteExample()
    {
        ProjectedCoordinate en = BritishNationalGrid.Forward(50.5, 0.5);

        // Outside source: PROJ 9.1.1, `echo "0.5 50.5" | cs2cs -f %.6f +proj=longlat +ellps=airy +to +proj=tmerc
        // +lat_0=49 +lon_0=-2 +k=0.9996012717 +x_0=400000 +y_0=-100000 +ellps=airy` → 577274.983814 69740.492267.
        Assert.Equal(577274.983814, en.EastingMetres, 1e-4);
        Assert.Equal(69740.492267, en.NorthingMetres, 1e-4);

        // Outside source: EPSG Guidance Note 7-2, Transverse Mercator (method 9807) worked example, 4th-order JHS
        // formulas with intermediate values printed to ~1e-10 rad, result given to the cm: E = 577 274.99 m,
        // N = 69 740.50 m (also in the EPSG dataset's method 9807 example text). Agreement to 1 cm is all that
        // rounding allows; PROJ above pins the sub-mm value.
        Assert.Equal(577274.99, en.EastingMetres, 0.01);
        Assert.Equal(69740.50, en.NorthingMetres, 0.01);

        (double lat, double lon) = BritishNationalGrid.Inverse(en.EastingMetres, en.NorthingMetres);
        Assert.Equal(50.5, lat, 1e-11);
        Assert.Equal(0.5, lon, 1e-11);

        // The natural origin maps to (FE, FN).
        ProjectedCoordinate origin = BritishNationalGrid.Forward(49, -2);
        Assert.Equal(400000.0, origin.EastingMetres, 1e-9);
        Assert.Equal(-100000.0, origin.NorthingMetres, 1e-9);
    }

    [Fact]
    public void Poles_AndSymmetry()
    {
        var tm = new TransverseMercator(Ellipsoid.Wgs84, 0, 1, 0, 0);
        ProjectedCoordinate pole = tm.Forward(90, 33);
        // Outside source: WGS 84 quarter meridian from GeographicLib 2.1.2, `echo 90 0 | TransverseMercatorProj -k 1 -p 6` → 10001965.729313.
        Assert.Equal(0.0, pole.EastingMetres);
        Assert.Equal(10001965.729313, pole.NorthingMetres, 1e-6);
        Assert.Equal(90.0, tm.Inverse(0, 10001965.729313).LatitudeDegrees, 1e-9);

        ProjectedCoordinate a = tm.Forward(37.1, 5.3), b = tm.Forward(-37.1, -5.3);
        Assert.Equal(a.EastingMetres, -b.EastingMetres);
        Assert.Equal(a.NorthingMetres, -b.NorthingMetres);
    }

    [Fact]
    public void Inverse_ReturnsLongitudeInMinus180To180_AcrossTheAntimeridian()
    {
        // Zone 60 (λ0 = 177°E): a point 10° east of the CM is at 187°E ≡ 173°W.
        TransverseMercator zone60 = Utm.Zone(60, false);
        ProjectedCoordinate en = zone60.Forward(20, -173);
        (double lat, double lon) = zone60.Inverse(en.EastingMetres, en.NorthingMetres);
        Assert.Equal(20.0, lat, 1e-12);
        Assert.Equal(-173.0, lon, 1e-12);
    }

    [Fact]
    public void BatchForward_DoesNotAllocate()
    {
        TransverseMercator tm = Utm.Zone(31, false);
        double[] lat = [10, 20, 30, 40], lon = [1, 2, 3, 4], e = new double[4], n = new double[4];
        tm.Forward(lat, lon, e, n); // warm up (JIT)
        long before = GC.GetAllocatedBytesForCurrentThread();
        for (int i = 0; i < 100; i++)
        {
            tm.Forward(lat, lon, e, n);
        }

        Assert.Equal(0, GC.GetAllocatedBytesForCurrentThread() - before);
    }

    [Fact]
    public void InvalidInput_Throws()
    {
        TransverseMercator tm = Utm.Zone(31, false);
        Assert.Throws<ArgumentOutOfRangeException>(() => tm.Forward(91, 3));
        Assert.Throws<ArgumentOutOfRangeException>(() => tm.Forward(double.NaN, 3));
        Assert.Throws<ArgumentOutOfRangeException>(() => tm.Forward(10, double.PositiveInfinity));
        Assert.Throws<ArgumentOutOfRangeException>(() => tm.Forward(10, 93)); // 90° from the CM (3°E)
        Assert.Throws<ArgumentOutOfRangeException>(() => tm.Inverse(double.NaN, 0));
        Assert.Throws<ArgumentOutOfRangeException>(() => tm.Inverse(1e12, 0));
        Assert.Throws<ArgumentOutOfRangeException>(() => new TransverseMercator(Ellipsoid.Wgs84, 0, 0, 0, 0));
        Assert.Throws<ArgumentException>(() => tm.Forward(new double[2], new double[1], new double[2], new double[2]));
    }
}
