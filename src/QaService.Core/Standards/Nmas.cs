namespace QaService.Core.Standards;

/// <summary>
/// Horizontal conversions between the US National Map Accuracy Standards (1947) circular map accuracy
/// standard (CMAS, 90 %) and NSSDA, as stated in the informative appendix of FGDC-STD-007.3-1998 that relates
/// NSSDA to other standards (appendix letter from memory; check-values §1, factors C). Valid for circular normal
/// errors with RMSE_x = RMSE_y. The vertical factor is <see cref="LinearError.Le90Factor"/>.
/// </summary>
public static class Nmas
{
    /// <summary>2.1460 ≈ sqrt(−2 ln 0.10) = 2.145966: CMAS = CE90 = 2.1460·RMSE_x (circular errors).</summary>
    public const double CircularMapAccuracyFactor = 2.1460;

    /// <summary>CMAS (90 %) from RMSE_r when RMSE_x = RMSE_y: CMAS = 2.1460·RMSE_r/√2 (= 1.5175·RMSE_r).</summary>
    /// <param name="rmseRadial">RMSE_r in any length unit (result in the same unit), finite, ≥ 0.</param>
    public static double CmasFromRadialRmse(double rmseRadial)
    {
        Nssda.RequireRmse(rmseRadial);
        return CircularMapAccuracyFactor * rmseRadial / Math.Sqrt(2.0);
    }

    /// <summary>RMSE_r from CMAS (inverse of <see cref="CmasFromRadialRmse"/>).</summary>
    /// <param name="cmas">CMAS in any length unit, finite, ≥ 0.</param>
    public static double RadialRmseFromCmas(double cmas)
    {
        Nssda.RequireRmse(cmas);
        return cmas * Math.Sqrt(2.0) / CircularMapAccuracyFactor;
    }
}
