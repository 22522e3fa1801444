namespace QaService.Core.Geodesy;

/// <summary>
/// An oblate ellipsoid of revolution, defined (as in the EPSG dataset and EPSG Guidance Note 7-2)
/// by its semi-major axis <c>a</c> and inverse flattening <c>1/f</c>.
/// </summary>
/// <param name="Name">Human-readable name, e.g. "WGS 84".</param>
/// <param name="SemiMajorAxisMetres">Equatorial radius <c>a</c> in metres; must be finite and &gt; 0.</param>
/// <param name="InverseFlattening">
/// <c>1/f</c> (dimensionless). Must be &gt; 1 for an oblate ellipsoid; <see cref="double.PositiveInfinity"/> denotes a sphere (f = 0).
/// Prolate ellipsoids (f &lt; 0) are not supported.
/// </param>
/// <remarks>
/// Derived quantities (standard definitions, e.g. EPSG Guidance Note 7-2 and Karney 2011, doi:10.1007/s00190-011-0445-3): f = 1/(1/f), b = a(1 − f), e² = f(2 − f),
/// e′² = e²/(1 − e²), n = f/(2 − f). The record's equality uses only the three primary parameters.
/// Validation of the parameters happens in the algorithms that consume the ellipsoid
/// (<see cref="Validate"/>), so <c>default(Ellipsoid)</c> is representable but rejected when used.
/// </remarks>
public readonly record struct Ellipsoid(string Name, double SemiMajorAxisMetres, double InverseFlattening)
{
    /// <summary>WGS 84 semi-major axis, metres (EPSG::7030; NIMA TR8350.2, 3rd ed., Table 3.1).</summary>
    public const double Wgs84SemiMajorAxisMetres = 6378137.0;

    /// <summary>WGS 84 inverse flattening (EPSG::7030; NIMA TR8350.2, 3rd ed., Table 3.1).</summary>
    public const double Wgs84InverseFlattening = 298.257223563;

    /// <summary>GRS 80 semi-major axis, metres (EPSG::7019; Moritz, Geodetic Reference System 1980, Bull. Géod. 54:395).</summary>
    public const double Grs80SemiMajorAxisMetres = 6378137.0;

    /// <summary>GRS 80 inverse flattening as tabulated by EPSG::7019 (derived from J2 in Moritz 1980).</summary>
    public const double Grs80InverseFlattening = 298.257222101;

    /// <summary>The WGS 84 ellipsoid (EPSG::7030): a = 6 378 137 m, 1/f = 298.257223563.</summary>
    public static Ellipsoid Wgs84 { get; } = new("WGS 84", Wgs84SemiMajorAxisMetres, Wgs84InverseFlattening);

    /// <summary>The GRS 1980 ellipsoid (EPSG::7019): a = 6 378 137 m, 1/f = 298.257222101.</summary>
    public static Ellipsoid Grs80 { get; } = new("GRS 1980", Grs80SemiMajorAxisMetres, Grs80InverseFlattening);

    /// <summary>Flattening f = (a − b)/a (dimensionless); 0 for a sphere.</summary>
    public double Flattening => 1.0 / InverseFlattening;

    /// <summary>Semi-minor (polar) axis b = a(1 − f), metres.</summary>
    public double SemiMinorAxisMetres => SemiMajorAxisMetres * (1.0 - Flattening);

    /// <summary>First eccentricity squared e² = f(2 − f) (dimensionless).</summary>
    public double FirstEccentricitySquared => Flattening * (2.0 - Flattening);

    /// <summary>First eccentricity e = √(e²) (dimensionless).</summary>
    public double FirstEccentricity => Math.Sqrt(FirstEccentricitySquared);

    /// <summary>Second eccentricity squared e′² = e²/(1 − e²) (dimensionless).</summary>
    public double SecondEccentricitySquared => FirstEccentricitySquared / (1.0 - FirstEccentricitySquared);

    /// <summary>Third flattening n = (a − b)/(a + b) = f/(2 − f) (dimensionless), the expansion parameter of the Krüger series.</summary>
    public double ThirdFlattening => Flattening / (2.0 - Flattening);

    /// <summary>
    /// Throws <see cref="ArgumentOutOfRangeException"/> unless a is finite and positive and 1/f is &gt; 1
    /// (finite) or +∞ (sphere).
    /// </summary>
    /// <param name="paramName">Name of the argument being validated, for the exception.</param>
    public void Validate(string paramName)
    {
        if (!(double.IsFinite(SemiMajorAxisMetres) && SemiMajorAxisMetres > 0))
        {
            throw new ArgumentOutOfRangeException(paramName, SemiMajorAxisMetres, "Semi-major axis must be finite and positive (metres).");
        }

        if (!(InverseFlattening > 1.0))
        {
            throw new ArgumentOutOfRangeException(paramName, InverseFlattening, "Inverse flattening must be > 1 (oblate) or +Infinity (sphere).");
        }
    }
}
