using System.Buffers;

namespace QaService.Core.Statistics;

/// <summary>
/// The percentile-bootstrap bounds read from resamples counted per (lower rank, upper rank) pair instead of from every
/// resample's estimate: the distinct estimates are sorted with their counts and the two type-7 bounds are found by
/// walking the cumulative counts. Same order statistics of the same multiset, interpolated by the same expression as
/// <see cref="Percentile.LinearInterpolationOfSorted"/>, so the bounds are the same bits as sorting all estimates.
/// </summary>
internal static class DistinctEstimates
{
    /// <param name="sorted">The sample in ascending order (n values).</param>
    /// <param name="pairCounts">Resamples per rank pair, index atLower·n + atUpper (first n² elements).</param>
    /// <param name="resamples">Sum of the counts.</param>
    /// <param name="tail">Probability of each tail, (1 − level) / 2.</param>
    public static (double Lower, double Upper) Bounds(ReadOnlySpan<double> sorted, int[] pairCounts, int lower, double fraction,
        int resamples, double tail)
    {
        int n = sorted.Length;
        int distinct = 0;
        foreach (int count in pairCounts.AsSpan(0, n * n))
            distinct += count > 0 ? 1 : 0;
        var estimates = ArrayPool<double>.Shared.Rent(distinct);
        var counts = ArrayPool<int>.Shared.Rent(distinct);
        try
        {
            for (int pair = 0, j = 0; pair < n * n; pair++)
            {
                if (pairCounts[pair] == 0)
                    continue;
                estimates[j] = BootstrapInterval.Interpolate(sorted, pair / n, pair % n, lower, fraction);
                counts[j++] = pairCounts[pair];
            }
            estimates.AsSpan(0, distinct).Sort(counts.AsSpan(0, distinct));
            var walk = new Walk(estimates, counts, distinct);
            double lowerBound = walk.TypeSeven(resamples, tail);
            return (lowerBound, walk.TypeSeven(resamples, 1.0 - tail));
        }
        finally
        {
            ArrayPool<int>.Shared.Return(counts);
            ArrayPool<double>.Shared.Return(estimates);
        }
    }

    /// <summary>Order statistics of the expanded multiset, read in ascending order of position.</summary>
    private struct Walk(double[] values, int[] counts, int distinct)
    {
        private int group;
        private long endOfGroup = counts[0]; // positions before the end of the current group of equal estimates

        /// <summary>Type-7 quantile of the <paramref name="total"/> expanded estimates; calls must not decrease in probability.</summary>
        public double TypeSeven(int total, double probability)
        {
            double h = (total - 1) * probability;
            int at = (int)Math.Floor(h);
            if (at >= total - 1)
                return values[distinct - 1];
            double below = At(at);
            return below + ((h - at) * (At(at + 1) - below));
        }

        private double At(long position)
        {
            while (position >= endOfGroup)
                endOfGroup += counts[++group];
            return values[group];
        }
    }
}
