namespace QaService.Core.Statistics;

/// <summary>
/// The k-th smallest of a set of values without sorting it: Hoare's selection ("Algorithm 65: FIND",
/// Communications of the ACM 4(7):321–322, 1961, doi:10.1145/366622.366647) with a median-of-three pivot,
/// expected O(n); after too many rounds it sorts what is left (the introselect guard of D. R. Musser,
/// "Introspective sorting and selection algorithms", Software: Practice and Experience 27(8):983–993, 1997,
/// doi:10.1002/(SICI)1097-024X(199708)27:8&lt;983::AID-SPE117&gt;3.0.CO;2-#), so the worst case stays O(n log n).
/// Exact: it returns one of the inputs, the same value a full sort would put at index k.
/// </summary>
internal static class OrderStatistic
{
    /// <summary>Partition rounds allowed per doubling of n before the remaining range is sorted instead (Musser 1997: 2 log₂ n).</summary>
    private const int RoundsPerDoubling = 2;

    /// <summary>
    /// Rearranges <paramref name="values"/> so that index <paramref name="k"/> holds the value a sort would put
    /// there, every value before it is ≤ and every value after it is ≥, and returns that value.
    /// </summary>
    /// <param name="values">Finite values (no NaN), any unit; reordered in place.</param>
    /// <param name="k">0-based rank, 0 ≤ k &lt; n.</param>
    public static double Select(Span<double> values, int k)
    {
        ArgumentOutOfRangeException.ThrowIfGreaterThanOrEqual((uint)k, (uint)values.Length, nameof(k));
        int left = 0, right = values.Length - 1;
        var rounds = RoundsPerDoubling * (int)Math.Log2(values.Length + 1) + 1;
        while (right > left)
        {
            if (--rounds < 0)
            {
                values[left..(right + 1)].Sort();
                return values[k];
            }
            var pivot = MedianOfThree(values[left], values[left + ((right - left) >> 1)], values[right]);
            int i = left, j = right;
            while (i <= j)
            {
                while (values[i] < pivot) i++;
                while (values[j] > pivot) j--;
                if (i <= j)
                {
                    (values[i], values[j]) = (values[j], values[i]);
                    i++;
                    j--;
                }
            }
            // Now [left, j] ≤ pivot ≤ [i, right], and anything strictly between j and i equals the pivot.
            if (k <= j)
                right = j;
            else if (k >= i)
                left = i;
            else
                return values[k];
        }
        return values[k];
    }

    /// <summary>The smallest of a non-empty span.</summary>
    public static double Minimum(ReadOnlySpan<double> values)
    {
        var minimum = values[0];
        foreach (var v in values)
            minimum = v < minimum ? v : minimum;
        return minimum;
    }

    private static double MedianOfThree(double a, double b, double c) =>
        a < b ? (b < c ? b : a < c ? c : a) : (a < c ? a : b < c ? c : b);

    /// <summary>
    /// Order statistics read from one array at ranks that, apart from the last two read, never go down: each is selected in
    /// the part the previous selection left above it, so the two ranks of each of a few ascending quantiles cost about
    /// one selection over the array in all, not a sort. A selected rank stays in place, so the last two can be read again
    /// (a quantile's lower rank may equal one of the previous quantile's). Each value is the one a sort would put at that rank.
    /// </summary>
    /// <param name="values">Finite values (no NaN), any unit; reordered in place.</param>
    internal ref struct AscendingRanks(Span<double> values)
    {
        private readonly Span<double> values = values;

        /// <summary>Every value below this index is ≤ every value from it on; index settled − 1 is the last rank selected.</summary>
        private int settled;

        /// <summary>The rank selected before the last one (in place too); −1 when none.</summary>
        private int previous = -1;

        /// <summary>The value of 0-based rank <paramref name="k"/>.</summary>
        /// <exception cref="InvalidOperationException">k is below every rank still known to be in place.</exception>
        public double At(int k)
        {
            if (k < settled)
            {
                if (k != settled - 1 && k != previous)
                    throw new InvalidOperationException($"rank {k} asked after rank {settled - 1}: ranks must not go down");
                return values[k];
            }
            var value = Select(values[settled..], k - settled);
            previous = settled - 1;
            settled = k + 1;
            return value;
        }
    }
}
