using QaService.Core.Statistics;

namespace QaService.Core.Tests.Statistics;

/// <summary>
/// The bootstrap's rank tally must give exactly the bounds of the textbook procedure (Efron &amp; Tibshirani 1993, ch. 13:
/// draw n values with replacement, sort, take the type-7 quantile, repeat; percentiles of the estimates), which is
/// written out here independently with the same generator; and above the Monte Carlo limit the order-statistic limit
/// must agree with that procedure to within a few order-statistic steps.
/// </summary>
public sealed class BootstrapTallyTests
{
    private static double[] Sample(int n, ulong seed)
    {
        var random = new SplitMix64(seed);
        // Rounded to 1 mm so ties occur, as in real residuals.
        return Enumerable.Range(0, n).Select(_ => Math.Round(3.0 * (random.Next() >> 11) / (1UL << 53), 3)).ToArray();
    }

    private static (double Lower, double Upper) Textbook(double[] values, double quantile, double level, int resamples, ulong seed)
    {
        var random = new SplitMix64(seed);
        var estimates = new double[resamples];
        var resample = new double[values.Length];
        for (int b = 0; b < resamples; b++)
        {
            for (int i = 0; i < values.Length; i++)
                resample[i] = values[random.NextIndex(values.Length)];
            estimates[b] = Percentile.LinearInterpolation(resample, quantile);
        }
        double tail = (1.0 - level) / 2.0;
        return (Percentile.LinearInterpolation(estimates, tail), Percentile.LinearInterpolation(estimates, 1.0 - tail));
    }

    [Theory]
    [InlineData(24)]
    [InlineData(2)]
    [InlineData(64)]
    [InlineData(65)]
    [InlineData(137)]
    [InlineData(1000)]
    public void Tally_gives_the_same_bounds_as_sorting_every_resample(int n)
    {
        var values = Sample(n, 99);
        Assert.Equal(Textbook(values, 0.95, 0.95, 500, 7), BootstrapInterval.OfQuantile(values, 0.95, 0.95, 500, 7));
        Assert.Equal(Textbook(values, 0.5, 0.9, 300, 11), BootstrapInterval.OfQuantile(values, 0.5, 0.9, 300, 11));
        // Quantiles 0 and 1 (no interpolation) and a lower one, walked from the bottom of the tally.
        Assert.Equal(Textbook(values, 1.0, 0.8, 200, 5), BootstrapInterval.OfQuantile(values, 1.0, 0.8, 200, 5));
        Assert.Equal(Textbook(values, 0.0, 0.8, 200, 5), BootstrapInterval.OfQuantile(values, 0.0, 0.8, 200, 5));
        Assert.Equal(Textbook(values, 0.1, 0.95, 200, 3), BootstrapInterval.OfQuantile(values, 0.1, 0.95, 200, 3));
    }

    /// <summary>
    /// The small-sample path walks many resamples at once in vector lanes: resample counts that leave a part-filled last
    /// vector (101, 131, 2,001), the service's default 2,000, and sample sizes around the lane widths and the path's limit.
    /// </summary>
    [Theory]
    [InlineData(3, 101)]
    [InlineData(16, 131)]
    [InlineData(24, BootstrapInterval.DefaultResamples)]
    [InlineData(31, 2001)]
    [InlineData(33, 100)]
    [InlineData(63, 257)]
    public void Resamples_walked_in_vector_lanes_give_the_textbook_bounds(int n, int resamples)
    {
        var values = Sample(n, 41);
        foreach (var (quantile, level, seed) in new[] { (0.95, 0.95, 1UL), (0.9, 0.9, 2UL), (0.5, 0.95, 3UL), (0.2, 0.8, 4UL), (1.0, 0.95, 5UL), (0.0, 0.9, 6UL) })
            Assert.Equal(Textbook(values, quantile, level, resamples, seed), BootstrapInterval.OfQuantile(values, quantile, level, resamples, seed));
    }

    /// <summary>
    /// Enough draws (resamples × n above a million) that blocks of resamples are drawn side by side, each from its own
    /// generator jumped to the block's first draw: the bounds must still be those of one generator run through in order.
    /// </summary>
    [Theory]
    [InlineData(2100, 600, 0.95)]
    [InlineData(BootstrapInterval.MonteCarloLimit, 150, 0.5)]
    public void Resamples_drawn_side_by_side_give_the_textbook_bounds(int n, int resamples, double quantile)
    {
        var values = Sample(n, 17);
        foreach (var (level, seed) in new[] { (0.95, 23UL), (0.5, 24UL), (0.8, 25UL) })
            Assert.Equal(Textbook(values, quantile, level, resamples, seed), BootstrapInterval.OfQuantile(values, quantile, level, resamples, seed));
    }

    /// <summary>The jump lands where the calls it skips would have (the generator's definition, Steele, Lea &amp; Flood 2014).</summary>
    [Theory]
    [InlineData(0UL, 0UL)]
    [InlineData(20260526UL, 1UL)]
    [InlineData(ulong.MaxValue, 12_345UL)]
    public void Jumping_the_generator_equals_drawing_through(ulong seed, ulong skipped)
    {
        var walked = new SplitMix64(seed);
        for (ulong k = 0; k < skipped; k++)
            walked.Next();
        var jumped = SplitMix64.After(seed, skipped);
        for (int k = 0; k < 5; k++)
            Assert.Equal(walked.Next(), jumped.Next());
    }

    [Fact]
    public void Large_sample_limit_agrees_with_resampling()
    {
        var values = Sample(BootstrapInterval.MonteCarloLimit + 1, 5);
        var limit = BootstrapInterval.OfQuantile(values, 0.95, 0.95);
        var resampled = Textbook(values, 0.95, 0.95, 400, 3);
        // 1 mm rounding on a 0–3 m spread: a few order-statistic steps are a few mm.
        Assert.Equal(resampled.Lower, limit.Lower, 0.01);
        Assert.Equal(resampled.Upper, limit.Upper, 0.01);
        Assert.True(limit.Lower < Percentile.LinearInterpolation(values, 0.95) && Percentile.LinearInterpolation(values, 0.95) < limit.Upper);
    }

    /// <summary>
    /// Above the Monte Carlo limit the bounds are the sample interpolated at ranks h ± z·√(np(1 − p)) (Conover 1999 §3.2),
    /// written out here on a full sort; the service reads the same order statistics by selection, so bit for bit equal.
    /// </summary>
    [Fact]
    public void Large_sample_limit_equals_the_order_statistics_of_a_sort()
    {
        var values = Sample(BootstrapInterval.MonteCarloLimit * 3, 9);
        foreach (var (quantile, level) in new[] { (0.95, 0.95), (0.5, 0.9), (0.99, 0.99), (1.0, 0.95) })
        {
            var sorted = values.ToArray();
            Array.Sort(sorted);
            double At(double z)
            {
                int n = sorted.Length;
                double position = Math.Clamp(((n - 1) * quantile) + (z * Math.Sqrt(n * quantile * (1.0 - quantile))), 0.0, n - 1);
                int below = (int)Math.Floor(position);
                return below >= n - 1 ? sorted[^1] : sorted[below] + ((position - below) * (sorted[below + 1] - sorted[below]));
            }
            double tail = (1 - level) / 2;
            var expected = (At(MathNet.Numerics.Distributions.Normal.InvCDF(0, 1, tail)), At(MathNet.Numerics.Distributions.Normal.InvCDF(0, 1, 1 - tail)));
            Assert.Equal(expected, BootstrapInterval.OfQuantile(values, quantile, level));
        }
    }
}
