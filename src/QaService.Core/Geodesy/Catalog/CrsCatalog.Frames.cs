using System.Globalization;

namespace QaService.Core.Geodesy.Catalog;

/// <summary>
/// The frames the datum engine routes between, as geographic 2D/3D and geocentric CRSs of the EPSG dataset
/// (codes and names checked against proj.db of PROJ 9.1.1, EPSG v10.076), plus NAD83(2011) / UTM zones 1–19N
/// (EPSG:6330–6348, method 9807, k0 = 0.9996, FE 500 000 m, on GRS 1980). A stop-gap until the generated
/// catalog lands; the datum codes are those the transformation table uses.
/// </summary>
public static partial class CrsCatalog
{
    /// <summary>EPSG:1165 ITRF2014, reference epoch 2010.0.</summary>
    internal static GeodeticDatum Itrf2014 { get; } = new("EPSG:1165", "International Terrestrial Reference Frame 2014", Ellipsoid.Grs80, 2010.0);

    private static readonly (int Geocentric, int Geographic3D, int Geographic2D, GeodeticDatum Datum, string Name)[] Frames =
    [
        (5332, 7911, 0, new("EPSG:1061", "International Terrestrial Reference Frame 2008", Ellipsoid.Grs80, 2005.0), "ITRF2008"),
        (7789, 7912, 0, Itrf2014, "ITRF2014"),
        (9988, 9989, 9990, new("EPSG:1322", "International Terrestrial Reference Frame 2020", Ellipsoid.Grs80, 2015.0), "ITRF2020"),
        (7930, 7931, 9067, new("EPSG:1186", "European Terrestrial Reference Frame 2000", Ellipsoid.Grs80), "ETRF2000"),
        (4936, 4937, 4258, new("EPSG:6258", "European Terrestrial Reference System 1989 ensemble", Ellipsoid.Grs80), "ETRS89"),
        (6317, 6319, 6318, new("EPSG:1116", "NAD83 (National Spatial Reference System 2011)", Ellipsoid.Grs80), "NAD83(2011)"),
        (7842, 7843, 7844, new("EPSG:1168", "Geocentric Datum of Australia 2020", Ellipsoid.Grs80), "GDA2020"),
    ];

    private const int Nad83v2011UtmFirstCode = 6330, Nad83v2011UtmFirstZone = 1, Nad83v2011UtmLastZone = 19;

    private static CoordinateReferenceSystem? FrameByCode(int epsgCode)
    {
        foreach (var (geocentric, geographic3D, geographic2D, datum, name) in Frames)
        {
            if (epsgCode == geocentric)
                return new($"EPSG:{epsgCode}", name, CrsKind.Geocentric, datum, LinearUnit.Metre, null, HasHeightAxis: true);
            if (epsgCode == geographic3D)
                return new($"EPSG:{epsgCode}", name, CrsKind.Geographic, datum, LinearUnit.Metre, null, HasHeightAxis: true);
            if (epsgCode == geographic2D)
                return new($"EPSG:{epsgCode}", name, CrsKind.Geographic, datum, LinearUnit.Metre, null, HasHeightAxis: false);
        }
        var zone = epsgCode - Nad83v2011UtmFirstCode + Nad83v2011UtmFirstZone;
        if (zone < Nad83v2011UtmFirstZone || zone > Nad83v2011UtmLastZone)
            return null;
        var nad83 = Frames.Single(f => f.Name == "NAD83(2011)").Datum;
        var projection = new TransverseMercator(Ellipsoid.Grs80, -183.0 + Utm.ZoneWidthDegrees * zone, Utm.ScaleFactor, Utm.FalseEastingMetres, 0.0);
        return new($"EPSG:{epsgCode}", string.Create(CultureInfo.InvariantCulture, $"NAD83(2011) / UTM zone {zone}N"), CrsKind.Projected,
            nad83, LinearUnit.Metre, projection, HasHeightAxis: false);
    }
}
