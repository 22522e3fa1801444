namespace QaService.Core.Geodesy;

/// <summary>
/// Universal Transverse Mercator zones on WGS 84 (CRS EPSG::32601–32660 north, EPSG::32701–32760 south, whose
/// map projections are the EPSG conversions 16001–16060 "UTM zone nN" and 16101–16160 "UTM zone nS"):
/// 6° zones, central meridian −183° + 6·zone, latitude of origin 0, k0 = 0.9996, FE = 500 000 m,
/// FN = 0 (north) or 10 000 000 m (south).
/// </summary>
public static class Utm
{
    /// <summary>Number of UTM zones.</summary>
    public const int ZoneCount = 60;

    /// <summary>Zone width, degrees of longitude.</summary>
    public const double ZoneWidthDegrees = 6.0;

    /// <summary>UTM central scale factor k0 (EPSG conversions 16001–16160).</summary>
    public const double ScaleFactor = 0.9996;

    /// <summary>UTM false easting, metres (EPSG conversions 16001–16160).</summary>
    public const double FalseEastingMetres = 500_000.0;

    /// <summary>UTM false northing in the southern hemisphere, metres (EPSG conversions 16001–16160).</summary>
    public const double SouthernFalseNorthingMetres = 10_000_000.0;

    /// <summary>Western edge of zone 1, degrees.</summary>
    private const double Zone1WesternEdgeDegrees = -AngleMath.HalfTurnDegrees;

    /// <summary>All 120 projections, index (zone − 1)·2 + (south ? 1 : 0); built once (cheap) so lookups are lock-free.</summary>
    private static readonly TransverseMercator[] Zones = BuildZones();

    /// <summary>
    /// The transverse Mercator projection for a UTM zone (cached; same instance for repeated calls).
    /// No Norway/Svalbard zone exceptions are applied (those depend on latitude; choose the zone yourself).
    /// </summary>
    /// <param name="zone">Zone number, 1..60.</param>
    /// <param name="southernHemisphere">true for the southern-hemisphere grid (FN = 10 000 000 m).</param>
    /// <exception cref="ArgumentOutOfRangeException">Zone outside 1..60.</exception>
    public static TransverseMercator Zone(int zone, bool southernHemisphere)
    {
        if (zone < 1 || zone > ZoneCount)
        {
            throw new ArgumentOutOfRangeException(nameof(zone), zone, "UTM zone must be in 1..60.");
        }

        return Zones[((zone - 1) * 2) + (southernHemisphere ? 1 : 0)];
    }

    /// <summary>
    /// Standard 6° zone containing a longitude: zone = ⌊(λ + 180)/6⌋ + 1 after reducing λ to [−180, 180).
    /// Zone boundaries belong to the zone to their east, and 180° is the same meridian as −180°, so it is zone 1
    /// (as GeographicLib <c>UTMUPS::StandardZone</c>). Latitude-dependent exceptions (32V, 31X–37X) are not applied.
    /// </summary>
    /// <param name="longitudeDegrees">Longitude, degrees, any finite value.</param>
    /// <returns>Zone number 1..60.</returns>
    /// <exception cref="ArgumentOutOfRangeException">Longitude not finite.</exception>
    public static int ZoneForLongitude(double longitudeDegrees)
    {
        AngleMath.ValidateFinite(longitudeDegrees, nameof(longitudeDegrees));
        double lon = Math.IEEERemainder(longitudeDegrees, AngleMath.FullTurnDegrees); // [-180, 180]
        if (lon >= AngleMath.HalfTurnDegrees)
        {
            lon -= AngleMath.FullTurnDegrees;
        }

        int zone = (int)Math.Floor((lon - Zone1WesternEdgeDegrees) / ZoneWidthDegrees) + 1;
        return Math.Clamp(zone, 1, ZoneCount);
    }

    /// <summary>Central meridian of a zone, degrees: −183 + 6·zone.</summary>
    /// <param name="zone">Zone number, 1..60.</param>
    public static double CentralMeridianDegrees(int zone)
        => Zone1WesternEdgeDegrees + ((zone - 0.5) * ZoneWidthDegrees);

    private static TransverseMercator[] BuildZones()
    {
        var zones = new TransverseMercator[ZoneCount * 2];
        for (int zone = 1; zone <= ZoneCount; zone++)
        {
            double cm = CentralMeridianDegrees(zone);
            zones[(zone - 1) * 2] = new TransverseMercator(Ellipsoid.Wgs84, cm, ScaleFactor, FalseEastingMetres, 0.0);
            zones[((zone - 1) * 2) + 1] = new TransverseMercator(Ellipsoid.Wgs84, cm, ScaleFactor, FalseEastingMetres, SouthernFalseNorthingMetres);
        }

        return zones;
    }
}
