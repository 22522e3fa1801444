namespace QaService.Core.Geodesy;

/// <summary>
/// Degree-based trigonometry and argument checks shared by the geodesy algorithms.
/// </summary>
internal static class AngleMath
{
    /// <summary>Degrees in a full turn.</summary>
    internal const double FullTurnDegrees = 360.0;

    /// <summary>Degrees in a half turn.</summary>
    internal const double HalfTurnDegrees = 180.0;

    /// <summary>Degrees in a quarter turn (also the magnitude of the pole latitude).</summary>
    internal const double QuarterTurnDegrees = 90.0;

    /// <summary>Radians per degree, π/180.</summary>
    internal const double RadiansPerDegree = Math.PI / HalfTurnDegrees;

    /// <summary>
    /// sin and cos of an angle given in degrees, with the argument first reduced exactly to
    /// [−45°, 45°] plus a multiple of 90°, so that multiples of 90° give exact 0 and ±1
    /// (technique of C. F. F. Karney, GeographicLib <c>Math::sincosd</c>; reduction by a
    /// multiple of 90 is exact in IEEE double for |x| &lt; 2^52).
    /// </summary>
    /// <param name="degrees">Angle in degrees; must be finite.</param>
    /// <returns>(sin, cos), each in [−1, 1].</returns>
    internal static (double Sin, double Cos) SinCosDegrees(double degrees)
    {
        double r = ReduceToHalfTurn(degrees); // exact, r in [-180, 180]
        double quadrant = Math.Round(r / QuarterTurnDegrees);    // -2 .. 2
        r -= QuarterTurnDegrees * quadrant;                       // exact, r in [-45, 45]
        (double s, double c) = Math.SinCos(r * RadiansPerDegree);
        int q = (int)quadrant & 3;
        (double sin, double cos) = q switch
        {
            0 => (s, c),
            1 => (c, -s),
            2 => (-s, -c),
            _ => (-c, s),
        };
        // Return +0 rather than -0 for cos, matching the usual convention.
        return (sin, cos + 0.0);
    }

    /// <summary>
    /// Longitude difference λ − λ0 reduced to [−180°, 180°] (degrees).
    /// </summary>
    /// <param name="longitudeDegrees">λ, degrees, finite.</param>
    /// <param name="originDegrees">λ0, degrees, finite.</param>
    internal static double LongitudeDifferenceDegrees(double longitudeDegrees, double originDegrees)
        => ReduceToHalfTurn(longitudeDegrees - originDegrees);

    /// <summary>
    /// IEEE remainder of <paramref name="degrees"/> by 360 (IEEE 754 §5.3.1: x − 360·n, n the nearest integer to x/360, ties
    /// to even), so the result is in [−180, 180] and exact. Angles already in range are returned as they are — the same
    /// value the remainder gives (n = 0 for |x| ≤ 180) without its cost (about a third of a batch projection, measured
    /// with bench/QaService.Benchmarks).
    /// </summary>
    internal static double ReduceToHalfTurn(double degrees)
        => Math.Abs(degrees) <= HalfTurnDegrees ? degrees : Math.IEEERemainder(degrees, FullTurnDegrees);

    /// <summary>Throws unless <paramref name="latitudeDegrees"/> is in [−90, 90].</summary>
    internal static void ValidateLatitude(double latitudeDegrees, string paramName)
    {
        if (!(Math.Abs(latitudeDegrees) <= QuarterTurnDegrees))
        {
            throw new ArgumentOutOfRangeException(paramName, latitudeDegrees, "Latitude must be in [-90, 90] degrees.");
        }
    }

    /// <summary>Throws unless <paramref name="value"/> is finite (not NaN or ±∞).</summary>
    internal static void ValidateFinite(double value, string paramName)
    {
        if (!double.IsFinite(value))
        {
            throw new ArgumentOutOfRangeException(paramName, value, "Value must be finite.");
        }
    }
}
