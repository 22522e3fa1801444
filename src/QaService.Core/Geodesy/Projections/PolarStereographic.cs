namespace QaService.Core.Geodesy.Projections;

/// <summary>
/// Polar Stereographic, EPSG methods 9810 (variant A: pole as natural origin with scale k₀) and 9829
/// (variant B: standard parallel φc, k₀ derived), after EPSG Guidance Note 7-2 (IOGP Publication
/// 373-7-2, September 2019), section "Polar Stereographic"; Snyder (1987), USGS PP 1395, pp. 160–162
/// (eqs. 21-33, 21-34, 21-39).
/// </summary>
/// <remarks>
/// North pole case: ρ = 2a·k₀·t/√((1+e)^(1+e)(1−e)^(1−e)), E = FE + ρ sin(λ − λ₀), N = FN − ρ cos(λ − λ₀);
/// south pole case: t evaluated at −φ and N = FN + ρ cos(λ − λ₀). t = exp(−ψ) as in
/// <see cref="IsometricLatitude"/>. Closed-form forward, Newton inverse: rounding-level accuracy.
/// Units: degrees, metres. Domain: the hemisphere of the projection pole and beyond to, but excluding,
/// the opposite pole.
/// </remarks>
public sealed class PolarStereographic : IMapProjection
{
    private readonly double _e;
    private readonly double _twoAkOverC; // 2a·k₀/√((1+e)^(1+e)(1−e)^(1−e)), metres
    private readonly bool _south;

    private PolarStereographic(string methodName, Ellipsoid ellipsoid, bool south, double scaleFactor,
        double originLongitudeDegrees, double falseEastingMetres, double falseNorthingMetres)
    {
        MethodName = methodName;
        Ellipsoid = ellipsoid;
        _e = ellipsoid.FirstEccentricity;
        _south = south;
        ScaleFactor = scaleFactor;
        _twoAkOverC = 2 * ellipsoid.SemiMajorAxisMetres * scaleFactor / PoleConstant(_e);
        OriginLongitudeDegrees = originLongitudeDegrees;
        FalseEastingMetres = falseEastingMetres;
        FalseNorthingMetres = falseNorthingMetres;
    }

    /// <inheritdoc />
    public string MethodName { get; }

    /// <summary>The ellipsoid.</summary>
    public Ellipsoid Ellipsoid { get; }

    /// <summary>Scale factor at the pole k₀ (given for variant A, derived for variant B).</summary>
    public double ScaleFactor { get; }

    /// <summary>Longitude of origin λ₀ (the meridian along the grid's N axis from the pole), degrees.</summary>
    public double OriginLongitudeDegrees { get; }

    /// <summary>False easting, metres.</summary>
    public double FalseEastingMetres { get; }

    /// <summary>False northing, metres.</summary>
    public double FalseNorthingMetres { get; }

    /// <summary>True for the south-pole case.</summary>
    public bool IsSouthPolar => _south;

    /// <summary>EPSG 9810: latitude of natural origin must be ±90°.</summary>
    public static PolarStereographic VariantA(Ellipsoid ellipsoid, double originLatitudeDegrees, double originLongitudeDegrees,
        double scaleFactor, double falseEastingMetres, double falseNorthingMetres)
    {
        if (Math.Abs(originLatitudeDegrees) != AngleMath.QuarterTurnDegrees)
            throw new ArgumentOutOfRangeException(nameof(originLatitudeDegrees), originLatitudeDegrees, "Polar Stereographic (variant A) has its natural origin at a pole.");
        return new("Polar Stereographic (variant A)", ellipsoid, originLatitudeDegrees < 0, scaleFactor, originLongitudeDegrees, falseEastingMetres, falseNorthingMetres);
    }

    /// <summary>EPSG 9829: k₀ = m_c·√((1+e)^(1+e)(1−e)^(1−e))/(2 t_c), or 1 when φc is a pole (GN7-2).</summary>
    public static PolarStereographic VariantB(Ellipsoid ellipsoid, double standardParallelDegrees, double originLongitudeDegrees,
        double falseEastingMetres, double falseNorthingMetres)
    {
        AngleMath.ValidateLatitude(standardParallelDegrees, nameof(standardParallelDegrees));
        if (standardParallelDegrees == 0)
            throw new ArgumentOutOfRangeException(nameof(standardParallelDegrees), standardParallelDegrees, "The standard parallel must not be the equator.");
        double e = ellipsoid.FirstEccentricity;
        bool south = standardParallelDegrees < 0;
        double k0 = 1.0;
        if (Math.Abs(standardParallelDegrees) != AngleMath.QuarterTurnDegrees)
        {
            double phi = Math.Abs(standardParallelDegrees);
            k0 = IsometricLatitude.M(phi, e) * PoleConstant(e) / (2 * Math.Exp(-IsometricLatitude.Psi(phi, e)));
        }

        return new("Polar Stereographic (variant B)", ellipsoid, south, k0, originLongitudeDegrees, falseEastingMetres, falseNorthingMetres);
    }

    /// <inheritdoc />
    public ProjectedCoordinate Forward(double latitudeDegrees, double longitudeDegrees)
    {
        AngleMath.ValidateLatitude(latitudeDegrees, nameof(latitudeDegrees));
        AngleMath.ValidateFinite(longitudeDegrees, nameof(longitudeDegrees));
        double phi = _south ? -latitudeDegrees : latitudeDegrees;
        if (phi == -AngleMath.QuarterTurnDegrees)
            throw new ArgumentOutOfRangeException(nameof(latitudeDegrees), latitudeDegrees, "The pole opposite the projection pole has no image.");
        double rho = _twoAkOverC * Math.Exp(-IsometricLatitude.Psi(phi, _e));
        (double sin, double cos) = AngleMath.SinCosDegrees(AngleMath.LongitudeDifferenceDegrees(longitudeDegrees, OriginLongitudeDegrees));
        return new ProjectedCoordinate(FalseEastingMetres + (rho * sin), FalseNorthingMetres + ((_south ? rho : -rho) * cos));
    }

    /// <inheritdoc />
    public (double LatitudeDegrees, double LongitudeDegrees) Inverse(double eastingMetres, double northingMetres)
    {
        AngleMath.ValidateFinite(eastingMetres, nameof(eastingMetres));
        AngleMath.ValidateFinite(northingMetres, nameof(northingMetres));
        double x = eastingMetres - FalseEastingMetres;
        double y = northingMetres - FalseNorthingMetres;
        double rho = double.Hypot(x, y);
        double psi = rho == 0 ? double.PositiveInfinity : -Math.Log(rho / _twoAkOverC);
        double lat = IsometricLatitude.LatitudeDegrees(psi, _e);
        double dLon = Math.Atan2(x, _south ? y : -y) / AngleMath.RadiansPerDegree;
        return (_south ? -lat : lat, Math.IEEERemainder(OriginLongitudeDegrees + dLon, AngleMath.FullTurnDegrees));
    }

    /// <summary>√((1+e)^(1+e)·(1−e)^(1−e)), dimensionless (GN7-2 "Polar Stereographic").</summary>
    private static double PoleConstant(double e) => Math.Sqrt(Math.Pow(1 + e, 1 + e) * Math.Pow(1 - e, 1 - e));
}
