namespace QaService.Core.Geodesy.Projections;

/// <summary>
/// Cassini-Soldner, EPSG method 9806, by the series of EPSG Guidance Note 7-2 (IOGP 373-7-2, 2019) section
/// "Cassini-Soldner" (Snyder 1987, USGS PP 1395, eqs. 13-7 to 13-12, pp. 95–96): forward and inverse are the two
/// published series (not exact inverses of each other), as PROJ 9.1.1 <c>+proj=cass</c> evaluates them, so
/// results agree with PROJ to the meridian-arc rounding. Units: degrees, metres. Accuracy of the series itself
/// (common practice): centimetres within about 3° (300 km) of the central meridian, worsening as A⁵ beyond; the
/// service's round-trip check rejects grid values where forward and inverse stop agreeing within 1 mm.
/// </summary>
public sealed class CassiniSoldner : IMapProjection
{
    private readonly double _e2, _m0, _lon0, _fe, _fn, _a;
    private readonly MeridianArc _arc;

    public CassiniSoldner(Ellipsoid ellipsoid, double originLatitudeDegrees, double originLongitudeDegrees, double falseEastingMetres, double falseNorthingMetres)
    {
        AngleMath.ValidateLatitude(originLatitudeDegrees, nameof(originLatitudeDegrees));
        _a = ellipsoid.SemiMajorAxisMetres;
        _e2 = ellipsoid.FirstEccentricitySquared;
        _arc = new MeridianArc(ellipsoid);
        _m0 = _arc.Metres(originLatitudeDegrees * AngleMath.RadiansPerDegree);
        _lon0 = originLongitudeDegrees;
        _fe = falseEastingMetres;
        _fn = falseNorthingMetres;
    }

    /// <inheritdoc />
    public string MethodName => "Cassini-Soldner";

    /// <inheritdoc />
    public ProjectedCoordinate Forward(double latitudeDegrees, double longitudeDegrees)
    {
        AngleMath.ValidateLatitude(latitudeDegrees, nameof(latitudeDegrees));
        AngleMath.ValidateFinite(longitudeDegrees, nameof(longitudeDegrees));
        double phi = latitudeDegrees * AngleMath.RadiansPerDegree;
        (double sin, double cos) = Math.SinCos(phi);
        double nu = _a / Math.Sqrt(1 - (_e2 * sin * sin));
        double tan = sin / cos, t = tan * tan;
        double c = _e2 * cos * cos / (1 - _e2);
        double a = AngleMath.LongitudeDifferenceDegrees(longitudeDegrees, _lon0) * AngleMath.RadiansPerDegree * cos, a2 = a * a;
        double x = nu * a * (1 - (a2 * t * ((1.0 / 6) + ((8 - t + (8 * c)) * a2 / 120))));
        double y = _arc.Metres(phi) - _m0 + (nu * tan * a2 * (0.5 + ((5 - t + (6 * c)) * a2 / 24)));
        return new ProjectedCoordinate(_fe + x, _fn + y);
    }

    /// <inheritdoc />
    public (double LatitudeDegrees, double LongitudeDegrees) Inverse(double eastingMetres, double northingMetres)
    {
        AngleMath.ValidateFinite(eastingMetres, nameof(eastingMetres));
        AngleMath.ValidateFinite(northingMetres, nameof(northingMetres));
        double phi1 = _arc.Footpoint(_m0 + (northingMetres - _fn));
        (double sin, double cos) = Math.SinCos(phi1);
        double w = 1 - (_e2 * sin * sin);
        double nu1 = _a / Math.Sqrt(w), rho1 = _a * (1 - _e2) / (w * Math.Sqrt(w));
        double tan = sin / cos, t1 = tan * tan;
        double d = (eastingMetres - _fe) / nu1, d2 = d * d;
        double phi = phi1 - (nu1 * tan / rho1 * d2 * (0.5 - ((1 + (3 * t1)) * d2 / 24)));
        double dLambda = d * (1 - (t1 * d2 * ((1.0 / 3) - ((1 + (3 * t1)) * d2 / 15)))) / cos;
        return (phi / AngleMath.RadiansPerDegree, Math.IEEERemainder(_lon0 + (dLambda / AngleMath.RadiansPerDegree), AngleMath.FullTurnDegrees));
    }
}
