using System.Security.Cryptography;
using QaService.Api.Storage;

namespace QaService.Api.SignOff;

/// <summary>
/// SHA-256 (FIPS 180-4) of a report's stored JSON, which is exactly what <c>GET /v1/assessments/{id}</c> sends. Read as
/// a stream from the store, so a large report is hashed without being held in memory.
/// </summary>
internal static class ReportHash
{
    /// <summary>Lower-case hex digest, or null when the tenant has no such report.</summary>
    public static async Task<string?> OfStoredAsync(IReportStore reports, string tenant, string id, CancellationToken cancellationToken)
    {
        if (!ReportIds.IsPlausible(id))
            return null;
        await using var json = await reports.OpenJsonAsync(tenant, id, cancellationToken);
        return json is null ? null : Convert.ToHexStringLower(await SHA256.HashDataAsync(json, cancellationToken));
    }
}

/// <summary>
/// Passes a stream through while hashing every byte read, so the report page deserialises and hashes the stored JSON in
/// one read. <see cref="FinishAsync"/> reads what the consumer left (a reader may stop at the closing brace) and returns the digest.
/// </summary>
internal sealed class Sha256ReadStream(Stream inner) : Stream
{
    private readonly IncrementalHash hash = IncrementalHash.CreateHash(HashAlgorithmName.SHA256);

    public override bool CanRead => true;

    public override bool CanSeek => false;

    public override bool CanWrite => false;

    public override long Length => inner.Length;

    public override long Position { get => inner.Position; set => throw new NotSupportedException(); }

    public override int Read(byte[] buffer, int offset, int count) => Read(buffer.AsSpan(offset, count));

    public override int Read(Span<byte> buffer)
    {
        int read = inner.Read(buffer);
        hash.AppendData(buffer[..read]);
        return read;
    }

    public override async ValueTask<int> ReadAsync(Memory<byte> buffer, CancellationToken cancellationToken = default)
    {
        int read = await inner.ReadAsync(buffer, cancellationToken);
        hash.AppendData(buffer.Span[..read]);
        return read;
    }

    public override Task<int> ReadAsync(byte[] buffer, int offset, int count, CancellationToken cancellationToken) =>
        ReadAsync(buffer.AsMemory(offset, count), cancellationToken).AsTask();

    /// <summary>Hashes the rest of the stream and returns the lower-case hex digest of all of it.</summary>
    public async Task<string> FinishAsync(CancellationToken cancellationToken)
    {
        var rest = new byte[16 * 1024];
        while (await ReadAsync(rest, cancellationToken) > 0)
        {
        }

        return Convert.ToHexStringLower(hash.GetHashAndReset());
    }

    public override void Flush()
    {
    }

    public override long Seek(long offset, SeekOrigin origin) => throw new NotSupportedException();

    public override void SetLength(long value) => throw new NotSupportedException();

    public override void Write(byte[] buffer, int offset, int count) => throw new NotSupportedException();

    protected override void Dispose(bool disposing)
    {
        if (disposing)
        {
            hash.Dispose();
            inner.Dispose();
        }
        base.Dispose(disposing);
    }

    public override async ValueTask DisposeAsync()
    {
        hash.Dispose();
        await inner.DisposeAsync();
        await base.DisposeAsync();
    }
}
