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
/// interval, Conover 1999, Practical Nonparametric Statistics, 3rd ed., §3.2). Relative rank error O(1/√n).
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
        var sorted = values.ToArray();
        var rank = new int[n];
        for (int i = 0; i < n; i++)
            rank[i] = i;
        Array.Sort(sorted, rank);
        if (n > MonteCarloLimit)
            return (AtRank(sorted, quantile, MathNet.Numerics.Distributions.Normal.InvCDF(0.0, 1.0, tail)),
                AtRank(sorted, quantile, MathNet.Numerics.Distributions.Normal.InvCDF(0.0, 1.0, 1.0 - tail)));

        // positionOf[i]: where values[i] sits in sorted order, so a draw of index i is tallied at its rank.
        var positionOf = new int[n];
        for (int r = 0; r < n; r++)
            positionOf[rank[r]] = r;
        double h = (n - 1) * quantile;
        int lower = Math.Min((int)Math.Floor(h), n - 1);
        double fraction = h - lower;

        var random = new SplitMix64(seed);
        var tally = new int[n];
        var estimates = new double[resamples];
        for (int b = 0; b < resamples; b++)
        {
            Array.Clear(tally);
            for (int i = 0; i < n; i++)
                tally[positionOf[random.NextIndex(n)]]++;
            estimates[b] = InterpolatedOrderStatistic(sorted, tally, lower, fraction);
        }

        Array.Sort(estimates);
        return (Percentile.LinearInterpolationOfSorted(estimates, tail), Percentile.LinearInterpolationOfSorted(estimates, 1.0 - tail));
    }

    /// <summary>
    /// Type-7 quantile of a resample given as counts per rank of <paramref name="sorted"/>: the 0-based order statistics
    /// <paramref name="lower"/> and lower + 1 of the resample, interpolated by <paramref name="fraction"/>.
    /// </summary>
    private static double InterpolatedOrderStatistic(double[] sorted, int[] tally, int lower, double fraction)
    {
        if (2 * lower >= sorted.Length)
            return InterpolatedOrderStatisticFromTop(sorted, tally, lower, fraction);
        int seen = 0, r = 0;
        while (seen + tally[r] <= lower)
            seen += tally[r++];
        double atLower = sorted[r];
        if (fraction == 0.0 || lower + 1 >= sorted.Length)
            return atLower;
        while (seen + tally[r] <= lower + 1)
            seen += tally[r++];
        return atLower + (fraction * (sorted[r] - atLower));
    }

    /// <summary>Type-7 interpolated order statistic at rank h + z·√(np(1 − p)), clamped to the sample (large-n limit).</summary>
    /// <summary>
    /// <see cref="InterpolatedOrderStatistic"/> for upper quantiles, walking the tally down from the largest value: the
    /// same two order statistics and the same interpolation expression, in fewer steps (for the 95th percentile of 24
    /// values, 3 instead of 22).
    /// </summary>
    private static double InterpolatedOrderStatisticFromTop(double[] sorted, int[] tally, int lower, double fraction)
    {
        int n = sorted.Length;
        int r = n - 1, above = 0; // above: resample members at ranks > r
        if (fraction != 0.0 && lower + 1 < n)
        {
            int upperFromTop = n - 2 - lower; // 0-based position of order statistic lower + 1, counted from the top
            while (above + tally[r] <= upperFromTop)
                above += tally[r--];
            double atUpper = sorted[r];
            while (above + tally[r] <= upperFromTop + 1)
                above += tally[r--];
            double atLowerValue = sorted[r];
            return atLowerValue + (fraction * (atUpper - atLowerValue));
        }

        int lowerFromTop = n - 1 - lower;
        while (above + tally[r] <= lowerFromTop)
            above += tally[r--];
        return sorted[r];
    }

    private static double AtRank(double[] sorted, double quantile, double z)
    {
        int n = sorted.Length;
        double position = Math.Clamp(((n - 1) * quantile) + (z * Math.Sqrt(n * quantile * (1.0 - quantile))), 0.0, n - 1);
        int below = (int)Math.Floor(position);
        return below >= n - 1 ? sorted[^1] : sorted[below] + ((position - below) * (sorted[below + 1] - sorted[below]));
    }
}
