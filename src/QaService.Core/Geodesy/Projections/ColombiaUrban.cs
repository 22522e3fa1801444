namespace QaService.Core.Geodesy.Projections;

/// <summary>
/// Colombia Urban, EPSG method 1052, after EPSG Guidance Note 7-2 (IOGP 373-7-2, 2020) section "Colombia Urban": city
/// grids on a plane at height h₀ above the ellipsoid. With ν, ρ the prime-vertical and meridian radii and the origin's
/// ν₀, ρ₀: A = 1 + h₀/ν₀, B = tan φ₀/(2ρ₀ν₀), C = 1 + h₀/a, D = ρ₀(1 + h₀/(a(1 − e²))), G = 1 + h₀/ρ_m (ρ_m at
/// (φ + φ₀)/2); E = FE + A·ν cos φ·Δλ, N = FN + G·ρ₀[(φ − φ₀) + B·(ν cos φ·Δλ)²]. Inverse (GN7-2's, as PROJ 9.1.1
/// <c>+proj=col_urban</c>): φ = φ₀ + (N − FN)/D − B((E − FE)/C)², λ = λ₀ + (E − FE)/(C·ν cos φ); it is an approximation
/// meant for a city's extent (tens of kilometres), where it returns the forward's input within millimetres.
/// Units: degrees, metres.
/// </summary>
public sealed class ColombiaUrban : IMapProjection
{
    private readonly double _a, _e2, _phi0, _lon0, _fe, _fn, _h0, _rho0, _bA, _bB, _bC, _bD;

    public ColombiaUrban(Ellipsoid ellipsoid, double originLatitudeDegrees, double originLongitudeDegrees, double falseEastingMetres,
        double falseNorthingMetres, double planeHeightMetres)
    {
        AngleMath.ValidateLatitude(originLatitudeDegrees, nameof(originLatitudeDegrees));
        _a = ellipsoid.SemiMajorAxisMetres;
        _e2 = ellipsoid.FirstEccentricitySquared;
        _phi0 = originLatitudeDegrees * AngleMath.RadiansPerDegree;
        _lon0 = originLongitudeDegrees;
        _fe = falseEastingMetres;
        _fn = falseNorthingMetres;
        _h0 = planeHeightMetres;
        double nu0 = Nu(_phi0);
        _rho0 = Rho(_phi0);
        _bA = 1 + (_h0 / nu0);
        _bB = Math.Tan(_phi0) / (2 * _rho0 * nu0);
        _bC = 1 + (_h0 / _a);
        _bD = _rho0 * (1 + (_h0 / (_a * (1 - _e2))));
    }

    /// <inheritdoc />
    public string MethodName => "Colombia Urban";

    /// <inheritdoc />
    public ProjectedCoordinate Forward(double latitudeDegrees, double longitudeDegrees)
    {
        AngleMath.ValidateLatitude(latitudeDegrees, nameof(latitudeDegrees));
        AngleMath.ValidateFinite(longitudeDegrees, nameof(longitudeDegrees));
        double phi = latitudeDegrees * AngleMath.RadiansPerDegree;
        double l = Nu(phi) * Math.Cos(phi) * AngleMath.LongitudeDifferenceDegrees(longitudeDegrees, _lon0) * AngleMath.RadiansPerDegree;
        double g = 1 + (_h0 / Rho((phi + _phi0) / 2));
        return new ProjectedCoordinate(_fe + (_bA * l), _fn + (g * _rho0 * ((phi - _phi0) + (_bB * l * l))));
    }

    /// <inheritdoc />
    public (double LatitudeDegrees, double LongitudeDegrees) Inverse(double eastingMetres, double northingMetres)
    {
        AngleMath.ValidateFinite(eastingMetres, nameof(eastingMetres));
        AngleMath.ValidateFinite(northingMetres, nameof(northingMetres));
        double x = (eastingMetres - _fe) / _bC;
        double phi = _phi0 + ((northingMetres - _fn) / _bD) - (_bB * x * x);
        if (!(Math.Abs(phi) < Math.PI / 2))
            return (double.NaN, double.NaN);
        double lon = _lon0 + (x / (Nu(phi) * Math.Cos(phi)) / AngleMath.RadiansPerDegree);
        return (phi / AngleMath.RadiansPerDegree, Math.IEEERemainder(lon, AngleMath.FullTurnDegrees));
    }

    /// <summary>Prime-vertical radius of curvature ν(φ), metres.</summary>
    private double Nu(double phi) => _a / Math.Sqrt(1 - (_e2 * Math.Sin(phi) * Math.Sin(phi)));

    /// <summary>Meridian radius of curvature ρ(φ), metres.</summary>
    private double Rho(double phi) => _a * (1 - _e2) / Math.Pow(1 - (_e2 * Math.Sin(phi) * Math.Sin(phi)), 1.5);
}
