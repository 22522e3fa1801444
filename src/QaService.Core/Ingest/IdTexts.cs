namespace QaService.Core.Ingest;

/// <summary>
/// Point ids read from a file, as characters in shared chunks with one <see cref="long"/> location per point instead of
/// one string object per point. A 1,000,000-fix upload's ids ("F0000001") were 1,000,000 strings of 40 bytes each
/// plus a reference apiece in every table holding them; here they are 16 bytes of characters and 8 of location, the
/// garbage collector traces a few hundred chunks instead of a million objects, and the validated fixes point into the
/// same chunks (<see cref="Assessment.FixTable"/>). Appended by one reader; read from any thread once filled.
/// </summary>
internal sealed class IdTexts
{
    /// <summary>Characters per shared chunk: 32,768 × 2 bytes = 64 KiB, below the 85,000-byte large-object threshold (.NET GC docs).</summary>
    private const int ChunkShift = 15;
    private const int ChunkChars = 1 << ChunkShift;

    /// <summary>A text longer than this gets a chunk of its own, so a chunk's unused tail stays small.</summary>
    private const int LongestShared = ChunkChars / 8;

    // A location: chunk (25 bits) | offset in the chunk (15 bits) | length (23 bits). WholeChunk in the length field means
    // the text is its own chunk, however long (a file may hold any text; validation rejects ids over 200 characters).
    internal const int LengthBits = 23;
    internal const int OffsetBits = ChunkShift;
    internal const long LengthMask = (1L << LengthBits) - 1;
    internal const long OffsetMask = (1L << OffsetBits) - 1;
    internal const long WholeChunk = LengthMask;

    /// <summary>The location of "not given" (an empty field).</summary>
    public const long None = -1;

    private readonly List<char[]> chunks = [];
    private readonly ChunkedColumn<long> locations = new();
    private char[] open = [];
    private int openChunk, used;

    public IdTexts() => Characters = new IdCharacters(chunks);

    /// <summary>The characters alone, which is all a holder of locations needs (the validated fixes keep these, not the per-point column).</summary>
    public IdCharacters Characters { get; }

    public int Count => locations.Count;

    /// <summary>Appends a point's id; empty means not given.</summary>
    public void Add(ReadOnlySpan<char> text) => locations.Add(text.IsEmpty ? None : Store(text));

    /// <summary>Where point <paramref name="index"/>'s id is (<see cref="None"/> when not given).</summary>
    public long LocationOf(int index) => locations[index];

    /// <summary>Point <paramref name="index"/>'s id; empty when not given.</summary>
    public ReadOnlySpan<char> TextOf(int index) => Text(locations[index]);

    public ReadOnlySpan<char> Text(long location) => Characters.Memory(location).Span;

    /// <summary>Point <paramref name="index"/>'s id as a string; null when not given.</summary>
    public string? StringOf(int index) => locations[index] == None ? null : TextOf(index).ToString();

    /// <summary>
    /// The location of the part of <paramref name="location"/>'s text from <paramref name="start"/> for <paramref name="length"/>
    /// characters (a trimmed id). Only for a text in a shared chunk, which is what an id of valid length is.
    /// </summary>
    public static long Slice(long location, int start, int length)
    {
        var (textLength, offset) = (location & LengthMask, (location >> LengthBits) & OffsetMask);
        if (location == None || textLength == WholeChunk || (uint)start + (uint)length > textLength)
            throw new ArgumentOutOfRangeException(nameof(start), "only a shared chunk's text can be sliced, within its length");
        return (location & ~((OffsetMask << LengthBits) | LengthMask)) | ((offset + start) << LengthBits) | (long)length;
    }

    private long Store(ReadOnlySpan<char> text)
    {
        if (text.Length > LongestShared)
        {
            chunks.Add(text.ToArray());
            return Location(chunks.Count - 1, 0, WholeChunk);
        }
        if (used + text.Length > open.Length)
        {
            open = new char[ChunkChars];
            chunks.Add(open);
            (openChunk, used) = (chunks.Count - 1, 0);
        }
        text.CopyTo(open.AsSpan(used));
        var location = Location(openChunk, used, text.Length);
        used += text.Length;
        return location;
    }

    private static long Location(int chunk, int offset, long length) => ((long)chunk << (OffsetBits + LengthBits)) | ((long)offset << LengthBits) | length;
}

/// <summary>The characters of an <see cref="IdTexts"/>, read by location (<see cref="IdTexts.LocationOf"/>, <see cref="IdTexts.Slice"/>).</summary>
internal sealed class IdCharacters(List<char[]> chunks)
{
    public ReadOnlyMemory<char> Memory(long location)
    {
        if (location == IdTexts.None)
            return ReadOnlyMemory<char>.Empty;
        var chunk = chunks[(int)(location >> (IdTexts.OffsetBits + IdTexts.LengthBits))];
        var length = location & IdTexts.LengthMask;
        return length == IdTexts.WholeChunk ? chunk : chunk.AsMemory((int)((location >> IdTexts.LengthBits) & IdTexts.OffsetMask), (int)length);
    }
}
