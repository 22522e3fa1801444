namespace QaService.Core.Ingest;

/// <summary>
/// An append-only column kept in fixed-size chunks. Unlike a growing <see cref="List{T}"/> it never copies
/// itself into an array twice the size, so a million-point upload leaves no discarded large arrays behind
/// for the garbage collector and holds at most one part-filled chunk of slack.
/// </summary>
internal sealed class ChunkedColumn<T>
{
    /// <summary>Elements per chunk: 8,192 × 8 bytes = 64 KiB, below the 85,000-byte large-object threshold (.NET GC docs).</summary>
    private const int ChunkShift = 13;
    private const int ChunkLength = 1 << ChunkShift;
    private const int ChunkMask = ChunkLength - 1;

    private readonly List<T[]> chunks = [];
    private T[] last = [];

    public int Count { get; private set; }

    public void Add(T value)
    {
        if ((Count & ChunkMask) == 0)
        {
            last = new T[ChunkLength];
            chunks.Add(last);
        }
        last[Count & ChunkMask] = value;
        Count++;
    }

    public T this[int index]
    {
        get
        {
            ArgumentOutOfRangeException.ThrowIfGreaterThanOrEqual((uint)index, (uint)Count, nameof(index));
            return chunks[index >> ChunkShift][index & ChunkMask];
        }
        set
        {
            ArgumentOutOfRangeException.ThrowIfGreaterThanOrEqual((uint)index, (uint)Count, nameof(index));
            chunks[index >> ChunkShift][index & ChunkMask] = value;
        }
    }

    /// <summary>A column whose first <paramref name="count"/> elements are <paramref name="value"/>.</summary>
    public static ChunkedColumn<T> Filled(int count, T value)
    {
        var column = new ChunkedColumn<T>();
        for (var i = 0; i < count; i++)
            column.Add(value);
        return column;
    }
}
