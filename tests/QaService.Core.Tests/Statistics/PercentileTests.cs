using QaService.Core.Statistics;

namespace QaService.Core.Tests.Statistics;

public class PercentileTests
{
    [Fact]
    public void Synthetic_vector_95th_percentile_of_abs_dz_is_the_type7_value()
    {
        // check-values.md §1, status C: type 7 (h = (n-1)p) 0.062400; nearest rank 0.062000; (n+1)p 0.069600.
        double[] absolute = CheckValueVectors.SyntheticDU.Select(Math.Abs).ToArray();
        double type7 = Percentile.LinearInterpolation(absolute, 0.95);
        Assert.Equal(0.062400, type7, CheckValueVectors.SixDecimals);

        // Nearest rank (Hyndman & Fan type 1, rank ceil(np)) would differ, so the method must be named.
        double[] sorted = absolute.Order().ToArray();
        double nearestRank = sorted[(int)Math.Ceiling(0.95 * sorted.Length) - 1];
        Assert.Equal(0.062000, nearestRank, CheckValueVectors.SixDecimals);
        Assert.NotEqual(nearestRank, type7, 1e-6);
    }

    [Fact]
    public void Agrees_with_MathNet_R7()
    {
        // MathNet.Numerics 5.0.0 QuantileDefinition.R7 is the same estimator (Hyndman & Fan 1996, type 7).
        double[] values = [3.1, -2.0, 7.5, 0.25, 4.0, 4.0, -9.5];
        foreach (double p in new[] { 0.0, 0.1, 0.33, 0.5, 0.9, 0.95, 1.0 })
        {
            double expected = MathNet.Numerics.Statistics.Statistics.QuantileCustom(values.ToArray(), p, MathNet.Numerics.Statistics.QuantileDefinition.R7);
            Assert.Equal(expected, Percentile.LinearInterpolation(values, p), 1e-15);
        }
    }

    [Fact]
    public void Edge_cases()
    {
        Assert.Equal(4.2, Percentile.LinearInterpolation([4.2], 0.0));
        Assert.Equal(4.2, Percentile.LinearInterpolation([4.2], 0.95));
        Assert.Equal(4.2, Percentile.LinearInterpolation([4.2], 1.0));

        double[] unsorted = [5.0, 1.0, 3.0, 2.0];
        double[] copy = unsorted.ToArray();
        Assert.Equal(1.0, Percentile.LinearInterpolation(unsorted, 0.0));
        Assert.Equal(5.0, Percentile.LinearInterpolation(unsorted, 1.0));
        Assert.Equal(2.5, Percentile.LinearInterpolation(unsorted, 0.5)); // h = 1.5 between 2 and 3
        Assert.Equal(copy, unsorted); // input not mutated

        Assert.Throws<ArgumentException>(() => Percentile.LinearInterpolation([], 0.5));
        Assert.Throws<ArgumentException>(() => Percentile.LinearInterpolation([1.0], 1.5));
        Assert.Throws<ArgumentException>(() => Percentile.LinearInterpolation([1.0], double.NaN));
        Assert.Throws<ArgumentException>(() => Percentile.LinearInterpolation([1.0, double.NaN], 0.5));
    }
}
