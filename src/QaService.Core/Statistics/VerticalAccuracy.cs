using QaService.Core.Standards;

namespace QaService.Core.Statistics;

/// <summary>
/// Vertical block of the report (API contract v1, "Definitions"); property names serialize camelCase to the
/// contract's JSON fields. All lengths in metres; residuals are fix − mark, up positive.
/// </summary>
/// <param name="N">Number of check points with a vertical residual, n ≥ 1.</param>
/// <param name="Mean">Mean vertical residual Σ dU / n.</param>
/// <param name="Sd">Sample standard deviation about the mean, divisor n − 1; null when n &lt; 2.</param>
/// <param name="Rmse">RMSE about zero, sqrt(Σ dU² / n) (FGDC-STD-007.3-1998 appendix 3-A RMSE_z).</param>
/// <param name="Nssda95">NSSDA Accuracy_z = 1.9600·Rmse (<see cref="Nssda.Vertical"/>).</param>
/// <param name="Le90">LE90 = 1.6449·Rmse (<see cref="LinearError.Le90"/>).</param>
/// <param name="P95">Type-7 (h = (n − 1)p) empirical 95th percentile of |dU|.</param>
public sealed record VerticalAccuracy(int N, double Mean, double? Sd, double Rmse, double Nssda95, double Le90, double P95)
{
    /// <summary>Probability of the reported empirical percentile.</summary>
    public const double PercentileProbability = 0.95;

    /// <summary>Computes every vertical figure of the contract from the vertical residuals.</summary>
    /// <param name="dUMetres">Vertical residuals (fix − mark), m, finite, n ≥ 1.</param>
    /// <exception cref="ArgumentException">Empty input or a value that is not finite.</exception>
    public static VerticalAccuracy Compute(ReadOnlySpan<double> dUMetres)
    {
        double rmse = SampleMoments.RootMeanSquareAboutZero(dUMetres);
        int n = dUMetres.Length;
        using var absoluteCopy = new PooledScratch(n);
        Span<double> absolute = absoluteCopy.Span;
        for (int i = 0; i < n; i++)
        {
            absolute[i] = Math.Abs(dUMetres[i]);
        }

        return new VerticalAccuracy(
            N: n,
            Mean: SampleMoments.Mean(dUMetres),
            Sd: n >= 2 ? SampleMoments.SampleStandardDeviation(dUMetres) : null,
            Rmse: rmse,
            Nssda95: Nssda.Vertical(rmse),
            Le90: LinearError.Le90(rmse),
            P95: Percentile.LinearInterpolationInPlace(absolute, PercentileProbability));
    }
}
