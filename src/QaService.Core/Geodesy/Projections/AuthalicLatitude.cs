namespace QaService.Core.Geodesy.Projections;

/// <summary>
/// The equal-area quantity q(φ) (EPSG Guidance Note 7-2 writes it q for Lambert Azimuthal Equal Area
/// and α for Albers; Snyder 1987, USGS PP 1395, eq. 3-12, p. 187) and its inverses.
/// </summary>
internal static class AuthalicLatitude
{
    /// <summary>Newton steps allowed for <see cref="LatitudeFromQExact"/>; PROJ 9.1.1 <c>phi1_</c> allows 15, it converges in 3–5.</summary>
    private const int MaxIterations = 15;

    /// <summary>Stop when the Newton step is below this, radians (1e-14 rad ≈ 0.06 nm on the Earth).</summary>
    private const double StepToleranceRadians = 1e-14;

    /// <summary>q = (1 − e²)[sin φ/(1 − e² sin² φ) + atanh(e sin φ)/e], dimensionless; 2 sin φ on a sphere.</summary>
    /// <param name="latitudeDegrees">Geodetic latitude, degrees.</param>
    /// <param name="e">First eccentricity, 0 ≤ e &lt; 1.</param>
    internal static double Q(double latitudeDegrees, double e)
    {
        double s = AngleMath.SinCosDegrees(latitudeDegrees).Sin;
        return QFromSin(s, e);
    }

    /// <summary>q as a function of sin φ.</summary>
    internal static double QFromSin(double s, double e)
    {
        if (e == 0)
            return 2 * s;
        double e2 = e * e;
        return (1 - e2) * ((s / (1 - (e2 * s * s))) + (Math.Atanh(e * s) / e));
    }

    /// <summary>
    /// Geodetic latitude from the authalic latitude β by the series of EPSG Guidance Note 7-2, section
    /// "Lambert Azimuthal Equal Area" (terms to e⁶; the truncated e⁸ term is at most ≈ 1.3e-10 rad, 0.9 mm,
    /// at |β| = 45° for GRS 80). PROJ 9.1.1 (<c>pj_authlat</c>) uses the same series, so results agree with it.
    /// </summary>
    /// <param name="betaRadians">Authalic latitude β, radians.</param>
    /// <param name="e">First eccentricity.</param>
    /// <returns>Geodetic latitude, degrees.</returns>
    internal static double LatitudeFromBetaSeries(double betaRadians, double e)
    {
        double e2 = e * e, e4 = e2 * e2, e6 = e4 * e2;
        double phi = betaRadians
            + (((e2 / 3) + (31 * e4 / 180) + (517 * e6 / 5040)) * Math.Sin(2 * betaRadians))
            + (((23 * e4 / 360) + (251 * e6 / 3780)) * Math.Sin(4 * betaRadians))
            + (761 * e6 / 45360 * Math.Sin(6 * betaRadians));
        return phi / AngleMath.RadiansPerDegree;
    }

    /// <summary>
    /// Geodetic latitude for a given q by Newton's method, Snyder (1987) eq. 3-16, p. 188 (as PROJ 9.1.1
    /// <c>phi1_</c> for Albers). Exact to rounding; |q| at or beyond q(90°) gives ±90°.
    /// </summary>
    /// <param name="q">q, |q| ≤ q(90°).</param>
    /// <param name="e">First eccentricity.</param>
    /// <returns>Geodetic latitude, degrees.</returns>
    internal static double LatitudeFromQExact(double q, double e)
    {
        double qPole = QFromSin(1, e);
        if (Math.Abs(q) >= qPole)
            return Math.CopySign(AngleMath.QuarterTurnDegrees, q);
        if (e == 0)
            return Math.Asin(q / 2) / AngleMath.RadiansPerDegree;
        double e2 = e * e;
        double phi = Math.Asin(q / 2);
        for (int i = 0; i < MaxIterations; i++)
        {
            (double s, double c) = Math.SinCos(phi);
            double w = 1 - (e2 * s * s);
            double step = w * w / (2 * c) * ((q / (1 - e2)) - (s / w) - (Math.Atanh(e * s) / e));
            phi += step;
            if (!(Math.Abs(step) > StepToleranceRadians))
                break;
        }

        return phi / AngleMath.RadiansPerDegree;
    }
}
