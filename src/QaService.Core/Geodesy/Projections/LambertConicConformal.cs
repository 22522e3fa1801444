namespace QaService.Core.Geodesy.Projections;

/// <summary>
/// Lambert Conic Conformal, EPSG methods 9801 (1SP) and 9802 (2SP), after EPSG Guidance Note 7-2
/// (IOGP Publication 373-7-2, September 2019), section "Lambert Conic Conformal (2SP)" and
/// "Lambert Conic Conformal (1SP)"; also Snyder (1987), USGS PP 1395, pp. 107–109 (eqs. 15-1 to 15-11).
/// </summary>
/// <remarks>
/// <para>Both variants reduce to one cone: E = E₀ + r sin θ, N = N₀ + r₀ − r cos θ with r = a·F·k·tⁿ,
/// θ = n(λ − λ₀), t = exp(−ψ) (<see cref="IsometricLatitude"/>). The inverse recovers ψ from r exactly
/// and φ from ψ by Newton's method, so forward and inverse are accurate to rounding (≈ 1e-9 m).</para>
/// <para>Units: angles degrees, lengths metres. Domain: latitudes on the cone's side of the opposite pole
/// (the pole opposite to the cone's apex maps to infinity and is rejected), |λ − λ₀| ≤ 180°.</para>
/// </remarks>
public sealed class LambertConicConformal : IMapProjection
{
    private readonly double _n;          // cone constant, sin of the latitude of the tangent parallel
    private readonly double _aFk;        // a·F·k₀, metres
    private readonly double _originRadiusMetres; // r at the origin latitude (rF or r0)
    private readonly double _e;

    private LambertConicConformal(string methodName, Ellipsoid ellipsoid, double n, double f, double scale,
        double originLatitudeDegrees, double originLongitudeDegrees, double eastingMetres, double northingMetres)
    {
        MethodName = methodName;
        Ellipsoid = ellipsoid;
        _e = ellipsoid.FirstEccentricity;
        _n = n;
        _aFk = ellipsoid.SemiMajorAxisMetres * f * scale;
        _originRadiusMetres = Radius(originLatitudeDegrees);
        OriginLongitudeDegrees = originLongitudeDegrees;
        FalseEastingMetres = eastingMetres;
        FalseNorthingMetres = northingMetres;
    }

    /// <inheritdoc />
    public string MethodName { get; }

    /// <summary>The ellipsoid.</summary>
    public Ellipsoid Ellipsoid { get; }

    /// <summary>Longitude of the origin λ₀ (natural or false), degrees.</summary>
    public double OriginLongitudeDegrees { get; }

    /// <summary>Easting at the origin (FE or EF), metres.</summary>
    public double FalseEastingMetres { get; }

    /// <summary>Northing at the origin (FN or NF), metres.</summary>
    public double FalseNorthingMetres { get; }

    /// <summary>EPSG 9802: two standard parallels φ₁, φ₂ and a false origin (φF, λF, EF, NF).</summary>
    /// <param name="ellipsoid">Ellipsoid.</param>
    /// <param name="falseOriginLatitudeDegrees">φF, degrees.</param>
    /// <param name="falseOriginLongitudeDegrees">λF, degrees.</param>
    /// <param name="firstParallelDegrees">φ₁, degrees, not ±90.</param>
    /// <param name="secondParallelDegrees">φ₂, degrees, not ±90 and not −φ₁.</param>
    /// <param name="falseOriginEastingMetres">EF, metres.</param>
    /// <param name="falseOriginNorthingMetres">NF, metres.</param>
    /// <param name="methodName">EPSG 1051 "Lambert Conic Conformal (2SP Michigan)" is this method on the ellipsoid scaled by K
    /// (a·K, same flattening; GN7-2 section of that name, PROJ's <c>+k_0</c>): the caller passes the scaled ellipsoid and the name.</param>
    public static LambertConicConformal TwoParallels(Ellipsoid ellipsoid, double falseOriginLatitudeDegrees,
        double falseOriginLongitudeDegrees, double firstParallelDegrees, double secondParallelDegrees,
        double falseOriginEastingMetres, double falseOriginNorthingMetres, string methodName = "Lambert Conic Conformal (2SP)")
    {
        double e = ellipsoid.FirstEccentricity;
        double m1 = IsometricLatitude.M(firstParallelDegrees, e), m2 = IsometricLatitude.M(secondParallelDegrees, e);
        double psi1 = IsometricLatitude.Psi(firstParallelDegrees, e), psi2 = IsometricLatitude.Psi(secondParallelDegrees, e);
        // n = (ln m1 − ln m2)/(ln t1 − ln t2), ln t = −ψ; equal parallels: n = sin φ1 (the 1SP limit).
        double n = firstParallelDegrees == secondParallelDegrees
            ? AngleMath.SinCosDegrees(firstParallelDegrees).Sin
            : (Math.Log(m1) - Math.Log(m2)) / (psi2 - psi1);
        CheckCone(n);
        double f = m1 / (n * Math.Exp(-n * psi1));
        return new LambertConicConformal(methodName, ellipsoid, n, f, 1.0,
            falseOriginLatitudeDegrees, falseOriginLongitudeDegrees, falseOriginEastingMetres, falseOriginNorthingMetres);
    }

