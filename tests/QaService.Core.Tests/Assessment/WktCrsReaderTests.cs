using System.Globalization;
using System.Text.RegularExpressions;
using QaService.Core.Geodesy.Catalog;
using QaService.Core.Geodesy.Catalog.Wkt;
using QaService.Core.Tests.Geodesy;
using static QaService.Core.Tests.Geodesy.ReferenceData;

namespace QaService.Core.Tests.Assessment;

/// <summary>
/// WKT1 and WKT2 as PROJ 9.1.1 <c>projinfo</c> writes them (tests/reference-data/crs-wkt-projinfo.tsv, made by
/// make-wkt-reference.py), with TOWGS84 values from <c>projinfo -o PROJ</c> and sample points from <c>cs2cs</c>.
/// </summary>
public sealed partial class WktCrsReaderTests
{
    /// <summary>Agreement with cs2cs on the sample points: 1 mm, as the projection reference test (the file rounds to 1e-10 unit).</summary>
    private const double ToleranceMetres = 1e-3;

    private static readonly IReadOnlyList<string[]> Rows = LoadAll();

    public static TheoryData<string, string> Definitions()
    {
        var data = new TheoryData<string, string>();
        foreach (var r in Rows.Where(r => r[0] == "wkt"))
            data.Add(r[1], r[2]);
        return data;
    }

    [Theory]
    [MemberData(nameof(Definitions))]
    public void Projinfo_wkt_resolves_to_the_catalog_code_or_builds_an_equivalent_crs(string code, string format)
    {
        string wkt = Rows.Single(r => r[0] == "wkt" && r[1] == code && r[2] == format)[3];
        int epsg = int.Parse(code, CultureInfo.InvariantCulture);
        var resolution = CrsCatalog.Resolve(wkt);
        Assert.True(resolution.Succeeded, resolution.Problem);
        if (CrsCatalog.ByCode(epsg) is not null)
            Assert.Equal($"EPSG:{code}", resolution.Crs!.Identifier);

        // Without the CRS's own identifier the reader must build the CRS from the definition.
        string anonymous = Regex.Replace(wkt, $@",(AUTHORITY\[""EPSG"",""{code}""\]|ID\[""EPSG"",{code}\])", string.Empty);
        Assert.NotEqual(wkt, anonymous);
        var built = CrsCatalog.Resolve(anonymous);
        Assert.True(built.Succeeded, built.Problem);
        Assert.StartsWith("WKT:", built.Crs!.Identifier);
        Assert.Equal(resolution.Crs!.Kind, built.Crs.Kind);

        foreach (var p in Rows.Where(r => r[0] == "point" && r[1] == code))
        {
            var en = built.Crs.Projection!.Forward(D(p[3]), D(p[2]));
            double unit = built.Crs.Unit.MetresPerUnit;
            double error = double.Hypot(en.EastingMetres - (D(p[4]) * unit), en.NorthingMetres - (D(p[5]) * unit));
            Assert.True(error < ToleranceMetres, $"EPSG:{code} {format} ({p[3]}, {p[2]}): {error:E3} m from cs2cs");
        }

        // TOWGS84 (WKT1) and BOUNDCRS (WKT2_2019) carry the Helmert shift PROJ reports for the CRS.
        var towgs84 = Rows.SingleOrDefault(r => r[0] == "towgs84" && r[1] == code);
        if (towgs84 is not null && format != "WKT2_2015")
        {
            var h = built.Crs.Datum.HelmertToWgs84;
            Assert.NotNull(h);
            double[] expected = towgs84.Skip(2).Select(D).ToArray();
            double[] actual = [h.TranslationXMetres, h.TranslationYMetres, h.TranslationZMetres, h.RotationXArcSeconds, h.RotationYArcSeconds, h.RotationZArcSeconds, h.ScaleDifferencePpm];
            for (int i = 0; i < 7; i++)
                Assert.Equal(expected[i], actual[i], 1e-9);
        }
    }

