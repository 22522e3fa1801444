using QaService.Api.Storage;
using QaService.Core.Reporting;

namespace QaService.Api.Assessments;

/// <summary>
/// Serialises a report to UTF-8 once, as a stream: in memory for ordinary reports, into the store's spool
/// (<see cref="IReportStore.CreateJsonSpool"/>: a file) for large ones, so a 1,000,000-residual report (~180 MB of JSON)
/// never becomes one string or one array, and a store that keeps files keeps that one.
/// </summary>
internal static class ReportSerialisation
{
    /// <summary>
    /// Above this many residuals the JSON goes to the store's spool file. About 180 bytes a residual, so in-memory
    /// buffers stay under ~1 MB (measured on the 400,000-fix bench: 71,510,604 bytes, 179 a residual).
    /// </summary>
    private const int InMemoryResidualLimit = 4_096;

    public static async Task<Stream> SerialiseAsync(AssessmentReport report, IReportStore store, CancellationToken cancellationToken)
    {
        if (report.Residuals.Count <= InMemoryResidualLimit)
        {
            // Rendered into a pooled buffer, then one exact array, which the SQLite store binds as it is (no second copy).
            using var rendered = new PooledBufferWriter();
            ReportJsonStream.Write(report, rendered);
            var bytes = rendered.WrittenSpan.ToArray();
            return new MemoryStream(bytes, 0, bytes.Length, writable: false, publiclyVisible: true);
        }
        var spool = store.CreateJsonSpool();
        try
        {
            // The residuals go out batch by batch as they are rendered; the rest of the report is small.
            await ReportJsonStream.WriteAsync(report, spool, cancellationToken);
            spool.Position = 0;
            return spool;
        }
        catch
        {
            await spool.DisposeAsync();
            throw;
        }
    }

    /// <summary>
    /// The stream's whole content as its own array, without a copy, when it is a memory stream at position 0 whose
    /// visible buffer is exactly one whole array (as <see cref="SerialiseAsync"/> returns a small report); otherwise null,
    /// and the caller reads the stream. Valid for any such stream: the content then is that array, byte for byte.
    /// </summary>
    public static byte[]? WholeArrayOf(Stream json) =>
        json is MemoryStream { Position: 0 } memory && memory.TryGetBuffer(out var segment) && segment.Offset == 0
            && segment.Count == segment.Array!.Length ? segment.Array : null;
}
