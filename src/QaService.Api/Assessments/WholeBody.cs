using System.Buffers;
using System.IO.Pipelines;

namespace QaService.Api.Assessments;

/// <summary>
/// A request body read whole into one pooled array, straight from Kestrel's pipe: each read takes every segment already
/// received (not a fixed-size copy buffer at a time), and the array comes back to the pool when disposed, so a 10 MB
/// transform body costs neither a large-object allocation nor zeroing per request.
/// </summary>
internal sealed class WholeBody : IDisposable
{
    private byte[] array;

    private WholeBody(byte[] array, int length)
    {
        this.array = array;
        Length = length;
    }

    public int Length { get; }

    public ReadOnlySpan<byte> Span => array.AsSpan(0, Length);

    public ReadOnlyMemory<byte> Memory => array.AsMemory(0, Length);

    /// <summary>The body, or null when it is longer than <paramref name="maximumBytes"/> (nothing more is read).</summary>
    public static async Task<WholeBody?> ReadAsync(PipeReader reader, long? announcedBytes, long maximumBytes, CancellationToken cancellationToken)
    {
        var array = ArrayPool<byte>.Shared.Rent((int)Math.Clamp(announcedBytes ?? FirstBufferBytes, FirstBufferBytes, maximumBytes));
        var length = 0;
        try
        {
            while (true)
            {
                var result = await reader.ReadAsync(cancellationToken);
                foreach (var segment in result.Buffer)
                {
                    if (length + (long)segment.Length > maximumBytes)
                    {
                        reader.AdvanceTo(result.Buffer.End);
                        ArrayPool<byte>.Shared.Return(array);
                        return null;
                    }
                    if (length + segment.Length > array.Length)
                        array = Grown(array, length, length + segment.Length);
                    segment.Span.CopyTo(array.AsSpan(length));
                    length += segment.Length;
                }
                reader.AdvanceTo(result.Buffer.End);
                if (result.IsCompleted)
                    return new WholeBody(array, length);
            }
        }
        catch
        {
            ArrayPool<byte>.Shared.Return(array);
            throw;
        }
    }

    /// <summary>First array for a body whose length is not announced (chunked), bytes.</summary>
    private const int FirstBufferBytes = 65_536;

    private static byte[] Grown(byte[] array, int used, int needed)
    {
        var larger = ArrayPool<byte>.Shared.Rent(Math.Max(needed, 2 * array.Length));
        array.AsSpan(0, used).CopyTo(larger);
        ArrayPool<byte>.Shared.Return(array);
        return larger;
    }

    public void Dispose()
    {
        if (array.Length > 0)
            ArrayPool<byte>.Shared.Return(array);
        array = [];
    }
}
