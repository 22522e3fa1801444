using System.Collections.Concurrent;

namespace QaService.Core.Statistics;

/// <summary>
/// Values of a pure function kept per key for the life of the process, up to <c>mostEntries</c> keys (past that, computed
/// on each call). For distribution quantiles that depend only on a count and a fixed level (a critical t for n − 1 degrees
/// of freedom, a Clopper–Pearson bound for k of n): MathNet finds each by a root search over its CDF, tens of
/// microseconds, while the counts of real deliveries repeat), and for tables built from a few parameters (the
/// bootstrap's draw counts). The kept value is the function's own result, bit for bit.
/// </summary>
internal sealed class BoundedMemo<TKey, TValue>(Func<TKey, TValue> compute, int mostEntries)
    where TKey : notnull
{
    private readonly ConcurrentDictionary<TKey, TValue> values = new();

    public TValue this[TKey key] => values.TryGetValue(key, out var value) ? value : Add(key);

    private TValue Add(TKey key)
    {
        TValue value = compute(key);
        if (values.Count < mostEntries)
            values.TryAdd(key, value);
        return value;
    }
}
