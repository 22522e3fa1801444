using System.Numerics;

namespace QaService.Core.Statistics;

/// <summary>
/// The small-sample bootstrap's draws held index by index ("columns": for sample index i, how many of each resample's n
/// draws picked i), and the search for each resample's order statistics run over many resamples at once.
/// Walking the ranks of the sorted sample from one end, a resample's k-th order statistic (0-based, counted from that
/// end) sits at the first rank where its running count of members exceeds k. Adding one column per rank to a vector of
/// running counts advances <see cref="Vector{T}.Count"/> resamples per instruction, with no branch per resample;
/// the ranks found are exactly those of the one-resample-at-a-time walk (tested against sorting every resample).
/// Valid for n ≤ <see cref="MaximumSample"/>, so a count, a rank and a step number each fit a byte.
/// </summary>
internal static class ResampleColumns
{
    /// <summary>Largest sample held this way (a count per index and a rank fit a byte with room to spare).</summary>
    public const int MaximumSample = 64;

    /// <summary>Most (n, resamples, seed) tables kept (at most ~8 MB with the default 2,000 resamples).</summary>
    private const int CacheEntries = 64;

    private static readonly BoundedMemo<(int N, int Resamples, ulong Seed), byte[]> Cache = new(Build, CacheEntries);

    /// <summary>Resamples per column, padded to whole vectors (the padding holds zeros).</summary>
    public static int Stride(int resamples) => (resamples + Vector<byte>.Count - 1) / Vector<byte>.Count * Vector<byte>.Count;

    /// <summary>
    /// Element i·<see cref="Stride"/> + b: how many of resample b's n draws picked index i, drawn with
    /// <see cref="SplitMix64.NextIndex"/> from <paramref name="seed"/>, resample after resample (the order of the
    /// textbook loop). Depends only on (n, resamples, seed), so it is built once per process and shared.
    /// </summary>
    public static byte[] Draws(int n, int resamples, ulong seed) => Cache[(n, resamples, seed)];

    private static byte[] Build((int N, int Resamples, ulong Seed) key)
    {
        var (n, resamples, seed) = key;
        int stride = Stride(resamples);
        var random = new SplitMix64(seed);
        var columns = new byte[n * stride];
        for (int b = 0; b < resamples; b++)
        {
            for (int i = 0; i < n; i++)
                columns[(random.NextIndex(n) * stride) + b]++;
        }
        return columns;
    }

    /// <summary>
    /// Adds one to <paramref name="pairCounts"/>[atLower·n + atUpper] for every resample, where atLower and atUpper are
    /// the ranks (in the sorted sample) of its order statistics <paramref name="lower"/> and lower + 1 (atUpper = atLower
    /// when <paramref name="interpolate"/> is false). Lower order statistics are walked from the smallest rank, upper
    /// ones from the largest (for the 95th percentile of 24 values, a few ranks instead of 22).
    /// </summary>
    /// <param name="columns">The table of <see cref="Draws"/>.</param>
    /// <param name="indexAtRank">Sample index of each rank of the sorted sample (first n elements).</param>
    public static void CountRankPairs(byte[] columns, int resamples, ReadOnlySpan<int> indexAtRank, int n, int lower,
        bool interpolate, int[] pairCounts)
    {
        bool fromBottom = 2 * lower < n;
        // Members passed before the first and the second order statistic sought, counted along the walk.
        int firstBefore = fromBottom ? lower : interpolate ? n - 2 - lower : n - 1 - lower;
        int secondBefore = interpolate ? firstBefore + 1 : firstBefore;
        Span<int> columnAtStep = stackalloc int[n];
        Span<byte> rankAtStep = stackalloc byte[n];
        int stride = Stride(resamples);
        for (int step = 0; step < n; step++)
        {
            int rank = fromBottom ? step : n - 1 - step;
            rankAtStep[step] = (byte)rank;
            columnAtStep[step] = indexAtRank[rank] * stride;
        }

        var first = new Vector<byte>((byte)firstBefore);
        var second = new Vector<byte>((byte)secondBefore);
        Span<byte> firstStep = stackalloc byte[Vector<byte>.Count];
        Span<byte> secondStep = stackalloc byte[Vector<byte>.Count];
        for (int start = 0; start < resamples; start += Vector<byte>.Count)
        {
            int lanes = Math.Min(Vector<byte>.Count, resamples - start);
            var live = LiveLanes(lanes);
            var seen = Vector<byte>.Zero;
            var firstSteps = Vector<byte>.Zero;
            var secondSteps = Vector<byte>.Zero;
            for (int step = 0; step < n; step++)
            {
                seen += new Vector<byte>(columns, columnAtStep[step] + start);
                // A comparison gives 255 (that is, −1) where true: subtracting it counts the steps still short of the statistic.
                firstSteps -= Vector.LessThanOrEqual(seen, first);
                var short2 = Vector.LessThanOrEqual(seen, second);
                secondSteps -= short2;
                if ((short2 & live) == Vector<byte>.Zero)
                    break;
            }

            firstSteps.CopyTo(firstStep);
            secondSteps.CopyTo(secondStep);
            for (int lane = 0; lane < lanes; lane++)
            {
                int firstRank = rankAtStep[firstStep[lane]], secondRank = rankAtStep[secondStep[lane]];
                // From the bottom the first statistic found is the lower one; from the top it is the upper one.
                int atLower = fromBottom ? firstRank : secondRank, atUpper = fromBottom ? secondRank : firstRank;
                pairCounts[(atLower * n) + atUpper]++;
            }
        }
    }

    /// <summary>All bits set in the first <paramref name="lanes"/> lanes.</summary>
    private static Vector<byte> LiveLanes(int lanes)
    {
        if (lanes == Vector<byte>.Count)
            return Vector<byte>.AllBitsSet;
        Span<byte> mask = stackalloc byte[Vector<byte>.Count];
        mask[..lanes].Fill(byte.MaxValue);
        return new Vector<byte>(mask);
    }
}
