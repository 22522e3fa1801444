using System.Buffers;

namespace QaService.Core.Statistics;

/// <summary>
/// A scratch copy for order statistics, rented from the shared array pool. A 400,000-value sample's working copy is
/// then not a new 3.2 MB array on the large-object heap per call: such allocations count toward the budget that
/// starts full (generation 2) collections, and those dominated the statistics of a large upload
/// (DEVELOPERS.md "Performance"). Only for copies that do not outlive the call; the contents are not cleared.
/// </summary>
internal readonly struct PooledScratch : IDisposable
{
    private readonly double[] rented;

    public PooledScratch(int length)
    {
        rented = ArrayPool<double>.Shared.Rent(length);
        Length = length;
    }

    public int Length { get; }

    public Span<double> Span => rented.AsSpan(0, Length);

    /// <summary>A rented copy of <paramref name="values"/>.</summary>
    public static PooledScratch CopyOf(ReadOnlySpan<double> values)
    {
        var scratch = new PooledScratch(values.Length);
        values.CopyTo(scratch.Span);
        return scratch;
    }

    public void Dispose() => ArrayPool<double>.Shared.Return(rented);
}
