using QaService.Core.Geodesy.Catalog;

namespace QaService.Core.Tests.Assessment;

/// <summary>CRS codes and names as in the EPSG Geodetic Parameter Dataset (as shipped in PROJ 9.1.1's proj.db: `projinfo EPSG:32633`).</summary>
public sealed class CrsCatalogTests
{
    [Theory]
    [InlineData("EPSG:4326", CrsKind.Geographic, "WGS 84")]
    [InlineData("epsg:4979", CrsKind.Geographic, "WGS 84")]
    [InlineData("EPSG:4978", CrsKind.Geocentric, "WGS 84")]
    [InlineData("EPSG:32601", CrsKind.Projected, "WGS 84 / UTM zone 1N")]
    [InlineData("EPSG:32660", CrsKind.Projected, "WGS 84 / UTM zone 60N")]
    [InlineData("EPSG:32701", CrsKind.Projected, "WGS 84 / UTM zone 1S")]
    [InlineData("EPSG:32760", CrsKind.Projected, "WGS 84 / UTM zone 60S")]
    [InlineData("urn:ogc:def:crs:EPSG::32633", CrsKind.Projected, "WGS 84 / UTM zone 33N")]
    [InlineData("http://www.opengis.net/def/crs/EPSG/0/32633", CrsKind.Projected, "WGS 84 / UTM zone 33N")]
    public void Resolves_the_wgs84_family(string text, CrsKind kind, string name)
    {
        var resolution = CrsCatalog.Resolve(text);
        Assert.True(resolution.Succeeded, resolution.Problem);
        Assert.Equal(kind, resolution.Crs!.Kind);
        Assert.Equal(name, resolution.Crs.Name);
    }

    [Fact]
    public void Utm_zone_parameters_are_those_of_the_epsg_dataset()
    {
        // EPSG:32733 "WGS 84 / UTM zone 33S": CM 15° E, k0 0.9996, FE 500 000 m, FN 10 000 000 m (projinfo EPSG:32733, PROJ 9.1.1).
        var projection = Assert.IsType<QaService.Core.Geodesy.TransverseMercator>(CrsCatalog.ByCode(32733)!.Projection);
        Assert.Equal(15.0, projection.CentralMeridianDegrees);
        Assert.Equal(0.9996, projection.ScaleFactor);
        Assert.Equal(500_000.0, projection.FalseEastingMetres);
        Assert.Equal(10_000_000.0, projection.FalseNorthingMetres);
    }

    [Theory]
    [InlineData("EPSG:32600")]
    [InlineData("EPSG:32661")]
    [InlineData("EPSG:32700")]
    [InlineData("EPSG:32761")]
    [InlineData("EPSG:4269")]
    [InlineData("EPSG:999999999")]
    public void Other_codes_are_not_supported_yet(string text)
    {
        var resolution = CrsCatalog.Resolve(text);
        Assert.False(resolution.Succeeded);
        Assert.Contains("not supported yet", resolution.Problem);
    }

    [Theory]
    [InlineData("GEOGCS[\"WGS 84\",DATUM[\"WGS_1984\",SPHEROID[\"WGS 84\",6378137,298.257223563]]]", "WKT")]
    [InlineData("EPSG:99999999999999999999", "not a CRS identifier")]
    [InlineData("4326", "not a CRS identifier")]
    [InlineData(null, "required")]
    public void Unreadable_text_says_why(string? text, string fragment)
    {
        var resolution = CrsCatalog.Resolve(text);
        Assert.False(resolution.Succeeded);
        Assert.Contains(fragment, resolution.Problem);
    }
}
