using QaService.Core.Statistics;

namespace QaService.Core.Standards;

/// <summary>
/// FGDC-STD-007.3-1998, Geospatial Positioning Accuracy Standards Part 3: National Standard for Spatial Data
/// Accuracy (NSSDA). Accuracy is reported at 95 % confidence in ground units from the RMSE of at least 20 check
/// points (section 3.2.1 spatial accuracy, section 3.2.2 test guidelines; statistics in appendix 3-A).
/// The standard itself sets no pass/fail thresholds.
/// </summary>
public static class Nssda
{
    /// <summary>
    /// 2.4477 = sqrt(−2 ln 0.05) (2.44775 unrounded): the radius holding 95 % of a circular normal, in units of
    /// the per-axis σ. Appendix 3-A: Accuracy_r = 2.4477·RMSE_x when RMSE_x = RMSE_y (after Greenwalt &amp; Schultz 1968).
    /// </summary>
    public const double HorizontalFactor = 2.4477;

    /// <summary>
    /// 1.7308 = 2.4477/√2: Accuracy_r = 1.7308·RMSE_r when RMSE_x = RMSE_y (appendix 3-A). Beware the 1.7808
    /// misprint seen in circulation.
    /// </summary>
    public const double HorizontalRadialFactor = 1.7308;

    /// <summary>1.9600 = Φ⁻¹(0.975): Accuracy_z = 1.9600·RMSE_z for normal, unbiased vertical errors (appendix 3-A).</summary>
    public const double VerticalFactor = 1.9600;

    /// <summary>At least 20 check points (section 3.2.2).</summary>
    public const int MinimumCheckPoints = 20;

    /// <summary>
    /// Appendix 3-A case 2 applies the approximation 2.4477·0.5·(RMSE_x + RMSE_y) only for
    /// 0.6 ≤ RMSE_min/RMSE_max ≤ 1.0; at 0.6 it underestimates the exact 95 % radius by 5.9 % (check-values §1, C).
    /// </summary>
    public const double ApproximationRatioLimit = 0.6;

    /// <summary>Confidence level of every NSSDA figure.</summary>
    public const double ConfidenceLevel = 0.95;

    /// <summary>Method label: the appendix 3-A approximation 2.4477·0.5·(RMSE_x + RMSE_y).</summary>
    public const string ApproximateMethod = "approx";

    /// <summary>Method label: the exact 95 % radius of N(0, diag(RMSE_x², RMSE_y²)).</summary>
    public const string ExactMethod = "exact";

    /// <summary>
    /// NSSDA horizontal accuracy at 95 % confidence (the contract's <c>nssda95</c> and <c>nssdaMethod</c>).
    /// With r = min/max of the two RMSEs: r ≥ <see cref="ApproximationRatioLimit"/> → 2.4477·0.5·(rmseE + rmseN),
    /// "approx" (appendix 3-A cases 1 and 2; equals 1.7308·RMSE_r when rmseE = rmseN); r &lt; 0.6, where appendix 3-A
    /// gives no formula → the exact 95 % radius of a zero-mean normal with independent standard deviations rmseE
    /// and rmseN (<see cref="CircularErrorRadius.Exact"/>, relative accuracy 1e-9), "exact". Both zero → (0, "approx").
    /// </summary>
    /// <param name="rmseEMetres">RMSE about zero of the east residuals, m, finite, ≥ 0.</param>
    /// <param name="rmseNMetres">RMSE about zero of the north residuals, m, finite, ≥ 0.</param>
    /// <returns>Accuracy_r in metres and the method label.</returns>
    /// <exception cref="ArgumentException">NaN, negative or infinite input.</exception>
    public static (double Accuracy95Metres, string Method) Horizontal(double rmseEMetres, double rmseNMetres)
    {
        CircleProbability.RequireSigmas(rmseEMetres, rmseNMetres);
        double larger = Math.Max(rmseEMetres, rmseNMetres);
        if (larger == 0.0 || Math.Min(rmseEMetres, rmseNMetres) / larger >= ApproximationRatioLimit)
        {
            return (HorizontalFactor * 0.5 * (rmseEMetres + rmseNMetres), ApproximateMethod);
        }

        return (CircularErrorRadius.Exact(ConfidenceLevel, rmseEMetres, rmseNMetres), ExactMethod);
    }

    /// <summary>NSSDA vertical accuracy at 95 % confidence, Accuracy_z = 1.9600·RMSE_z (appendix 3-A).</summary>
    /// <param name="rmseZMetres">RMSE about zero of the vertical residuals, m, finite, ≥ 0.</param>
    /// <returns>Accuracy_z in metres (exact multiplication).</returns>
    /// <exception cref="ArgumentException">NaN, negative or infinite input.</exception>
    public static double Vertical(double rmseZMetres)
    {
        RequireRmse(rmseZMetres);
        return VerticalFactor * rmseZMetres;
    }

    internal static void RequireRmse(double rmseMetres)
    {
        if (!(rmseMetres >= 0.0 && double.IsFinite(rmseMetres)))
        {
            throw new ArgumentException($"RMSE {rmseMetres} m must be finite and ≥ 0.", nameof(rmseMetres));
        }
    }
}
