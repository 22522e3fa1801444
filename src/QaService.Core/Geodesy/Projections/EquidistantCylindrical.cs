namespace QaService.Core.Geodesy.Projections;

/// <summary>
/// Equidistant Cylindrical, EPSG methods 1028 (ellipsoidal) and 1029 (spherical), after EPSG Guidance Note 7-2
/// (IOGP 373-7-2, 2019) section "Equidistant Cylindrical"; Snyder (1987), USGS PP 1395, eqs. 12-1, 12-2 (p. 91):
/// E = FE + ν₁ cos φ₁·Δλ, N = FN + M(φ) with ν₁ the prime-vertical radius at the standard parallel and M the meridian
/// distance (<see cref="MeridianArc"/>, Krüger series, nanometres); on a sphere of radius R, ν₁ = R and M = R·φ. Inverse: φ is the
/// footpoint latitude of N − FN. Units: degrees, metres. Domain: the whole ellipsoid, |Δλ| ≤ 180°.
/// Note: PROJ 9.1.1 evaluates method 1028 with the spherical formula on the semi-major axis (<c>+proj=eqc</c> has no
/// ellipsoidal form), so its northings for EPSG:4087 differ from EPSG's by up to about 10 km at mid-latitudes.
/// </summary>
public sealed class EquidistantCylindrical : IMapProjection
{
    private readonly double _xScale, _lon0, _fe, _fn;
    private readonly MeridianArc _arc;

    public EquidistantCylindrical(string methodName, Ellipsoid ellipsoid, double standardParallelDegrees, double originLongitudeDegrees, double falseEastingMetres, double falseNorthingMetres)
    {
        AngleMath.ValidateLatitude(standardParallelDegrees, nameof(standardParallelDegrees));
        MethodName = methodName;
        (double sin1, double cos1) = AngleMath.SinCosDegrees(standardParallelDegrees);
        _xScale = ellipsoid.SemiMajorAxisMetres / Math.Sqrt(1 - (ellipsoid.FirstEccentricitySquared * sin1 * sin1)) * cos1;
        if (!(_xScale > 0))
            throw new ArgumentOutOfRangeException(nameof(standardParallelDegrees), standardParallelDegrees, "The standard parallel of a cylindrical projection cannot be a pole.");
        _arc = new MeridianArc(ellipsoid);
        _lon0 = originLongitudeDegrees;
        _fe = falseEastingMetres;
        _fn = falseNorthingMetres;
    }

    /// <inheritdoc />
    public string MethodName { get; }

    /// <inheritdoc />
    public ProjectedCoordinate Forward(double latitudeDegrees, double longitudeDegrees)
    {
        AngleMath.ValidateLatitude(latitudeDegrees, nameof(latitudeDegrees));
        AngleMath.ValidateFinite(longitudeDegrees, nameof(longitudeDegrees));
        double dLambda = AngleMath.LongitudeDifferenceDegrees(longitudeDegrees, _lon0) * AngleMath.RadiansPerDegree;
        return new ProjectedCoordinate(_fe + (_xScale * dLambda), _fn + _arc.Metres(latitudeDegrees * AngleMath.RadiansPerDegree));
    }

    /// <inheritdoc />
    public (double LatitudeDegrees, double LongitudeDegrees) Inverse(double eastingMetres, double northingMetres)
    {
        AngleMath.ValidateFinite(eastingMetres, nameof(eastingMetres));
        AngleMath.ValidateFinite(northingMetres, nameof(northingMetres));
        double m = northingMetres - _fn;
        // A northing within 1 mm beyond the pole line (rounding, another radius series) is the pole; further is off the map.
        if (Math.Abs(m) > _arc.QuarterMeridianMetres && Math.Abs(m) <= _arc.QuarterMeridianMetres + 1e-3)
            m = Math.CopySign(_arc.QuarterMeridianMetres, m);
        double lat = _arc.Footpoint(m) / AngleMath.RadiansPerDegree;
        if (double.IsNaN(lat))
            return (double.NaN, double.NaN);
        double lon = _lon0 + ((eastingMetres - _fe) / _xScale / AngleMath.RadiansPerDegree);
        return (lat, Math.IEEERemainder(lon, AngleMath.FullTurnDegrees));
    }
}
