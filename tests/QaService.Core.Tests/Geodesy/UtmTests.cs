using QaService.Core.Geodesy;

namespace QaService.Core.Tests.Geodesy;

public sealed class UtmTests
{
    [Theory]
    // Outside source: zone = floor((λ + 180)/6) + 1, 180° ≡ −180° (GeographicLib UTMUPS::StandardZone; 
    // cross-checked with GeoConvert 2.1.2: `echo "0 180" | GeoConvert -u` → 01n, `echo "0 179.999" | GeoConvert -u` → 60n).
    [InlineData(-180.0, 1)]
    [InlineData(-174.000001, 1)]
    [InlineData(-174.0, 2)]
    [InlineData(-0.000001, 30)]
    [InlineData(0.0, 31)]
    [InlineData(179.999, 60)]
    [InlineData(180.0, 1)]
    [InlineData(540.0, 1)]
    [InlineData(-186.0, 60)]
    public void ZoneForLongitude_Edges(double lon, int zone) => Assert.Equal(zone, Utm.ZoneForLongitude(lon));

    [Fact]
    public void Zone_IsCached_AndHasUtmParameters()
    {
        Assert.Same(Utm.Zone(33, false), Utm.Zone(33, false));
        TransverseMercator south = Utm.Zone(33, true);
        // Outside source: EPSG conversion 16133 "UTM zone 33S": λ0 = 15°E, k0 = 0.9996, FE = 500000, FN = 10000000.
        Assert.Equal(15.0, south.CentralMeridianDegrees);
        Assert.Equal(0.9996, south.ScaleFactor);
        Assert.Equal(500000.0, south.FalseEastingMetres);
        Assert.Equal(10000000.0, south.FalseNorthingMetres);
        Assert.Equal(-177.0, Utm.Zone(1, false).CentralMeridianDegrees);
        Assert.Equal(177.0, Utm.Zone(60, false).CentralMeridianDegrees);
    }

    [Fact]
    public void InvalidZoneOrLongitude_Throws()
    {
        Assert.Throws<ArgumentOutOfRangeException>(() => Utm.Zone(0, false));
        Assert.Throws<ArgumentOutOfRangeException>(() => Utm.Zone(61, true));
        Assert.Throws<ArgumentOutOfRangeException>(() => Utm.ZoneForLongitude(double.NaN));
    }
}
