namespace QaService.Core.Geodesy.Projections;

/// <summary>
/// Transverse Mercator Zoned Grid System, EPSG method 9824, after EPSG Guidance Note 7-2 (IOGP 373-7-2, 2019) section
/// of that name: the zone Z = INT((λ − λᵢ)/W) + 1 (λᵢ the initial longitude, W the zone width), its central meridian
/// λ₀ = λᵢ + Z·W − W/2, and E = Z·10⁶ + FE + E′ with E′, N from Transverse Mercator (<see cref="TransverseMercator"/>,
/// Krüger 6th order) on that meridian. Inverse: Z = INT(E/10⁶). Units: degrees, metres. Domain: TM's within each zone.
/// </summary>
public sealed class TransverseMercatorZoned : IMapProjection
{
    private const double ZoneEastingMetres = 1_000_000;

    private readonly TransverseMercator[] _zones;
    private readonly double _initialLongitude, _zoneWidth, _fe;

    public TransverseMercatorZoned(Ellipsoid ellipsoid, double originLatitudeDegrees, double initialLongitudeDegrees, double zoneWidthDegrees,
        double scaleFactor, double falseEastingMetres, double falseNorthingMetres)
    {
        if (!(zoneWidthDegrees > 0 && zoneWidthDegrees <= AngleMath.FullTurnDegrees / 2))
            throw new ArgumentOutOfRangeException(nameof(zoneWidthDegrees), zoneWidthDegrees, "The zone width must be in (0°, 180°].");
        int count = (int)Math.Ceiling(AngleMath.FullTurnDegrees / zoneWidthDegrees);
        _zones = new TransverseMercator[count];
        for (int z = 1; z <= count; z++)
            _zones[z - 1] = new TransverseMercator(ellipsoid, initialLongitudeDegrees + (z * zoneWidthDegrees) - (zoneWidthDegrees / 2), scaleFactor, 0, falseNorthingMetres, originLatitudeDegrees);
        _initialLongitude = initialLongitudeDegrees;
        _zoneWidth = zoneWidthDegrees;
        _fe = falseEastingMetres;
    }

    /// <inheritdoc />
    public string MethodName => "Transverse Mercator Zoned Grid System";

    /// <inheritdoc />
    public ProjectedCoordinate Forward(double latitudeDegrees, double longitudeDegrees)
    {
        AngleMath.ValidateFinite(longitudeDegrees, nameof(longitudeDegrees));
        double fromInitial = longitudeDegrees - _initialLongitude;
        fromInitial -= AngleMath.FullTurnDegrees * Math.Floor(fromInitial / AngleMath.FullTurnDegrees);
        int zone = Math.Min((int)Math.Floor(fromInitial / _zoneWidth) + 1, _zones.Length);
        var p = _zones[zone - 1].Forward(latitudeDegrees, longitudeDegrees);
        return new ProjectedCoordinate((zone * ZoneEastingMetres) + _fe + p.EastingMetres, p.NorthingMetres);
    }

    /// <inheritdoc />
    public (double LatitudeDegrees, double LongitudeDegrees) Inverse(double eastingMetres, double northingMetres)
    {
        AngleMath.ValidateFinite(eastingMetres, nameof(eastingMetres));
        int zone = (int)Math.Floor(eastingMetres / ZoneEastingMetres);
        if (zone < 1 || zone > _zones.Length)
            return (double.NaN, double.NaN);
        return _zones[zone - 1].Inverse(eastingMetres - (zone * ZoneEastingMetres) - _fe, northingMetres);
    }
}
