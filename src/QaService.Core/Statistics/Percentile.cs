namespace QaService.Core.Statistics;

/// <summary>Empirical percentiles (sample quantiles) of a set of values.</summary>
public static class Percentile
{
    /// <summary>
    /// Sample quantile by linear interpolation between order statistics with h = (n − 1)p: definition 7 of
    /// Hyndman &amp; Fan (1996), "Sample quantiles in statistical packages", The American Statistician
    /// 50(4):361–365, doi:10.1080/00031305.1996.10473566 (R's default; MathNet <c>QuantileDefinition.R7</c>;
    /// Excel PERCENTILE.INC). With x₍₁₎ ≤ … ≤ x₍ₙ₎ and h = (n − 1)p, the result is
    /// x₍⌊h⌋+1₎ + (h − ⌊h⌋)(x₍⌊h⌋+2₎ − x₍⌊h⌋+1₎). This is the percentile of the API contract
    /// (<c>p50</c>, <c>p90</c>, <c>p95</c>); it is not the nearest-rank or the (n + 1)p definition.
    /// </summary>
    /// <param name="values">Finite values, any order, n ≥ 1, in any unit (the result has the same unit). Not modified.</param>
    /// <param name="probability">p in [0, 1]; p = 0 gives the minimum and p = 1 the maximum.</param>
    /// <returns>The type-7 quantile; exact up to one rounding of the interpolation.</returns>
    /// <exception cref="ArgumentException">n = 0, a value is not finite, or p is outside [0, 1] or NaN.</exception>
    public static double LinearInterpolation(ReadOnlySpan<double> values, double probability)
    {
        using var copy = PooledScratch.CopyOf(values);
        return LinearInterpolationInPlace(copy.Span, probability);
    }

    /// <summary>
    /// <see cref="LinearInterpolation(ReadOnlySpan{double}, double)"/> on values the caller owns as scratch: selection
    /// reorders them, so no copy is made (for columns a caller has just built, such as absolute values or deviations).
    /// </summary>
    internal static double LinearInterpolationInPlace(Span<double> scratch, double probability)
    {
        SampleMoments.RequireFinite(scratch, minimumCount: 1);
        RequireProbability(probability);
        // Two order statistics by selection, not a sort: O(n) for the medians of large uploads, same result bit for bit.
        double h = (scratch.Length - 1) * probability;
        int lower = (int)Math.Floor(h);
        if (lower >= scratch.Length - 1)
        {
            return OrderStatistic.Select(scratch, scratch.Length - 1);
        }

        double below = OrderStatistic.Select(scratch, lower);
        double above = OrderStatistic.Minimum(scratch[(lower + 1)..]);
        return below + ((h - lower) * (above - below));
    }

    /// <summary>Type-7 quantile of values already sorted ascending (no checks; for callers that sort once).</summary>
    internal static double LinearInterpolationOfSorted(ReadOnlySpan<double> sorted, double probability)
    {
        double h = (sorted.Length - 1) * probability;
        int lower = (int)Math.Floor(h);
        if (lower >= sorted.Length - 1)
        {
            return sorted[^1];
        }

        double fraction = h - lower;
        return sorted[lower] + (fraction * (sorted[lower + 1] - sorted[lower]));
    }

    /// <summary>
    /// Type-7 quantile read from order statistics selected in ascending rank order (see
    /// <see cref="OrderStatistic.AscendingRanks"/>); the same interpolation, on the same two values, as
    /// <see cref="LinearInterpolationOfSorted"/>. Successive calls must not decrease in <paramref name="probability"/>.
    /// </summary>
    internal static double LinearInterpolation(ref OrderStatistic.AscendingRanks ranks, int count, double probability)
    {
        double h = (count - 1) * probability;
        int lower = (int)Math.Floor(h);
        if (lower >= count - 1)
        {
            return ranks.At(count - 1);
        }

        double fraction = h - lower;
        double below = ranks.At(lower);
        return below + (fraction * (ranks.At(lower + 1) - below));
    }

    internal static void RequireProbability(double probability)
    {
        if (!(probability >= 0.0 && probability <= 1.0))
        {
            throw new ArgumentException($"Probability {probability} is outside [0, 1].", nameof(probability));
        }
    }
}
