namespace QaService.Core.Standards;

/// <summary>
/// LE90, the one-dimensional (vertical) error at 90 % probability, and its NMAS form VMAS.
/// </summary>
/// <remarks>
/// US National Map Accuracy Standards (1947): no more than 10 % of tested elevations in error by more than half
/// the contour interval. FGDC-STD-007.3-1998 (informative appendix relating NSSDA to other standards) expresses
/// this as VMAS = 1.6449·RMSE_z and Accuracy_z = 1.1916·VMAS, assuming normal, unbiased errors; 1.6449 ≈ Φ⁻¹(0.95)
/// = 1.644854. The same factor gives LE90 from RMSE (e.g. NGDC GLOBE documentation on DTED: "±30 m LE90 ≈ RMSE 18 m").
/// Appendix letter and wording from memory (check-values §1 and §3: factor V for LE90, section M).
/// </remarks>
public static class LinearError
{
    /// <summary>1.6449 ≈ Φ⁻¹(0.95): LE90 = VMAS = 1.6449·RMSE_z.</summary>
    public const double Le90Factor = 1.6449;

    /// <summary>LE90 = 1.6449·RMSE_z (the contract's vertical <c>le90</c>); exact multiplication.</summary>
    /// <param name="rmseZMetres">RMSE about zero of the vertical residuals, m, finite, ≥ 0.</param>
    /// <returns>LE90 in metres.</returns>
    public static double Le90(double rmseZMetres)
    {
        Nssda.RequireRmse(rmseZMetres);
        return Le90Factor * rmseZMetres;
    }
}
