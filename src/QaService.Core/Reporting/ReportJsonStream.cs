using System.Buffers;
using System.Text.Json;

namespace QaService.Core.Reporting;

/// <summary>
/// Writes a report's JSON to a stream, the same bytes as <c>JsonSerializer.Serialize(report, ReportJson.Write)</c>,
/// with the residual array (nearly all of a large report) rendered in parallel batches by
/// <see cref="ResidualJsonBytes"/> and written in order. Everything else is serialised once, with an empty residual
/// array, and the rendered residuals are spliced in between its brackets.
/// </summary>
public static class ReportJsonStream
{
    /// <summary>Residuals rendered per batch: ~700 kB of JSON, large enough to amortise a hand-over, small enough to spread.</summary>
    private const int BatchResiduals = 4_096;

    /// <summary>
    /// The residual property as the serialiser writes it when empty. The byte sequence cannot occur inside a JSON
    /// string (a string's quotes are escaped), and no other report member is named "residuals"; the splice still
    /// checks that it occurs exactly once and serialises the plain way otherwise.
    /// </summary>
    private static ReadOnlySpan<byte> EmptyResiduals => "\"residuals\":[]"u8;

    public static async Task WriteAsync(AssessmentReport report, Stream destination, CancellationToken cancellationToken)
    {
        var frame = JsonSerializer.SerializeToUtf8Bytes(report with { Residuals = [] }, ReportJson.Write);
        var at = frame.AsSpan().IndexOf(EmptyResiduals);
        if (at < 0 || frame.AsSpan(at + EmptyResiduals.Length).IndexOf(EmptyResiduals) >= 0)
        {
            await JsonSerializer.SerializeAsync(destination, report, ReportJson.Write, cancellationToken);
            return;
        }
        var openingBracket = at + EmptyResiduals.Length - 1;
        await destination.WriteAsync(frame.AsMemory(0, openingBracket), cancellationToken);
        await WriteResidualsAsync(report.Residuals, destination, cancellationToken);
        await destination.WriteAsync(frame.AsMemory(openingBracket), cancellationToken);
    }

    /// <summary>The residual objects, comma-separated, in list order; a window of batches is rendered at once on the thread pool.</summary>
    private static async Task WriteResidualsAsync(IReadOnlyList<Residual> residuals, Stream destination, CancellationToken cancellationToken)
    {
        var batches = (residuals.Count + BatchResiduals - 1) / BatchResiduals;
        var window = batches <= 1 ? 1 : Math.Min(batches, 2 * Environment.ProcessorCount);
        var buffers = Enumerable.Range(0, window).Select(_ => new ArrayBufferWriter<byte>()).ToArray();
        for (var first = 0; first < batches; first += window)
        {
            var count = Math.Min(window, batches - first);
            if (count == 1)
                Render(residuals, first, buffers[0]);
            else
                Parallel.For(0, count, slot => Render(residuals, first + slot, buffers[slot]));
            for (var slot = 0; slot < count; slot++)
            {
                await destination.WriteAsync(buffers[slot].WrittenMemory, cancellationToken);
                buffers[slot].ResetWrittenCount();
            }
        }
    }

    private static void Render(IReadOnlyList<Residual> residuals, int batch, ArrayBufferWriter<byte> buffer)
    {
        var cache = new EncodedStringCache();
        var table = residuals as Assessment.ResidualTable;
        var end = Math.Min(residuals.Count, (batch + 1) * BatchResiduals);
        for (var i = batch * BatchResiduals; i < end; i++)
        {
            // From the table's columns when the report was just computed (no residual object made), else from the objects.
            var residual = table is not null ? ResidualFields.Of(table, i) : ResidualFields.Of(residuals[i]);
            var span = buffer.GetSpan(ResidualJsonBytes.MaximumLength(residual) + 1);
            var written = 0;
            if (i > 0)
                span[written++] = (byte)',';
            written += ResidualJsonBytes.Write(residual, span[written..], ref cache);
            buffer.Advance(written);
        }
    }
}