    [Fact]
    public void Built_crs_keeps_datum_units_and_epsg_datum_codes()
    {
        // projinfo EPSG:2227 -o WKT2_2019: NAD83 / California zone 3 (ftUS), datum EPSG:6269, US survey foot.
        var wkt = Rows.Single(r => r[0] == "wkt" && r[1] == "2227" && r[2] == "WKT2_2015")[3];
        var crs = CrsCatalog.Resolve(wkt.Replace(",ID[\"EPSG\",2227]", string.Empty, StringComparison.Ordinal)).Crs!;
        Assert.Equal("EPSG:6269", crs.Datum.Code);
        Assert.Equal(1200.0 / 3937.0, crs.Unit.MetresPerUnit);
        Assert.Equal("Lambert Conic Conformal (2SP)", crs.Conversion!.MethodName);

        // DHDN is outside the catalog: its datum is named from the WKT and keeps the Bessel 1841 ellipsoid (projinfo EPSG:4314).
        var dhdn = CrsCatalog.Resolve(Rows.Single(r => r[0] == "wkt" && r[1] == "4314" && r[2] == "WKT1_GDAL")[3]).Crs!;
        Assert.Equal(6377397.155, dhdn.Ellipsoid.SemiMajorAxisMetres);
        Assert.Equal(299.1528128, dhdn.Ellipsoid.InverseFlattening);
    }

    [Theory]
    [InlineData("PROJCS[\"x\",GEOGCS[\"g\",DATUM[\"d\",SPHEROID[\"s\",6378137,298.257223563]],PRIMEM[\"Greenwich\",0],UNIT[\"degree\",0.0174532925199433]],PROJECTION[\"Cassini_Soldner\"],PARAMETER[\"latitude_of_origin\",0],UNIT[\"metre\",1]]", "parameter EPSG:8802 is required")]
    [InlineData("PROJCS[\"x\",GEOGCS[\"g\",DATUM[\"d\",SPHEROID[\"s\",6377397.155,299.1528128]],PRIMEM[\"Greenwich\",0],UNIT[\"degree\",0.0174532925199433]],PROJECTION[\"Krovak\"],PARAMETER[\"latitude_of_center\",49.5],UNIT[\"metre\",1]]", "\"Krovak\" (EPSG:9819 Krovak) is not supported: not implemented yet")]
    [InlineData("PROJCS[\"x\",GEOGCS[\"g\",DATUM[\"d\",SPHEROID[\"s\",6378137,298.257223563]],PRIMEM[\"Greenwich\",0],UNIT[\"degree\",0.0174532925199433]],PROJECTION[\"Polar_Stereographic_variant_C\"],UNIT[\"metre\",1]]", "PROJ 9.1.1 does not implement it either")]
    [InlineData("PROJCS[\"x\",GEOGCS[\"g\",DATUM[\"d\",SPHEROID[\"s\",6378137,298.257223563]],PRIMEM[\"Greenwich\",0],UNIT[\"degree\",0.0174532925199433]],PROJECTION[\"Van_der_Grinten_Z\"],UNIT[\"metre\",1]]", "\"Van_der_Grinten_Z\" is not one the service knows")]
    [InlineData("PROJCS[\"x\",GEOGCS[\"g\",DATUM[\"d\",SPHEROID[\"s\",6378137,298.257223563]],PRIMEM[\"Greenwich\",0],UNIT[\"degree\",0.0174532925199433]],PROJECTION[\"Cassini_Soldner\"],PARAMETER[\"latitude_of_origin\",0],PARAMETER[\"central_meridian\",0],UNIT[\"metre\",1],AXIS[\"Y\",WEST],AXIS[\"X\",SOUTH]]", "Cassini-Soldner counts east and north")]
    [InlineData("COMPD_CS[\"x\",GEOGCS[\"g\",DATUM[\"d\",SPHEROID[\"s\",6378137,298.257223563]]],VERT_CS[\"v\"]]", "not supported yet")]
    [InlineData("GEOGCS[\"g\",DATUM[\"d\",SPHEROID[\"s\",6378137,298.257223563]],PRIMEM[\"Paris\",2.33722917]]", "not supported yet")]
    [InlineData("GEOGCS[\"g\",DATUM[\"d\",SPHEROID[\"s\",6378137,298.257223563]]", "not closed")]
    [InlineData("GEOGCS[\"g\",DATUM[\"d\",SPHEROID[\"s\",6378137,298.257223563]]]]", "unexpected text")]
    [InlineData("GEOGCS[\"g\",DATUM[\"d\"]]", "ELLIPSOID")]
    public void Unsupported_or_malformed_wkt_says_why(string wkt, string fragment)
    {
        var resolution = CrsCatalog.Resolve(wkt);
        Assert.False(resolution.Succeeded);
        Assert.Contains(fragment, resolution.Problem);
    }

    private static IReadOnlyList<string[]> LoadAll()
    {
        string path = ReferenceFiles.PathOf("crs-wkt-projinfo.tsv");
        return File.ReadLines(path).Where(l => l.Length > 0 && !l.StartsWith('#')).Skip(1).Select(l => l.Split('\t')).ToList();
    }
}
