namespace QaService.Core.Geodesy.Projections;

/// <summary>
/// Albers Equal Area, EPSG method 9822, after EPSG Guidance Note 7-2 (IOGP Publication 373-7-2,
/// September 2019), section "Albers Equal Area"; Snyder (1987), USGS PP 1395, pp. 101–102
/// (eqs. 14-1 to 14-21).
/// </summary>
/// <remarks>
/// E = EF + ρ sin θ, N = NF + ρF − ρ cos θ, ρ = a√(C − nα)/n, θ = n(λ − λF), n = (m₁² − m₂²)/(α₂ − α₁),
/// C = m₁² + nα₁. The inverse recovers α exactly and φ from α by Newton's method (Snyder eq. 3-16, as
/// PROJ 9.1.1 does) rather than GN7-2's e⁶ series, so it is exact to rounding. Units: degrees, metres.
/// </remarks>
public sealed class AlbersEqualArea : IMapProjection
{
    private readonly double _e, _a, _n, _c, _rhoF;

    /// <summary>Creates the projection (all angles degrees, lengths metres).</summary>
    /// <param name="ellipsoid">Ellipsoid.</param>
    /// <param name="falseOriginLatitudeDegrees">φF.</param>
    /// <param name="falseOriginLongitudeDegrees">λF.</param>
    /// <param name="firstParallelDegrees">φ₁.</param>
    /// <param name="secondParallelDegrees">φ₂ (φ₁ ≠ −φ₂).</param>
    /// <param name="falseOriginEastingMetres">EF.</param>
    /// <param name="falseOriginNorthingMetres">NF.</param>
    public AlbersEqualArea(Ellipsoid ellipsoid, double falseOriginLatitudeDegrees, double falseOriginLongitudeDegrees,
        double firstParallelDegrees, double secondParallelDegrees, double falseOriginEastingMetres, double falseOriginNorthingMetres)
    {
        Ellipsoid = ellipsoid;
        _e = ellipsoid.FirstEccentricity;
        _a = ellipsoid.SemiMajorAxisMetres;
        double m1 = IsometricLatitude.M(firstParallelDegrees, _e), m2 = IsometricLatitude.M(secondParallelDegrees, _e);
        double q1 = AuthalicLatitude.Q(firstParallelDegrees, _e), q2 = AuthalicLatitude.Q(secondParallelDegrees, _e);
        _n = firstParallelDegrees == secondParallelDegrees
            ? AngleMath.SinCosDegrees(firstParallelDegrees).Sin
            : ((m1 * m1) - (m2 * m2)) / (q2 - q1);
        if (!(double.IsFinite(_n) && _n != 0))
            throw new ArgumentOutOfRangeException(nameof(secondParallelDegrees), secondParallelDegrees, "The standard parallels do not define a cone.");
        _c = (m1 * m1) + (_n * q1);
        _rhoF = Rho(AuthalicLatitude.Q(falseOriginLatitudeDegrees, _e));
        FalseOriginLongitudeDegrees = falseOriginLongitudeDegrees;
        FalseOriginEastingMetres = falseOriginEastingMetres;
        FalseOriginNorthingMetres = falseOriginNorthingMetres;
    }

    /// <inheritdoc />
    public string MethodName => "Albers Equal Area";

    /// <summary>The ellipsoid.</summary>
    public Ellipsoid Ellipsoid { get; }

    /// <summary>λF, degrees.</summary>
    public double FalseOriginLongitudeDegrees { get; }

    /// <summary>EF, metres.</summary>
    public double FalseOriginEastingMetres { get; }

    /// <summary>NF, metres.</summary>
    public double FalseOriginNorthingMetres { get; }

    /// <inheritdoc />
    public ProjectedCoordinate Forward(double latitudeDegrees, double longitudeDegrees)
    {
        AngleMath.ValidateLatitude(latitudeDegrees, nameof(latitudeDegrees));
        AngleMath.ValidateFinite(longitudeDegrees, nameof(longitudeDegrees));
        double rho = Rho(AuthalicLatitude.Q(latitudeDegrees, _e));
        double theta = _n * AngleMath.LongitudeDifferenceDegrees(longitudeDegrees, FalseOriginLongitudeDegrees) * AngleMath.RadiansPerDegree;
        (double sin, double cos) = Math.SinCos(theta);
        return new ProjectedCoordinate(FalseOriginEastingMetres + (rho * sin), FalseOriginNorthingMetres + _rhoF - (rho * cos));
    }

    /// <inheritdoc />
    public (double LatitudeDegrees, double LongitudeDegrees) Inverse(double eastingMetres, double northingMetres)
    {
        AngleMath.ValidateFinite(eastingMetres, nameof(eastingMetres));
        AngleMath.ValidateFinite(northingMetres, nameof(northingMetres));
        double sign = Math.Sign(_n);
        double x = eastingMetres - FalseOriginEastingMetres;
        double y = _rhoF - (northingMetres - FalseOriginNorthingMetres);
        double rho = sign * double.Hypot(x, y);
        double theta = Math.Atan2(sign * x, sign * y);
        double q = (_c - (rho * rho * _n * _n / (_a * _a))) / _n;
        double lat = AuthalicLatitude.LatitudeFromQExact(q, _e);
        double lon = FalseOriginLongitudeDegrees + (theta / _n / AngleMath.RadiansPerDegree);
        return (lat, Math.IEEERemainder(lon, AngleMath.FullTurnDegrees));
    }

    /// <summary>ρ = a√(C − nq)/n, metres (negative for a southern cone, n &lt; 0).</summary>
    private double Rho(double q) => _a * Math.Sqrt(Math.Max(0, _c - (_n * q))) / _n;
}
