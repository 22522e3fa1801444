namespace QaService.Core.Statistics;

/// <summary>
/// Moment estimators on plain arrays of residuals. Every method names its estimator: the sample mean,
/// the sample standard deviation about the mean with divisor n − 1 (Bessel-corrected), the population
/// standard deviation with divisor n, and the mean square / root mean square about zero (not about the
/// mean), which is the RMSE of FGDC-STD-007.3-1998 appendix 3-A.
/// </summary>
/// <remarks>
/// Results carry the unit of the input values (metres for residuals). Inputs must be finite; NaN or
/// infinite values throw <see cref="ArgumentException"/>. Sums are plain double sums; the standard
/// deviations use the corrected two-pass algorithm (Chan, Golub &amp; LeVeque 1983, "Algorithms for
/// computing the sample variance", The American Statistician 37(3):242–247, doi:10.1080/00031305.1983.10483115),
/// so their relative error is a few ulps times n for data with a large mean.
/// </remarks>
public static class SampleMoments
{
    /// <summary>Arithmetic mean Σx / n. Requires n ≥ 1.</summary>
    public static double Mean(ReadOnlySpan<double> values)
    {
        RequireFinite(values, minimumCount: 1);
        return Sum(values) / values.Length;
    }

    /// <summary>
    /// Sample standard deviation about the mean with divisor n − 1:
    /// sqrt(Σ(x − x̄)² / (n − 1)). This is the <c>sdE</c>/<c>sdN</c>/<c>sd</c> of the API contract. Requires n ≥ 2.
    /// </summary>
    public static double SampleStandardDeviation(ReadOnlySpan<double> values)
    {
        RequireFinite(values, minimumCount: 2);
        return Math.Sqrt(SumOfSquaredDeviations(values) / (values.Length - 1));
    }

    /// <summary>
    /// Population standard deviation about the mean with divisor n: sqrt(Σ(x − x̄)² / n). Not reported by the
    /// contract; provided so that published tables using this divisor can be reproduced and told apart.
    /// Requires n ≥ 1.
    /// </summary>
    public static double PopulationStandardDeviation(ReadOnlySpan<double> values)
    {
        RequireFinite(values, minimumCount: 1);
        return Math.Sqrt(SumOfSquaredDeviations(values) / values.Length);
    }

    /// <summary>Mean square about zero, Σx² / n. Requires n ≥ 1.</summary>
    public static double MeanSquareAboutZero(ReadOnlySpan<double> values) => MeanProductAboutZero(values, values);

    /// <summary>
    /// Root mean square about zero, sqrt(Σx² / n): the RMSE of FGDC-STD-007.3-1998 appendix 3-A when the
    /// values are residuals (data − check). It is neither the standard deviation nor the mean absolute value.
    /// Requires n ≥ 1.
    /// </summary>
    public static double RootMeanSquareAboutZero(ReadOnlySpan<double> values) => Math.Sqrt(MeanSquareAboutZero(values));

    /// <summary>
    /// Mean cross product about zero, Σ xᵢ yᵢ / n (the off-diagonal of the second-moment matrix about zero).
    /// Both spans must have the same length n ≥ 1.
    /// </summary>
    public static double MeanProductAboutZero(ReadOnlySpan<double> x, ReadOnlySpan<double> y)
    {
        if (x.Length != y.Length)
        {
            throw new ArgumentException($"The two series differ in length ({x.Length} and {y.Length}).", nameof(y));
        }

        RequireFinite(x, minimumCount: 1);
        RequireFinite(y, minimumCount: 1);
        double sum = 0.0;
        for (int i = 0; i < x.Length; i++)
        {
            sum += x[i] * y[i];
        }

        return sum / x.Length;
    }

    private static double Sum(ReadOnlySpan<double> values)
    {
        double sum = 0.0;
        foreach (double v in values)
        {
            sum += v;
        }

        return sum;
    }

    /// <summary>Σ(x − x̄)² by the corrected two-pass algorithm (Chan, Golub &amp; LeVeque 1983, eq. 1.7).</summary>
    private static double SumOfSquaredDeviations(ReadOnlySpan<double> values)
    {
        double mean = Sum(values) / values.Length;
        double sumSquares = 0.0;
        double sumDeviations = 0.0;
        foreach (double v in values)
        {
            double d = v - mean;
            sumSquares += d * d;
            sumDeviations += d;
        }

        return Math.Max(0.0, sumSquares - (sumDeviations * sumDeviations / values.Length));
    }

    internal static void RequireFinite(ReadOnlySpan<double> values, int minimumCount)
    {
        if (values.Length < minimumCount)
        {
            throw new ArgumentException($"At least {minimumCount} value(s) are required; got {values.Length}.", nameof(values));
        }

        for (int i = 0; i < values.Length; i++)
        {
            if (!double.IsFinite(values[i]))
            {
                throw new ArgumentException($"Value {i} is {values[i]}; every value must be finite.", nameof(values));
            }
        }
    }
}
