namespace QaService.Core.Statistics;

/// <summary>Principal standard deviations of a symmetric positive semi-definite 2×2 second-moment matrix.</summary>
public static class PrincipalAxes
{
    /// <summary>Relative slack allowed for a determinant made slightly negative by rounding.</summary>
    private const double DeterminantRoundingTolerance = 1e-12;

    /// <summary>
    /// Square roots of the eigenvalues of M = [[meanSquareE, meanProductEN], [meanProductEN, meanSquareN]]:
    /// λ₁ = (a + b)/2 + hypot((a − b)/2, c) and λ₂ = det(M)/λ₁ (computed from the determinant to avoid
    /// cancellation when λ₂ ≪ λ₁). Closed-form eigenvalues of a symmetric 2×2 matrix; exact up to a few ulps.
    /// </summary>
    /// <param name="meanSquareE">M₁₁, e.g. Σ dE² / n, in squared length units (m²), ≥ 0.</param>
    /// <param name="meanSquareN">M₂₂, e.g. Σ dN² / n (m²), ≥ 0.</param>
    /// <param name="meanProductEN">M₁₂ = M₂₁, e.g. Σ dE·dN / n (m²), with M₁₂² ≤ M₁₁M₂₂ (up to rounding).</param>
    /// <returns>(major, minor) standard deviations in the length unit (m), major ≥ minor ≥ 0.</returns>
    /// <exception cref="ArgumentException">NaN or infinite input, a negative diagonal, or a matrix that is not positive semi-definite.</exception>
    public static (double Major, double Minor) FromSecondMoments(double meanSquareE, double meanSquareN, double meanProductEN)
    {
        if (!(meanSquareE >= 0.0 && double.IsFinite(meanSquareE)))
        {
            throw new ArgumentException($"meanSquareE = {meanSquareE}; it must be finite and ≥ 0.", nameof(meanSquareE));
        }

        if (!(meanSquareN >= 0.0 && double.IsFinite(meanSquareN)))
        {
            throw new ArgumentException($"meanSquareN = {meanSquareN}; it must be finite and ≥ 0.", nameof(meanSquareN));
        }

        if (!double.IsFinite(meanProductEN))
        {
            throw new ArgumentException($"meanProductEN = {meanProductEN}; it must be finite.", nameof(meanProductEN));
        }

        double diagonalProduct = meanSquareE * meanSquareN;
        double determinant = diagonalProduct - (meanProductEN * meanProductEN);
        if (determinant < -DeterminantRoundingTolerance * diagonalProduct || (diagonalProduct == 0.0 && meanProductEN != 0.0))
        {
            throw new ArgumentException(
                $"The second-moment matrix [[{meanSquareE}, {meanProductEN}], [{meanProductEN}, {meanSquareN}]] is not positive semi-definite.",
                nameof(meanProductEN));
        }

        double major = ((meanSquareE + meanSquareN) / 2.0) + double.Hypot((meanSquareE - meanSquareN) / 2.0, meanProductEN);
        double minor = major > 0.0 ? Math.Max(determinant, 0.0) / major : 0.0;
        return (Math.Sqrt(major), Math.Min(Math.Sqrt(minor), Math.Sqrt(major)));
    }
}