    /// <summary>EPSG 9801: natural origin φ₀ (the tangent parallel), λ₀, scale k₀ on it, FE, FN.</summary>
    public static LambertConicConformal OneParallel(Ellipsoid ellipsoid, double naturalOriginLatitudeDegrees,
        double naturalOriginLongitudeDegrees, double scaleFactor, double falseEastingMetres, double falseNorthingMetres)
    {
        double e = ellipsoid.FirstEccentricity;
        double n = AngleMath.SinCosDegrees(naturalOriginLatitudeDegrees).Sin;
        CheckCone(n);
        double m0 = IsometricLatitude.M(naturalOriginLatitudeDegrees, e);
        double f = m0 / (n * Math.Exp(-n * IsometricLatitude.Psi(naturalOriginLatitudeDegrees, e)));
        return new LambertConicConformal("Lambert Conic Conformal (1SP)", ellipsoid, n, f, scaleFactor,
            naturalOriginLatitudeDegrees, naturalOriginLongitudeDegrees, falseEastingMetres, falseNorthingMetres);
    }

    /// <inheritdoc />
    public ProjectedCoordinate Forward(double latitudeDegrees, double longitudeDegrees)
    {
        AngleMath.ValidateLatitude(latitudeDegrees, nameof(latitudeDegrees));
        AngleMath.ValidateFinite(longitudeDegrees, nameof(longitudeDegrees));
        double r = Radius(latitudeDegrees);
        if (!double.IsFinite(r))
            throw new ArgumentOutOfRangeException(nameof(latitudeDegrees), latitudeDegrees, "The pole opposite the cone's apex has no image.");
        double theta = _n * AngleMath.LongitudeDifferenceDegrees(longitudeDegrees, OriginLongitudeDegrees) * AngleMath.RadiansPerDegree;
        (double sin, double cos) = Math.SinCos(theta);
        return new ProjectedCoordinate(FalseEastingMetres + (r * sin), FalseNorthingMetres + _originRadiusMetres - (r * cos));
    }

    /// <inheritdoc />
    public (double LatitudeDegrees, double LongitudeDegrees) Inverse(double eastingMetres, double northingMetres)
    {
        AngleMath.ValidateFinite(eastingMetres, nameof(eastingMetres));
        AngleMath.ValidateFinite(northingMetres, nameof(northingMetres));
        double sign = Math.Sign(_n);
        double x = eastingMetres - FalseEastingMetres;
        double y = _originRadiusMetres - (northingMetres - FalseNorthingMetres);
        double r = sign * double.Hypot(x, y);
        double theta = Math.Atan2(sign * x, sign * y);
        // r = aFk·exp(−nψ)  ⇒  ψ = −ln(r/aFk)/n
        double psi = r == 0 ? sign * double.PositiveInfinity : -Math.Log(r / _aFk) / _n;
        double lat = IsometricLatitude.LatitudeDegrees(psi, _e);
        double lon = Math.IEEERemainder(OriginLongitudeDegrees + (theta / _n / AngleMath.RadiansPerDegree), AngleMath.FullTurnDegrees);
        return (lat, lon);
    }

    /// <summary>r = a·F·k·tⁿ = a·F·k·exp(−nψ), metres.</summary>
    private double Radius(double latitudeDegrees) => _aFk * Math.Exp(-_n * IsometricLatitude.Psi(latitudeDegrees, _e));

    private static void CheckCone(double n)
    {
        if (!(double.IsFinite(n) && n != 0 && Math.Abs(n) <= 1))
            throw new ArgumentOutOfRangeException(nameof(n), n, "The standard parallels do not define a cone (equator or symmetric about it).");
    }
}
