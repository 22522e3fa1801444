namespace QaService.Core.Geodesy.Projections;

/// <summary>
/// Normal-aspect Mercator: EPSG methods 9804 (variant A, scale k₀ on the equator), 9805 (variant B,
/// standard parallel φ₁, k₀ = m(φ₁)) and 1024 (Popular Visualisation Pseudo Mercator: the spherical
/// formulas with R = a applied to ellipsoidal coordinates), after EPSG Guidance Note 7-2 (IOGP
/// Publication 373-7-2, September 2019), sections "Mercator" and "Popular Visualisation Pseudo
/// Mercator"; Snyder (1987), USGS PP 1395, pp. 41–44 (eqs. 7-2, 7-7, 7-9).
/// </summary>
/// <remarks>
/// E = FE + a·k₀·(λ − λ₀), N = FN + a·k₀·ψ with ψ the isometric latitude (ellipsoidal for 9804/9805,
/// spherical, e = 0, for 1024). Exact in closed form; the inverse solves ψ → φ by Newton's method.
/// Units: degrees and metres. Domain: |φ| &lt; 90° (the poles are at infinity), any λ.
/// </remarks>
public sealed class Mercator : IMapProjection
{
    private readonly double _ak;  // a·k₀, metres
    private readonly double _e;   // eccentricity used in ψ (0 for the pseudo-Mercator)

    private Mercator(string methodName, Ellipsoid ellipsoid, double scaleFactor, double eccentricity,
        double originLongitudeDegrees, double falseEastingMetres, double falseNorthingMetres)
    {
        MethodName = methodName;
        Ellipsoid = ellipsoid;
        ScaleFactor = scaleFactor;
        _ak = ellipsoid.SemiMajorAxisMetres * scaleFactor;
        _e = eccentricity;
        OriginLongitudeDegrees = originLongitudeDegrees;
        FalseEastingMetres = falseEastingMetres;
        FalseNorthingMetres = falseNorthingMetres;
    }

    /// <inheritdoc />
    public string MethodName { get; }

    /// <summary>The ellipsoid.</summary>
    public Ellipsoid Ellipsoid { get; }

    /// <summary>Scale factor on the equator k₀.</summary>
    public double ScaleFactor { get; }

    /// <summary>Longitude of natural origin λ₀, degrees.</summary>
    public double OriginLongitudeDegrees { get; }

    /// <summary>False easting, metres.</summary>
    public double FalseEastingMetres { get; }

    /// <summary>False northing, metres.</summary>
    public double FalseNorthingMetres { get; }

    /// <summary>EPSG 9804 (latitude of natural origin must be 0, as the EPSG method requires).</summary>
    public static Mercator VariantA(Ellipsoid ellipsoid, double originLongitudeDegrees, double scaleFactor, double falseEastingMetres, double falseNorthingMetres)
        => new("Mercator (variant A)", ellipsoid, scaleFactor, ellipsoid.FirstEccentricity, originLongitudeDegrees, falseEastingMetres, falseNorthingMetres);

    /// <summary>EPSG 9805: k₀ = cos φ₁/√(1 − e² sin² φ₁) (GN7-2 "Mercator (variant B)").</summary>
    public static Mercator VariantB(Ellipsoid ellipsoid, double standardParallelDegrees, double originLongitudeDegrees, double falseEastingMetres, double falseNorthingMetres)
        => new("Mercator (variant B)", ellipsoid, IsometricLatitude.M(standardParallelDegrees, ellipsoid.FirstEccentricity),
            ellipsoid.FirstEccentricity, originLongitudeDegrees, falseEastingMetres, falseNorthingMetres);

    /// <summary>EPSG 1024: spherical Mercator with R = a on ellipsoidal coordinates (no ellipsoidal terms).</summary>
    public static Mercator PseudoMercator(Ellipsoid ellipsoid, double originLongitudeDegrees, double falseEastingMetres, double falseNorthingMetres)
        => new("Popular Visualisation Pseudo Mercator", ellipsoid, 1.0, 0.0, originLongitudeDegrees, falseEastingMetres, falseNorthingMetres);

    /// <inheritdoc />
    public ProjectedCoordinate Forward(double latitudeDegrees, double longitudeDegrees)
    {
        AngleMath.ValidateLatitude(latitudeDegrees, nameof(latitudeDegrees));
        AngleMath.ValidateFinite(longitudeDegrees, nameof(longitudeDegrees));
        if (Math.Abs(latitudeDegrees) == AngleMath.QuarterTurnDegrees)
            throw new ArgumentOutOfRangeException(nameof(latitudeDegrees), latitudeDegrees, "The poles are at infinity on a Mercator projection.");
        double dLon = AngleMath.LongitudeDifferenceDegrees(longitudeDegrees, OriginLongitudeDegrees) * AngleMath.RadiansPerDegree;
        return new ProjectedCoordinate(FalseEastingMetres + (_ak * dLon), FalseNorthingMetres + (_ak * IsometricLatitude.Psi(latitudeDegrees, _e)));
    }

    /// <inheritdoc />
    public (double LatitudeDegrees, double LongitudeDegrees) Inverse(double eastingMetres, double northingMetres)
    {
        AngleMath.ValidateFinite(eastingMetres, nameof(eastingMetres));
        AngleMath.ValidateFinite(northingMetres, nameof(northingMetres));
        double lat = IsometricLatitude.LatitudeDegrees((northingMetres - FalseNorthingMetres) / _ak, _e);
        double lon = OriginLongitudeDegrees + ((eastingMetres - FalseEastingMetres) / _ak / AngleMath.RadiansPerDegree);
        return (lat, Math.IEEERemainder(lon, AngleMath.FullTurnDegrees));
    }
}
