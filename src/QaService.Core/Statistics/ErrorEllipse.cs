namespace QaService.Core.Statistics;

/// <summary>
/// The error ellipse of a zero-mean bivariate normal with covariance M = the second-moment matrix of the
/// horizontal residuals about zero, (1/n) Σ [dE dN]ᵀ[dE dN] (the same matrix as the exact CEP/CE90/R95 radii),
/// scaled so that it holds a stated probability.
/// </summary>
/// <param name="SemiMajorMetres">Semi-major axis, metres, ≥ 0.</param>
/// <param name="SemiMinorMetres">Semi-minor axis, metres, 0 ≤ minor ≤ major.</param>
/// <param name="MajorAxisAzimuthDegrees">Direction of the major axis, degrees clockwise from grid north, in [0, 180).</param>
/// <param name="Probability">Probability the ellipse holds, in (0, 1).</param>
public sealed record ErrorEllipse(double SemiMajorMetres, double SemiMinorMetres, double MajorAxisAzimuthDegrees, double Probability)
{
    /// <summary>Probability of the ellipse drawn in reports, matching the 95 % of the NSSDA figures.</summary>
    public const double ReportProbability = 0.95;

    /// <summary>
    /// Scale factor k from standard (1σ) axes to the ellipse holding probability p: for a bivariate normal the
    /// squared Mahalanobis distance is χ² with 2 degrees of freedom, whose CDF is 1 − exp(−k²/2), so
    /// k = sqrt(−2 ln(1 − p)) (k = 2.4477 at p = 0.95). Source: Mikhail, "Observations and Least Squares"
    /// (1976), ch. on error ellipses (from memory; the χ²₂ quantile is checked against scipy in the tests).
    /// </summary>
    /// <param name="probability">p in (0, 1).</param>
    /// <returns>k, dimensionless.</returns>
    /// <exception cref="ArgumentOutOfRangeException">p outside (0, 1).</exception>
    public static double ScaleFor(double probability)
    {
        if (!(probability > 0.0 && probability < 1.0))
            throw new ArgumentOutOfRangeException(nameof(probability), probability, "the probability must lie in (0, 1)");
        return Math.Sqrt(-2.0 * Math.Log(1.0 - probability));
    }

    /// <summary>
    /// The ellipse holding <paramref name="probability"/> for the second-moment matrix
    /// M = [[meanSquareE, meanProductEN], [meanProductEN, meanSquareN]]. Axes are k·sqrt(eigenvalues)
    /// (<see cref="PrincipalAxes"/>); the major axis azimuth is θ = ½·atan2(2·M₁₂, M₁₁ − M₂₂) measured from east
    /// anticlockwise, converted to degrees clockwise from north (eigenvector of a symmetric 2×2 matrix, closed
    /// form; exact up to rounding). A circular case (M₁₁ = M₂₂, M₁₂ = 0) reports azimuth 0.
    /// </summary>
    /// <param name="meanSquareE">Σ dE² / n, m², ≥ 0.</param>
    /// <param name="meanSquareN">Σ dN² / n, m², ≥ 0.</param>
    /// <param name="meanProductEN">Σ dE·dN / n, m², with M₁₂² ≤ M₁₁M₂₂.</param>
    /// <param name="probability">p in (0, 1).</param>
    /// <exception cref="ArgumentException">As <see cref="PrincipalAxes.FromSecondMoments"/>, or p outside (0, 1).</exception>
    public static ErrorEllipse FromSecondMoments(double meanSquareE, double meanSquareN, double meanProductEN, double probability)
    {
        double k = ScaleFor(probability);
        (double major, double minor) = PrincipalAxes.FromSecondMoments(meanSquareE, meanSquareN, meanProductEN);
        double fromEastRadians = 0.5 * Math.Atan2(2.0 * meanProductEN, meanSquareE - meanSquareN);
        double azimuth = 90.0 - (fromEastRadians * 180.0 / Math.PI);
        azimuth %= 180.0;
        if (azimuth < 0.0)
            azimuth += 180.0;
        return new ErrorEllipse(k * major, k * minor, azimuth, probability);
    }

    /// <summary>The ellipse for paired residuals (fix − mark), metres.</summary>
    /// <param name="dEMetres">East residuals, finite, n ≥ 1.</param>
    /// <param name="dNMetres">North residuals, same length.</param>
    /// <param name="probability">p in (0, 1).</param>
    public static ErrorEllipse FromResiduals(ReadOnlySpan<double> dEMetres, ReadOnlySpan<double> dNMetres, double probability) =>
        FromSecondMoments(
            SampleMoments.MeanSquareAboutZero(dEMetres),
            SampleMoments.MeanSquareAboutZero(dNMetres),
            SampleMoments.MeanProductAboutZero(dEMetres, dNMetres),
            probability);
}
