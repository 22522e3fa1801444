using System.Diagnostics;
using QaService.Core.Geodesy.Catalog;
using QaService.Core.Geodesy.Projections;

namespace QaService.Core.Tests.Assessment;

/// <summary>CRS codes and names as in the EPSG Geodetic Parameter Dataset (as shipped in PROJ 9.1.1's proj.db: `projinfo EPSG:xxxx`).</summary>
public sealed class CrsCatalogTests(Xunit.Abstractions.ITestOutputHelper output)
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
    // Names as `projinfo EPSG:<code> -o WKT2_2019` (PROJ 9.1.1) prints them.
    [InlineData("EPSG:2227", CrsKind.Projected, "NAD83 / California zone 3 (ftUS)")]
    [InlineData("EPSG:2240", CrsKind.Projected, "NAD83 / Georgia West (ftUS)")]
    [InlineData("EPSG:3035", CrsKind.Projected, "ETRS89-extended / LAEA Europe")]
    [InlineData("EPSG:3034", CrsKind.Projected, "ETRS89-extended / LCC Europe")]
    [InlineData("EPSG:3857", CrsKind.Projected, "WGS 84 / Pseudo-Mercator")]
    [InlineData("EPSG:6350", CrsKind.Projected, "NAD83(2011) / Conus Albers")]
    [InlineData("EPSG:7855", CrsKind.Projected, "GDA2020 / MGA zone 55")]
    [InlineData("EPSG:26931", CrsKind.Projected, "NAD83 / Alaska zone 1")]
    [InlineData("EPSG:3413", CrsKind.Projected, "WGS 84 / NSIDC Sea Ice Polar Stereographic North")]
    [InlineData("EPSG:2955", CrsKind.Projected, "NAD83(CSRS) / UTM zone 11N")]
    [InlineData("EPSG:4269", CrsKind.Geographic, "NAD83")]
    [InlineData("EPSG:6318", CrsKind.Geographic, "NAD83(2011)")]
    [InlineData("EPSG:7789", CrsKind.Geocentric, "ITRF2014")]
    public void Resolves_epsg_names(string text, CrsKind kind, string name)
    {
        var resolution = CrsCatalog.Resolve(text);
        Assert.True(resolution.Succeeded, resolution.Problem);
        Assert.Equal(kind, resolution.Crs!.Kind);
        Assert.Equal(name, resolution.Crs.Name);
    }

    [Theory]
    // UTM families (EPSG code ranges; names as projinfo prints them for the first and last code).
    [InlineData(32601, 32660, "WGS 84 / UTM zone ")]
    [InlineData(32701, 32760, "WGS 84 / UTM zone ")]
    [InlineData(25828, 25837, "ETRS89 / UTM zone ")] // 25838 (zone 38N) is deprecated in EPSG v10.076 and left out
    [InlineData(6330, 6348, "NAD83(2011) / UTM zone ")]
    [InlineData(7846, 7859, "GDA2020 / MGA zone ")]
    [InlineData(28348, 28358, "GDA94 / MGA zone ")]
    public void Every_zone_of_a_family_is_present(int first, int last, string namePrefix)
    {
        for (int code = first; code <= last; code++)
        {
            var crs = CrsCatalog.ByCode(code);
            Assert.NotNull(crs);
            Assert.StartsWith(namePrefix, crs.Name);
            Assert.Equal("Transverse Mercator", crs.Conversion!.MethodName);
        }
    }

    [Fact]
    public void Catalog_counts_per_family()
    {
        // Counts from the generator's selection of EPSG v10.076 (epsg-catalog.tsv header), checked by kind and unit.
        var all = CrsCatalog.All;
        Assert.Equal(5329, all.Count);
        Assert.Equal(570, all.Count(c => c.Kind == CrsKind.Geographic));
        Assert.Equal(150, all.Count(c => c.Kind == CrsKind.Geocentric));
        Assert.Equal(762, all.Count(c => c.Unit == LinearUnit.UsSurveyFoot)); // State Plane and others in US survey feet
        Assert.Equal(142, all.Count(c => c.Unit == LinearUnit.InternationalFoot));
        Assert.Equal(400, all.Select(c => c.Datum.Code).Distinct().Count());
        Assert.True(all.Count(c => c.Name.StartsWith("NAD83(2011) / ", StringComparison.Ordinal)) > 200);
        Assert.All(all.Where(c => c.Kind == CrsKind.Projected), c => Assert.NotNull(c.Projection));
    }

    [Fact]
    public void Datums_carry_epsg_codes_ellipsoids_and_epochs()
    {
        // EPSG dataset (projinfo -k datum EPSG:1165 etc.): ITRF2014 reference epoch 2010.0 on GRS 1980; ETRS89 ensemble; NAD83(2011).
        Assert.Equal("EPSG:6326", CrsCatalog.ByCode(4326)!.Datum.Code);
        var itrf2014 = CrsCatalog.ByCode(7789)!.Datum;
        Assert.Equal("EPSG:1165", itrf2014.Code);
        Assert.Equal(2010.0, itrf2014.FrameReferenceEpochYear);
        Assert.Equal(298.257222101, itrf2014.Ellipsoid.InverseFlattening);
        Assert.Equal("EPSG:6258", CrsCatalog.ByCode(3035)!.Datum.Code);
        Assert.Equal("EPSG:1116", CrsCatalog.ByCode(6350)!.Datum.Code);
        Assert.Equal("EPSG:6269", CrsCatalog.ByCode(2227)!.Datum.Code);
    }

    [Fact]
    public void Parameters_are_in_degrees_and_metres()
    {
        // EPSG:2227 (projinfo): φF 36°30', λF −120°30', φ1 38°26', φ2 37°04' (sexagesimal in EPSG), EF 6 561 666.667 ftUS = 2 000 000.0001016 m.
        var crs = CrsCatalog.ByCode(2227)!;
        var p = crs.Conversion!.Parameters.ToDictionary(x => x.Code, x => x.Value);
        Assert.Equal(36.5, p[ProjectionParameterCodes.LatitudeOfFalseOrigin], 12);
        Assert.Equal(-120.5, p[ProjectionParameterCodes.LongitudeOfFalseOrigin], 12);
        Assert.Equal(38 + (26.0 / 60), p[ProjectionParameterCodes.LatitudeOf1stStandardParallel], 12);
        Assert.Equal(37 + (4.0 / 60), p[ProjectionParameterCodes.LatitudeOf2ndStandardParallel], 12);
        Assert.Equal(2_000_000.0001016, p[ProjectionParameterCodes.EastingAtFalseOrigin], 6);
        Assert.Equal(LinearUnit.UsSurveyFoot, crs.Unit);
        Assert.Equal(["e", "n"], crs.Axes.Select(a => a.Field));
        // EPSG:3035 lists northing (Y) first.
        Assert.Equal(["n", "e"], CrsCatalog.ByCode(3035)!.Axes.Select(a => a.Field));
        Assert.Equal("Europe - LCC & LAEA", CrsCatalog.ByCode(3035)!.AreaOfUse!.Name);
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

    [Fact]
    public void Search_finds_by_code_and_words()
    {
        var byCode = CrsCatalog.Search("EPSG:3263", 0, 10);
        Assert.Contains(byCode.Items, c => c.Identifier == "EPSG:32633");
        var byWords = CrsCatalog.Search("california ftus 2011", 0, 100);
        Assert.Equal(6, byWords.Total); // NAD83(2011) / California zones 1–6 (ftUS)
        Assert.All(byWords.Items, c => Assert.Contains("California", c.Name));
        Assert.Equal(2, CrsCatalog.Search("utm zone 33", 0, 2).Items.Count);
    }

    [Fact]
    public void A_fresh_parse_of_the_embedded_file_gives_the_loaded_catalog()
    {
        // Load time is a benchmark concern, not a unit-test assertion (shared machines make timings noise);
        // the parse time is printed for information only.
        var watch = Stopwatch.StartNew();
        var all = EpsgCatalogFile.Load();
        watch.Stop();
        Assert.Equal(CrsCatalog.All.Count, all.Count);
        Assert.Equal(CrsCatalog.All.Select(c => c.Identifier).Order(), all.Select(c => c.Identifier).Order());
        output.WriteLine($"catalog parse: {all.Count} CRSs in {watch.Elapsed.TotalMilliseconds:F1} ms");
    }

    [Theory]
    [InlineData("EPSG:32600")]
    [InlineData("EPSG:27572")] // NTF (Paris) / Lambert zone II: Paris prime meridian, left out
    [InlineData("EPSG:4807")]
    [InlineData("EPSG:5773")]
    [InlineData("EPSG:999999999")]
    public void Other_codes_are_not_supported_yet(string text)
    {
        var resolution = CrsCatalog.Resolve(text);
        Assert.False(resolution.Succeeded);
        Assert.Contains("not supported yet", resolution.Problem);
    }

    [Theory]
    [InlineData("GEOGCS[\"WGS 84\",DATUM[\"WGS_1984\",SPHEROID[\"WGS 84\",6378137,298.257223563]]", "WKT")]
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
