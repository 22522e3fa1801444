namespace QaService.Core.Geodesy.Projections;

/// <summary>
/// Lambert Cylindrical Equal Area, EPSG method 9835 (ellipsoidal), after EPSG Guidance Note 7-2 (IOGP 373-7-2, 2019)
/// section "Lambert Cylindrical Equal Area"; Snyder (1987), USGS PP 1395, eqs. 10-15 to 10-19, pp. 81–82:
/// k₀ = cos φ₁/√(1 − e² sin² φ₁), E = FE + a·k₀·Δλ, N = FN + a·q/(2k₀). Inverse: β = asin(2k₀(N − FN)/(a·q_P)), φ from β
/// by GN7-2's e⁶ series (PROJ 9.1.1 <c>+proj=cea</c> uses the same <c>pj_authlat</c>; truncation ≤ 0.9 mm). Units:
/// degrees, metres. Domain: the whole ellipsoid (poles map to lines), |Δλ| ≤ 180°.
/// </summary>
public sealed class LambertCylindricalEqualArea : IMapProjection
{
    private readonly double _e, _a, _k0, _qPole, _lon0, _fe, _fn;

    public LambertCylindricalEqualArea(Ellipsoid ellipsoid, double standardParallelDegrees, double originLongitudeDegrees, double falseEastingMetres, double falseNorthingMetres)
    {
        AngleMath.ValidateLatitude(standardParallelDegrees, nameof(standardParallelDegrees));
        if (Math.Abs(standardParallelDegrees) == AngleMath.QuarterTurnDegrees)
            throw new ArgumentOutOfRangeException(nameof(standardParallelDegrees), standardParallelDegrees, "The standard parallel of a cylindrical projection cannot be a pole.");
        _e = ellipsoid.FirstEccentricity;
        _a = ellipsoid.SemiMajorAxisMetres;
        (double sin1, double cos1) = AngleMath.SinCosDegrees(standardParallelDegrees);
        _k0 = cos1 / Math.Sqrt(1 - (_e * _e * sin1 * sin1));
        _qPole = AuthalicLatitude.QFromSin(1, _e);
        _lon0 = originLongitudeDegrees;
        _fe = falseEastingMetres;
        _fn = falseNorthingMetres;
    }

    /// <inheritdoc />
    public string MethodName => "Lambert Cylindrical Equal Area";

    /// <inheritdoc />
    public ProjectedCoordinate Forward(double latitudeDegrees, double longitudeDegrees)
    {
        AngleMath.ValidateLatitude(latitudeDegrees, nameof(latitudeDegrees));
        AngleMath.ValidateFinite(longitudeDegrees, nameof(longitudeDegrees));
        double dLambda = AngleMath.LongitudeDifferenceDegrees(longitudeDegrees, _lon0) * AngleMath.RadiansPerDegree;
        return new ProjectedCoordinate(_fe + (_a * _k0 * dLambda), _fn + (_a * AuthalicLatitude.Q(latitudeDegrees, _e) / (2 * _k0)));
    }

    /// <inheritdoc />
    public (double LatitudeDegrees, double LongitudeDegrees) Inverse(double eastingMetres, double northingMetres)
    {
        AngleMath.ValidateFinite(eastingMetres, nameof(eastingMetres));
        AngleMath.ValidateFinite(northingMetres, nameof(northingMetres));
        double sinBeta = 2 * _k0 * (northingMetres - _fn) / (_a * _qPole);
        if (!(Math.Abs(sinBeta) <= 1 + 1e-12))
            return (double.NaN, double.NaN);
        double lat = AuthalicLatitude.LatitudeFromBetaSeries(Math.Asin(Math.Clamp(sinBeta, -1, 1)), _e);
        double lon = _lon0 + ((eastingMetres - _fe) / (_a * _k0) / AngleMath.RadiansPerDegree);
        return (lat, Math.IEEERemainder(lon, AngleMath.FullTurnDegrees));
    }
}
