using System.Text.Json;

namespace QaService.Core.Reporting;

/// <summary>
/// The property names a hand-written point reader accepts, and which one the reader is at (exact, case-sensitive).
/// A plain name of up to 8 bytes is packed into one integer and compared with the packed names, a longer one as bytes:
/// the reader's comparison with a string transcodes the string on every call, which was a few percent of a small
/// assessment, and per-name byte comparisons were a few percent of a transform. An escaped name (<c>"\u006cat"</c>)
/// or one split across buffers goes through the reader, which unescapes it. Unescaped JSON names hold no byte 0
/// (RFC 8259 §7: control characters must be escaped), so zero padding cannot make two names equal.
/// </summary>
internal sealed class FieldNameTable
{
    private const int PackedBytes = sizeof(ulong);

    private readonly string[] names;
    private readonly byte[][] utf8;
    private readonly ulong[] packed;

    public FieldNameTable(string[] names)
    {
        this.names = names;
        utf8 = [.. names.Select(System.Text.Encoding.UTF8.GetBytes)];
        packed = [.. utf8.Select(bytes => bytes.Length <= PackedBytes ? Pack(bytes) : 0UL)];
    }

    /// <summary>The index of the property name at the reader, or −1.</summary>
    public int IndexOf(ref Utf8JsonReader reader)
    {
        if (!reader.ValueIsEscaped && !reader.HasValueSequence)
            return IndexOf(reader.ValueSpan);

        for (var i = 0; i < names.Length; i++)
        {
            if (reader.ValueTextEquals(names[i]))
                return i;
        }
        return -1;
    }

    /// <summary>The index of a name given as its raw UTF-8 bytes with no escape in them, or −1.</summary>
    public int IndexOf(ReadOnlySpan<byte> name)
    {
        if (name.Length is > 0 and <= PackedBytes)
        {
            ulong key = Pack(name);
            for (var i = 0; i < packed.Length; i++)
            {
                if (packed[i] == key)
                    return i;
            }
            return -1;
        }

        for (var i = 0; i < utf8.Length; i++)
        {
            if (name.SequenceEqual(utf8[i]))
                return i;
        }
        return -1;
    }

    /// <summary>Up to 8 bytes as one little-endian integer, zero-padded (names are short: a few shifts, no buffer).</summary>
    private static ulong Pack(ReadOnlySpan<byte> bytes)
    {
        ulong key = 0;
        for (var i = 0; i < bytes.Length; i++)
            key |= (ulong)bytes[i] << (8 * i);
        return key;
    }
}
