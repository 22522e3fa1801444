using System.Globalization;
using System.Text.RegularExpressions;

namespace QaService.Core.Geodesy.Catalog;

/// <summary>
/// Resolves CRS strings to the CRSs this build supports: the WGS 84 family of the EPSG dataset —
/// EPSG:4326 (geographic 2D), EPSG:4979 (geographic 3D), EPSG:4978 (geocentric) and every
/// WGS 84 / UTM zone, EPSG:32601–32660 (north) and EPSG:32701–32760 (south). Codes and names are
/// those of the EPSG Geodetic Parameter Dataset (epsg.org); UTM parameters per EPSG method 9807 with
/// k0 = 0.9996, false easting 500 000 m, false northing 0 m (N) or 10 000 000 m (S).
/// </summary>
public static partial class CrsCatalog
{
    private const int UtmNorthBase = 32600;
    private const int UtmSouthBase = 32700;
    private const int UtmZoneCount = 60;

    /// <summary>The identifiers resolved by this catalog, for error messages and discovery.</summary>
    public const string SupportedSummary =
        "EPSG:4326, EPSG:4979, EPSG:4978, the WGS 84 / UTM zones EPSG:32601–32660 and EPSG:32701–32760, " +
        "ITRF2008 (5332, 7911), ITRF2014 (7789, 7912), ITRF2020 (9988–9990), ETRF2000 (7930, 7931, 9067), ETRS89 (4936, 4937, 4258), " +
        "NAD83(2011) (6317–6319, UTM 1N–19N 6330–6348), GDA2020 (7842–7844)";

    /// <summary>
    /// Reads <c>EPSG:code</c> (any case), <c>urn:ogc:def:crs:EPSG::code</c> or
    /// <c>http(s)://www.opengis.net/def/crs/EPSG/0/code</c>. OGC WKT and other authorities are
    /// recognised and answered with "not supported yet".
    /// </summary>
    public static CrsResolution Resolve(string? text)
    {
        if (string.IsNullOrWhiteSpace(text))
            return CrsResolution.Failed($"a CRS is required, e.g. \"EPSG:4326\"; supported: {SupportedSummary}");

        var trimmed = text.Trim();
        var match = EpsgPattern().Match(trimmed);
        if (!match.Success)
        {
            return LooksLikeWkt(trimmed)
                ? CrsResolution.Failed($"CRS given as WKT is not supported yet; give an EPSG code instead (supported: {SupportedSummary})")
                : CrsResolution.Failed($"\"{Shorten(trimmed)}\" is not a CRS identifier; write \"EPSG:<code>\" (supported: {SupportedSummary})");
        }

        if (!int.TryParse(match.Groups["code"].Value, NumberStyles.None, CultureInfo.InvariantCulture, out var code))
            return CrsResolution.Failed($"EPSG code \"{Shorten(match.Groups["code"].Value)}\" is out of range");

        var crs = ByCode(code);
        return crs is null
            ? CrsResolution.Failed($"EPSG:{code} is not supported yet; supported: {SupportedSummary}")
            : CrsResolution.Found(crs);
    }

    /// <summary>The CRS for an EPSG code, or null when the code is not in this catalog.</summary>
    public static CoordinateReferenceSystem? ByCode(int epsgCode)
    {
        switch (epsgCode)
        {
            case 4326:
                return new("EPSG:4326", "WGS 84", CrsKind.Geographic, GeodeticDatum.Wgs84Ensemble, LinearUnit.Metre, null, HasHeightAxis: false);
            case 4979:
                return new("EPSG:4979", "WGS 84", CrsKind.Geographic, GeodeticDatum.Wgs84Ensemble, LinearUnit.Metre, null, HasHeightAxis: true);
            case 4978:
                return new("EPSG:4978", "WGS 84", CrsKind.Geocentric, GeodeticDatum.Wgs84Ensemble, LinearUnit.Metre, null, HasHeightAxis: true);
        }

        if (FrameByCode(epsgCode) is { } frame)
            return frame;

        var south = epsgCode > UtmSouthBase && epsgCode <= UtmSouthBase + UtmZoneCount;
        var north = epsgCode > UtmNorthBase && epsgCode <= UtmNorthBase + UtmZoneCount;
        if (!north && !south)
            return null;

        var zone = epsgCode - (south ? UtmSouthBase : UtmNorthBase);
        var name = string.Create(CultureInfo.InvariantCulture, $"WGS 84 / UTM zone {zone}{(south ? 'S' : 'N')}");
        return new($"EPSG:{epsgCode}", name, CrsKind.Projected, GeodeticDatum.Wgs84Ensemble,
            LinearUnit.Metre, Utm.Zone(zone, south), HasHeightAxis: false);
    }

    private static bool LooksLikeWkt(string text) =>
        text.Contains('[') && (text.StartsWith("GEOG", StringComparison.OrdinalIgnoreCase)
                               || text.StartsWith("PROJ", StringComparison.OrdinalIgnoreCase)
                               || text.StartsWith("GEOC", StringComparison.OrdinalIgnoreCase)
                               || text.StartsWith("COMPD", StringComparison.OrdinalIgnoreCase)
                               || text.StartsWith("BASEGEOG", StringComparison.OrdinalIgnoreCase));

    private static string Shorten(string text) => text.Length <= 40 ? text : text[..40] + "…";

    [GeneratedRegex(@"^(?:EPSG:|urn:ogc:def:crs:EPSG:[^:]*:|https?://www\.opengis\.net/def/crs/EPSG/[^/]+/)(?<code>\d{1,9})$", RegexOptions.IgnoreCase | RegexOptions.CultureInvariant)]
    private static partial Regex EpsgPattern();
}
