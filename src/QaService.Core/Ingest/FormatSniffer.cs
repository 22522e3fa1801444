using System.Text;

namespace QaService.Core.Ingest;

/// <summary>
/// Recognises a field file's format from its first bytes, not its name (a file called <c>upload.dat</c>
/// is still read): after any byte-order mark and white space, <c>&lt;</c> starts XML (GPX), <c>{</c>
/// JSON (GeoJSON), <c>$</c> or <c>!</c> an NMEA 0183 sentence; anything else is read as delimited text
/// with a header row.
/// </summary>
public static class FormatSniffer
{
    /// <summary>The format and a stream that replays the inspected bytes before the rest.</summary>
    public static async Task<(FieldFormat? Format, Stream Content, string? Problem)> DetectAsync(Stream stream, CancellationToken cancellationToken)
    {
        var prefix = new byte[ReadLimits.SniffBytes];
        var filled = 0;
        while (filled < prefix.Length)
        {
            var read = await stream.ReadAsync(prefix.AsMemory(filled), cancellationToken);
            if (read == 0)
                break;
            filled += read;
        }
        var content = new PrefixedStream(prefix, filled, stream);
        var text = DecodeStart(prefix.AsSpan(0, filled));
        var first = text.TrimStart().FirstOrDefault();
        return first switch
        {
            '\0' when text.Trim().Length == 0 => (null, content, "the file is empty"),
            '<' when text.Contains("<gpx", StringComparison.Ordinal) || text.Contains(":gpx", StringComparison.Ordinal) => (FieldFormat.Gpx, content, null),
            '<' => (null, content, "the file is XML but has no <gpx> root element: only GPX 1.1 is read among XML formats"),
            '{' => (FieldFormat.GeoJson, content, null),
            '[' => (null, content, "the file is a JSON array: send a GeoJSON FeatureCollection (RFC 7946) of Point features"),
            '$' or '!' => (FieldFormat.Nmea, content, null),
            _ => (FieldFormat.Csv, content, null),
        };
    }

    /// <summary>Enough decoding to see the first characters; lenient, since the real reader is strict.</summary>
    private static string DecodeStart(ReadOnlySpan<byte> bytes)
    {
        if (bytes.StartsWith((ReadOnlySpan<byte>)[0xEF, 0xBB, 0xBF]))
            return Encoding.UTF8.GetString(bytes[3..]);
        if (bytes.StartsWith((ReadOnlySpan<byte>)[0xFF, 0xFE]))
            return Encoding.Unicode.GetString(bytes[2..]);
        if (bytes.StartsWith((ReadOnlySpan<byte>)[0xFE, 0xFF]))
            return Encoding.BigEndianUnicode.GetString(bytes[2..]);
        return Encoding.UTF8.GetString(bytes);
    }
}

/// <summary>A read-only stream that returns a buffered prefix and then the rest of an inner stream.</summary>
internal sealed class PrefixedStream(byte[] prefix, int prefixLength, Stream inner) : Stream
{
    private int position;

    public override bool CanRead => true;
    public override bool CanSeek => false;
    public override bool CanWrite => false;
    public override long Length => throw new NotSupportedException();
    public override long Position { get => throw new NotSupportedException(); set => throw new NotSupportedException(); }

    public override int Read(byte[] buffer, int offset, int count) => Read(buffer.AsSpan(offset, count));

    public override int Read(Span<byte> buffer)
    {
        if (position < prefixLength)
        {
            var n = Math.Min(buffer.Length, prefixLength - position);
            prefix.AsSpan(position, n).CopyTo(buffer);
            position += n;
            return n;
        }
        return inner.Read(buffer);
    }

    public override async ValueTask<int> ReadAsync(Memory<byte> buffer, CancellationToken cancellationToken = default)
    {
        if (position < prefixLength)
            return Read(buffer.Span);
        return await inner.ReadAsync(buffer, cancellationToken);
    }

    public override Task<int> ReadAsync(byte[] buffer, int offset, int count, CancellationToken cancellationToken) =>
        ReadAsync(buffer.AsMemory(offset, count), cancellationToken).AsTask();

    public override void Flush() { }
    public override long Seek(long offset, SeekOrigin origin) => throw new NotSupportedException();
    public override void SetLength(long value) => throw new NotSupportedException();
    public override void Write(byte[] buffer, int offset, int count) => throw new NotSupportedException();
}
