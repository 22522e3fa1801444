using System.Buffers;

namespace QaService.Core.Reporting;

/// <summary>
/// An <see cref="IBufferWriter{T}"/> of bytes on arrays rented from the shared pool: a small report's JSON is rendered
/// without the garbage of a growing <see cref="ArrayBufferWriter{T}"/> or <see cref="MemoryStream"/> (under load those
/// intermediate arrays were a quarter of all bytes a 24-point assessment allocated; DEVELOPERS.md "Performance").
/// Dispose returns the array; the written bytes are not valid after that.
/// </summary>
public sealed class PooledBufferWriter(int initialBytes = PooledBufferWriter.DefaultInitialBytes) : IBufferWriter<byte>, IDisposable
{
    /// <summary>First rental: a 24-point report's JSON is ~14 kB.</summary>
    public const int DefaultInitialBytes = 16 * 1024;

    private byte[] array = ArrayPool<byte>.Shared.Rent(initialBytes);
    private int written;

    public ReadOnlySpan<byte> WrittenSpan => array.AsSpan(0, written);

    public ReadOnlyMemory<byte> WrittenMemory => array.AsMemory(0, written);

    public int WrittenCount => written;

    public void Advance(int count)
    {
        if (count < 0 || written + count > array.Length)
            throw new ArgumentOutOfRangeException(nameof(count));
        written += count;
    }

    public Memory<byte> GetMemory(int sizeHint = 0)
    {
        var at = Reserve(sizeHint); // first: it may replace the array
        return array.AsMemory(at);
    }

    public Span<byte> GetSpan(int sizeHint = 0)
    {
        var at = Reserve(sizeHint);
        return array.AsSpan(at);
    }

    public void Write(ReadOnlySpan<byte> bytes)
    {
        bytes.CopyTo(GetSpan(bytes.Length));
        written += bytes.Length;
    }

    /// <summary>Forgets the written bytes, keeping the array.</summary>
    public void Reset() => written = 0;

    public void Dispose()
    {
        var rented = array;
        array = [];
        written = 0;
        if (rented.Length > 0)
            ArrayPool<byte>.Shared.Return(rented);
    }

    private int Reserve(int sizeHint)
    {
        var needed = Math.Max(sizeHint, 1);
        if (array.Length - written < needed)
        {
            var larger = ArrayPool<byte>.Shared.Rent(Math.Max(written + needed, 2 * array.Length));
            array.AsSpan(0, written).CopyTo(larger);
            ArrayPool<byte>.Shared.Return(array);
            array = larger;
        }
        return written;
    }
}
