namespace QaService.Core.Geodesy.Projections;

/// <summary>
/// Isometric latitude ψ and the quantity t = exp(−ψ) that the conformal projections of EPSG Guidance
/// Note 7-2 (IOGP Publication 373-7-2, sections "Lambert Conic Conformal", "Mercator", "Polar
/// Stereographic") write as t = tan(π/4 − φ/2)/[(1 − e sin φ)/(1 + e sin φ)]^(e/2).
/// </summary>
/// <remarks>
/// Evaluated as ψ = asinh(τ′), τ′ = tan χ the conformal latitude (Karney 2011, doi:10.1007/s00190-011-0445-3, §2),
/// so the inverse is Newton's method on τ′ to full double precision instead of GN7-2's fixed-point
/// iteration on φ (same function, fewer iterations, no loss near the poles). Angles in degrees.
/// </remarks>
internal static class IsometricLatitude
{
    /// <summary>ψ(φ) = asinh(tan χ), dimensionless; ±∞ at the poles.</summary>
    /// <param name="latitudeDegrees">Geodetic latitude, degrees, [−90, 90].</param>
    /// <param name="e">First eccentricity, 0 ≤ e &lt; 1.</param>
    internal static double Psi(double latitudeDegrees, double e)
    {
        if (Math.Abs(latitudeDegrees) == AngleMath.QuarterTurnDegrees)
            return latitudeDegrees > 0 ? double.PositiveInfinity : double.NegativeInfinity;
        (double sin, double cos) = AngleMath.SinCosDegrees(latitudeDegrees);
        return Math.Asinh(ConformalLatitude.TauPrime(sin / cos, e));
    }

    /// <summary>Inverse of <see cref="Psi"/>: geodetic latitude in degrees for isometric latitude ψ.</summary>
    /// <param name="psi">Isometric latitude, any value (±∞ gives ±90°).</param>
    /// <param name="e">First eccentricity, 0 ≤ e &lt; 1.</param>
    internal static double LatitudeDegrees(double psi, double e)
    {
        if (double.IsInfinity(psi))
            return psi > 0 ? AngleMath.QuarterTurnDegrees : -AngleMath.QuarterTurnDegrees;
        double tau = ConformalLatitude.TauFromTauPrime(Math.Sinh(psi), e);
        return Math.Atan(tau) / AngleMath.RadiansPerDegree;
    }

    /// <summary>m = cos φ/√(1 − e² sin² φ) (GN7-2 notation), dimensionless.</summary>
    internal static double M(double latitudeDegrees, double e)
    {
        (double sin, double cos) = AngleMath.SinCosDegrees(latitudeDegrees);
        return cos / Math.Sqrt(1 - (e * e * sin * sin));
    }
}
