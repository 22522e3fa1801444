using System.Buffers;

namespace QaService.Core.Statistics;

/// <summary>
/// Percentile bootstrap confidence interval (Efron &amp; Tibshirani 1993, An Introduction to the Bootstrap, Chapman &amp; Hall,
/// ch. 13) for the empirical p-quantile (type 7, <see cref="Percentile"/>) of a sample, e.g. the 95 % radius of dH.
/// Deterministic: resamples are drawn with <see cref="SplitMix64"/> from a fixed seed, so the same data give the same
/// interval. Monte Carlo error of each bound with 2,000 resamples is about one order-statistic step.
/// Needs no distributional assumption, but with n &lt; 20 the 95th percentile sits on the largest one or two values
/// and the interval is wide and ragged — read it as indicative.
/// Cost: each resample is tallied by rank (one sort of the sample, then O(n) per resample, the same draws and so the
/// same bounds as sorting every resample). Above <see cref="MonteCarloLimit"/> values the resampling is replaced by the
/// large-sample limit it converges to: the bootstrap distribution of the order statistic x*₍ₖ₎ is that of
/// Binomial(n, j/n) ≥ k (Hutson &amp; Ernst 2000, "The exact bootstrap mean and variance of an L-estimator", J. R. Stat.
/// Soc. B 62(1):89–94, doi:10.1111/1467-9868.00221), which for large n is normal with rank spread √(np(1 − p));
/// the bounds are the type-7 interpolated order statistics at ranks h ± z·√(np(1 − p)) (the distribution-free quantile
/// interval, Conover 1999, Practical Nonparametric Statistics, 3rd ed., §3.2), four order statistics read by selection, O(n),
/// not a sort. Relative rank error O(1/√n).
/// </summary>
public static class BootstrapInterval
{
    /// <summary>Resamples drawn (Efron &amp; Tibshirani recommend ≥ 1,000 for percentile intervals).</summary>
    public const int DefaultResamples = 2000;

    /// <summary>Fixed seed of the report's bootstrap (any constant; fixed so reports are reproducible).</summary>
    public const ulong DefaultSeed = 20260526;

    /// <summary>
    /// Largest sample resampled by Monte Carlo (2,000 × n draws ≈ 0.1 s at the limit on this machine); larger samples use
    /// the order-statistic limit, whose rank error 1/√n is then below 1 %.
    /// </summary>
    public const int MonteCarloLimit = 10_000;

    /// <summary>Two-sided percentile-bootstrap interval of the type-7 <paramref name="quantile"/> of <paramref name="values"/>.</summary>
    /// <param name="values">Sample, finite, n ≥ 2, any unit (the bounds have the same unit).</param>
    /// <param name="quantile">Quantile probability, e.g. 0.95.</param>
    /// <param name="level">Confidence in (0, 1), e.g. 0.95.</param>
    /// <param name="resamples">Number of bootstrap resamples, ≥ 100.</param>
    /// <param name="seed">Generator seed.</param>
    public static (double Lower, double Upper) OfQuantile(ReadOnlySpan<double> values, double quantile, double level,
        int resamples = DefaultResamples, ulong seed = DefaultSeed)
    {
        SampleMoments.RequireFinite(values, minimumCount: 2);
        Percentile.RequireProbability(quantile);
        if (!(level > 0.0 && level < 1.0))
            throw new ArgumentException($"Confidence {level} must be in (0, 1).", nameof(level));
        if (resamples < 100)
            throw new ArgumentException($"{resamples} resamples are too few; use at least 100.", nameof(resamples));

        int n = values.Length;
        double tail = (1.0 - level) / 2.0;
        if (n > MonteCarloLimit)
        {
            // The limit needs four order statistics, not the whole order: selected in ascending rank (the lower bound's
            // ranks come first, z < 0), they are the values a sort would give.
            using var copy = PooledScratch.CopyOf(values);
            var ranks = new OrderStatistic.AscendingRanks(copy.Span);
            double lowerBound = AtRank(ref ranks, n, quantile, MathNet.Numerics.Distributions.Normal.InvCDF(0.0, 1.0, tail));
            return (lowerBound, AtRank(ref ranks, n, quantile, MathNet.Numerics.Distributions.Normal.InvCDF(0.0, 1.0, 1.0 - tail)));
        }

        double h = (n - 1) * quantile;
        int lower = Math.Min((int)Math.Floor(h), n - 1);
        double fraction = h - lower;
        if (n <= ResampleColumns.MaximumSample)
            return FromPairCounts(values, lower, fraction, resamples, seed, tail);

        var sorted = values.ToArray();
        var rank = new int[n];
        for (int i = 0; i < n; i++)
            rank[i] = i;
        Array.Sort(sorted, rank);

        // positionOf[i]: where values[i] sits in sorted order, so a draw of index i is tallied at its rank.
        var positionOf = new int[n];
        for (int r = 0; r < n; r++)
            positionOf[rank[r]] = r;
        var estimates = new double[resamples];
        DrawEstimates(sorted, positionOf, lower, fraction, seed, estimates);
        Array.Sort(estimates);
        return (Percentile.LinearInterpolationOfSorted(estimates, tail), Percentile.LinearInterpolationOfSorted(estimates, 1.0 - tail));
    }

