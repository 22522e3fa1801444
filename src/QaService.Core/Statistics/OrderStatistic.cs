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
}
