using QaService.Core.Geodesy;

namespace QaService.Core.Tests.Geodesy;

/// <summary>ENU differences (EPSG method 9836, EPSG Guidance Note 7-2 §4.1.2).</summary>
public sealed class LocalTangentPlaneTests
{
    public static TheoryData<double, double, double> Marks => new()
    {
        { 0.0, 0.0, 0.0 },
        { 51.4778, -0.0015, 45.0 },        // Greenwich
        { -33.8568, 151.2153, 20.0 },      // Sydney
        { 64.1466, -21.9426, 60.0 },       // Reykjavík
        { 78.2232, 15.6267, 10.0 },        // Longyearbyen, high latitude
        { -89.99, 139.27, 2835.0 },        // near the South Pole
        { 90.0, 0.0, 0.0 },                // the pole itself
    };

    [Theory]
    [MemberData(nameof(Marks))]
    public void DesignedEnuResidual_IsRecovered_ToANanometre(double lat, double lon, double h)
    {
        var designed = new EnuVector(0.123, -0.456, 0.789);
        var markGeodetic = new GeodeticCoordinate(lat, lon, h);
        GeocentricCoordinate mark = GeocentricConversion.ToGeocentric(markGeodetic, Ellipsoid.Wgs84);

        // Inverse rotation ENU → ECEF written out independently here (transpose of EPSG GN 7-2 §4.1.2 matrix).
        double p = lat * Math.PI / 180, l = lon * Math.PI / 180;
        double dx = (-Math.Sin(l) * designed.EastMetres) - (Math.Sin(p) * Math.Cos(l) * designed.NorthMetres) + (Math.Cos(p) * Math.Cos(l) * designed.UpMetres);
        double dy = (Math.Cos(l) * designed.EastMetres) - (Math.Sin(p) * Math.Sin(l) * designed.NorthMetres) + (Math.Cos(p) * Math.Sin(l) * designed.UpMetres);
        double dz = (Math.Cos(p) * designed.NorthMetres) + (Math.Sin(p) * designed.UpMetres);
        var target = new GeocentricCoordinate(mark.XMetres + dx, mark.YMetres + dy, mark.ZMetres + dz);

        EnuVector recovered = LocalTangentPlane.Difference(mark, markGeodetic, target);

        // 1e-9 m: the only loss is the rounding of target = mark + Δ (ulp of 6.4e6 m ≈ 9.3e-10 m).
        Assert.Equal(designed.EastMetres, recovered.EastMetres, 1e-9);
        Assert.Equal(designed.NorthMetres, recovered.NorthMetres, 1e-9);
        Assert.Equal(designed.UpMetres, recovered.UpMetres, 1e-9);
    }

    [Fact]
    public void AtLatZeroLonZero_EastIsY_NorthIsZ_UpIsX()
    {
        // Textbook property (EPSG GN 7-2 §4.1.2 matrix with φ = λ = 0): e = ΔY, n = ΔZ, u = ΔX.
        var origin = new GeocentricCoordinate(6378137, 0, 0);
        var o = new GeodeticCoordinate(0, 0, 0);
        Assert.Equal(new EnuVector(1, 0, 0), LocalTangentPlane.Difference(origin, o, origin with { YMetres = 1 }));
        Assert.Equal(new EnuVector(0, 1, 0), LocalTangentPlane.Difference(origin, o, origin with { ZMetres = 1 }));
        Assert.Equal(new EnuVector(0, 0, 1), LocalTangentPlane.Difference(origin, o, origin with { XMetres = 6378138 }));
    }

    [Fact]
    public void AtTheNorthPole_UpIsZ_AndNorthPointsAwayFromTheMeridian()
    {
        // At φ = 90°, λ = 0: up = +Z, east = +Y, north = −X (EPSG GN 7-2 §4.1.2 matrix).
        var o = new GeodeticCoordinate(90, 0, 0);
        GeocentricCoordinate origin = GeocentricConversion.ToGeocentric(o, Ellipsoid.Wgs84);
        EnuVector v = LocalTangentPlane.Difference(origin, o, new GeocentricCoordinate(origin.XMetres - 2, origin.YMetres + 3, origin.ZMetres + 5));
        Assert.Equal(new EnuVector(3, 2, 5), v);
    }
}