    /// <summary>
    /// The small-sample path: each resample's estimate is fixed by the two ranks it interpolates between, so resamples
    /// are counted per rank pair (at most n² pairs, a few dozen in practice) and the bounds are read from the distinct
    /// estimates and their counts: the same two order statistics, interpolated by the same expression, as sorting all
    /// resamples' estimates. Working arrays are rented, so a small assessment allocates nothing here.
    /// </summary>
    private static (double Lower, double Upper) FromPairCounts(ReadOnlySpan<double> values, int lower, double fraction,
        int resamples, ulong seed, double tail)
    {
        int n = values.Length;
        using var sorted = PooledScratch.CopyOf(values);
        var rank = ArrayPool<int>.Shared.Rent(n);
        var pairCounts = ArrayPool<int>.Shared.Rent(n * n);
        try
        {
            for (int i = 0; i < n; i++)
                rank[i] = i;
            sorted.Span.Sort(rank.AsSpan(0, n));
            Array.Clear(pairCounts, 0, n * n);

            // The draws depend only on (n, resamples, seed), so their per-index counts are computed once per process and
            // shared (exactly the same draws, in the same order, as drawing them here).
            var columns = ResampleColumns.Draws(n, resamples, seed);
            ResampleColumns.CountRankPairs(columns, resamples, rank.AsSpan(0, n), n, lower, fraction != 0.0 && lower + 1 < n, pairCounts);
            return DistinctEstimates.Bounds(sorted.Span, pairCounts, lower, fraction, resamples, tail);
        }
        finally
        {
            ArrayPool<int>.Shared.Return(pairCounts);
            ArrayPool<int>.Shared.Return(rank);
        }
    }

    /// <summary>Fewest draws (resamples × n) worth spreading over the processors: about 5 ms of drawing (common practice).</summary>
    private const long ParallelDrawsThreshold = 1L << 20;

    /// <summary>Blocks of resamples per processor, so that a worker slowed by other load does not hold up the rest.</summary>
    private const int BlocksPerProcessor = 4;

    /// <summary>
    /// Every resample's estimate, unsorted, into <paramref name="estimates"/>[b]. Resample b takes the generator's outputs
    /// b·n … b·n + n − 1, so a block of resamples starts its own generator there (<see cref="SplitMix64.After"/>) and draws
    /// exactly what one generator running through all resamples in order would: the blocks run side by side and the
    /// estimates, each written by one block, are the same bits whatever the scheduling.
    /// </summary>
    private static void DrawEstimates(double[] sorted, int[] positionOf, int lower, double fraction, ulong seed, double[] estimates)
    {
        int n = sorted.Length, resamples = estimates.Length;
        bool worthIt = (long)n * resamples >= ParallelDrawsThreshold;
        int blocks = worthIt ? Math.Min(resamples, Environment.ProcessorCount * BlocksPerProcessor) : 1;
        var work = new Action[blocks];
        for (int k = 0; k < blocks; k++)
        {
            int first = (int)((long)resamples * k / blocks), end = (int)((long)resamples * (k + 1) / blocks);
            work[k] = () =>
            {
                var random = SplitMix64.After(seed, (ulong)first * (ulong)n);
                var tally = new int[n];
                for (int b = first; b < end; b++)
                {
                    Array.Clear(tally);
                    for (int i = 0; i < n; i++)
                        tally[positionOf[random.NextIndex(n)]]++;
                    var (atLower, atUpper) = OrderStatisticRanks(tally, n, lower, fraction);
                    estimates[b] = Interpolate(sorted, atLower, atUpper, lower, fraction);
                }
            };
        }
        ParallelWork.Invoke(worthIt, work);
    }

    /// <summary>The type-7 interpolation between the order statistics found by <see cref="OrderStatisticRanks"/>.</summary>
    internal static double Interpolate(ReadOnlySpan<double> sorted, int atLower, int atUpper, int lower, double fraction)
    {
        double lowerValue = sorted[atLower];
        if (fraction == 0.0 || lower + 1 >= sorted.Length)
            return lowerValue;
        return lowerValue + (fraction * (sorted[atUpper] - lowerValue));
    }

    /// <summary>
    /// Ranks in <c>sorted</c> of the 0-based order statistics <paramref name="lower"/> and lower + 1 of a resample given
    /// as counts per rank (the second equals the first when no interpolation is needed). Upper quantiles walk the tally
    /// down from the largest value (for the 95th percentile of 24 values, 3 steps instead of 22).
    /// </summary>
    private static (int AtLower, int AtUpper) OrderStatisticRanks(int[] tally, int n, int lower, double fraction)
    {
        bool interpolate = fraction != 0.0 && lower + 1 < n;
        if (2 * lower < n)
        {
            int seen = 0, r = 0;
            while (seen + tally[r] <= lower)
                seen += tally[r++];
            int atLower = r;
            if (!interpolate)
                return (atLower, atLower);
            while (seen + tally[r] <= lower + 1)
                seen += tally[r++];
            return (atLower, r);
        }

        int top = n - 1, above = 0; // above: resample members at ranks > top
        if (interpolate)
        {
            int upperFromTop = n - 2 - lower; // 0-based position of order statistic lower + 1, counted from the largest
            while (above + tally[top] <= upperFromTop)
                above += tally[top--];
            int atUpper = top;
            while (above + tally[top] <= upperFromTop + 1)
                above += tally[top--];
            return (top, atUpper);
        }

        while (above + tally[top] <= n - 1 - lower)
            above += tally[top--];
        return (top, top);
    }

    /// <summary>The sample interpolated (type-7 style) at rank (n − 1)·quantile + z·√(n·quantile·(1 − quantile)), clamped to the sample.</summary>
    private static double AtRank(ref OrderStatistic.AscendingRanks ranks, int n, double quantile, double z)
    {
        double position = Math.Clamp(((n - 1) * quantile) + (z * Math.Sqrt(n * quantile * (1.0 - quantile))), 0.0, n - 1);
        int below = (int)Math.Floor(position);
        if (below >= n - 1)
            return ranks.At(n - 1);
        double belowValue = ranks.At(below);
        return belowValue + ((position - below) * (ranks.At(below + 1) - belowValue));
    }
}
