using QaService.Core.Standards;

namespace QaService.Core.Statistics;

/// <summary>
/// Horizontal block of the report (API contract v1, "Definitions"); property names serialize camelCase to the
/// contract's JSON fields. All lengths in metres. Residuals are fix − mark in the local east-north frame.
/// </summary>
/// <param name="N">Number of check points, n ≥ 1.</param>
/// <param name="MeanE">Mean east residual Σ dE / n.</param>
/// <param name="MeanN">Mean north residual.</param>
/// <param name="SdE">Sample standard deviation of dE about its mean, divisor n − 1; null when n &lt; 2.</param>
/// <param name="SdN">Sample standard deviation of dN, divisor n − 1; null when n &lt; 2.</param>
/// <param name="RmseE">RMSE about zero, sqrt(Σ dE² / n) (FGDC-STD-007.3-1998 appendix 3-A).</param>
/// <param name="RmseN">RMSE about zero, sqrt(Σ dN² / n).</param>
/// <param name="RmseR">sqrt(RmseE² + RmseN²) (appendix 3-A RMSE_r; equals DRMS).</param>
/// <param name="Nssda95">NSSDA Accuracy_r at 95 % (<see cref="Nssda.Horizontal"/>).</param>
/// <param name="NssdaMethod">"approx" (appendix 3-A formula) or "exact" (ratio &lt; 0.6: exact radius).</param>
/// <param name="Cep50">Exact radius holding 50 % of N(0, M), M the second-moment matrix about zero (1/n)Σ[dE dN]ᵀ[dE dN].</param>
/// <param name="R95">Exact radius holding 95 % of N(0, M).</param>
/// <param name="Ce90">Exact radius holding 90 % of N(0, M).</param>
/// <param name="Drms">Distance root mean square, sqrt(Σ(dE² + dN²) / n) = RmseR.</param>
/// <param name="TwoDrms">2·Drms.</param>
/// <param name="P50">Type-7 (h = (n − 1)p) empirical 50th percentile of dH = sqrt(dE² + dN²).</param>
/// <param name="P90">Type-7 empirical 90th percentile of dH.</param>
/// <param name="P95">Type-7 empirical 95th percentile of dH.</param>
public sealed record HorizontalAccuracy(
    int N,
    double MeanE,
    double MeanN,
    double? SdE,
    double? SdN,
    double RmseE,
    double RmseN,
    double RmseR,
    double Nssda95,
    string NssdaMethod,
    double Cep50,
    double R95,
    double Ce90,
    double Drms,
    double TwoDrms,
    double P50,
    double P90,
    double P95)
{
    /// <summary>Probability held by the CEP circle.</summary>
    public const double CepProbability = 0.50;

    /// <summary>Probability held by the CE90 circle.</summary>
    public const double Ce90Probability = 0.90;

    /// <summary>Probability held by the R95 circle.</summary>
    public const double R95Probability = 0.95;

    /// <summary>
    /// Computes every horizontal figure of the contract from paired residuals. The exact radii have relative
    /// accuracy 1e-9 (<see cref="CircularErrorRadius"/>); the other figures are direct sums.
    /// </summary>
    /// <param name="dEMetres">East residuals (fix − mark), m, finite, n ≥ 1.</param>
    /// <param name="dNMetres">North residuals, m, finite, same length and order as <paramref name="dEMetres"/>.</param>
    /// <exception cref="ArgumentException">Empty input, different lengths, or a value that is not finite.</exception>
    public static HorizontalAccuracy Compute(ReadOnlySpan<double> dEMetres, ReadOnlySpan<double> dNMetres)
    {
        double meanSquareE = SampleMoments.MeanSquareAboutZero(dEMetres);
        double meanSquareN = SampleMoments.MeanSquareAboutZero(dNMetres);
        double meanProductEN = SampleMoments.MeanProductAboutZero(dEMetres, dNMetres);
        int n = dEMetres.Length;
        double rmseE = Math.Sqrt(meanSquareE);
        double rmseN = Math.Sqrt(meanSquareN);
        double drms = Math.Sqrt(meanSquareE + meanSquareN);
        (double nssda95, string method) = Nssda.Horizontal(rmseE, rmseN);

        using var radialCopy = new PooledScratch(n);
        Span<double> radial = radialCopy.Span;
        for (int i = 0; i < n; i++)
        {
            radial[i] = double.Hypot(dEMetres[i], dNMetres[i]);
        }

        // The three percentiles by selection in ascending order instead of a sort: the same order statistics, so the
        // same values (dH ≥ +0, so there is no −0 whose place a sort might choose differently).
        var ranks = new OrderStatistic.AscendingRanks(radial);
        double p50 = Percentile.LinearInterpolation(ref ranks, n, CepProbability);
        double p90 = Percentile.LinearInterpolation(ref ranks, n, Ce90Probability);
        double p95 = Percentile.LinearInterpolation(ref ranks, n, R95Probability);

        return new HorizontalAccuracy(
            N: n,
            MeanE: SampleMoments.Mean(dEMetres),
            MeanN: SampleMoments.Mean(dNMetres),
            SdE: n >= 2 ? SampleMoments.SampleStandardDeviation(dEMetres) : null,
            SdN: n >= 2 ? SampleMoments.SampleStandardDeviation(dNMetres) : null,
            RmseE: rmseE,
            RmseN: rmseN,
            RmseR: drms,
            Nssda95: nssda95,
            NssdaMethod: method,
            Cep50: CircularErrorRadius.FromSecondMoments(CepProbability, meanSquareE, meanSquareN, meanProductEN),
            R95: CircularErrorRadius.FromSecondMoments(R95Probability, meanSquareE, meanSquareN, meanProductEN),
            Ce90: CircularErrorRadius.FromSecondMoments(Ce90Probability, meanSquareE, meanSquareN, meanProductEN),
            Drms: drms,
            TwoDrms: 2.0 * drms,
            P50: p50,
            P90: p90,
            P95: p95);
    }
}
