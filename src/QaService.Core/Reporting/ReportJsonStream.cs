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
        using var frame = Frame(report);
        var openingBracket = OpeningBracket(frame.WrittenSpan);
        if (openingBracket < 0)
        {
            await JsonSerializer.SerializeAsync(destination, report, ReportJson.Write, cancellationToken);
            return;
        }
        await destination.WriteAsync(frame.WrittenMemory[..openingBracket], cancellationToken);
        await WriteResidualsAsync(report.Residuals, destination, cancellationToken);
        await destination.WriteAsync(frame.WrittenMemory[openingBracket..], cancellationToken);
    }

    /// <summary>The same bytes into a buffer, on the calling thread: for reports small enough to hold in memory.</summary>
    public static void Write(AssessmentReport report, PooledBufferWriter destination)
    {
        using var frame = Frame(report);
        var openingBracket = OpeningBracket(frame.WrittenSpan);
        if (openingBracket < 0)
        {
            using var writer = new Utf8JsonWriter(destination);
            JsonSerializer.Serialize(writer, report, ReportJson.Write);
            return;
        }
        destination.Write(frame.WrittenSpan[..openingBracket]);
        var batches = (report.Residuals.Count + BatchResiduals - 1) / BatchResiduals;
        for (var batch = 0; batch < batches; batch++)
            Render(report.Residuals, batch, destination);
        destination.Write(frame.WrittenSpan[openingBracket..]);
    }

    /// <summary>Everything but the residuals: the report serialised with an empty residual array, into a pooled buffer.</summary>
    private static PooledBufferWriter Frame(AssessmentReport report)
    {
        var frame = new PooledBufferWriter();
        // Default writer options are the serializer's for ReportJson.Write (default encoder, not indented): the same bytes.
        // Through the context's own type info, not ReportJson.Write: options with a converter, or a combined resolver, turn
        // off the generated direct writer. The frame holds no residual, the one type ReportJson.Write converts otherwise;
        // ReportJsonIdentityTests check whole reports byte for byte against the reflection serializer.
        using var writer = new Utf8JsonWriter(frame);
        JsonSerializer.Serialize(writer, report with { Residuals = [] }, ReportJsonContext.Default.AssessmentReport);
        return frame;
    }

    /// <summary>Where the residual array's opening bracket is in the frame, or −1 when the splice cannot be trusted.</summary>
    private static int OpeningBracket(ReadOnlySpan<byte> frame)
    {
        var at = frame.IndexOf(EmptyResiduals);
        if (at < 0 || frame[(at + EmptyResiduals.Length)..].IndexOf(EmptyResiduals) >= 0)
            return -1;
        return at + EmptyResiduals.Length - 1;
    }

    /// <summary>The residual objects, comma-separated, in list order; a window of batches is rendered at once on the thread pool.</summary>
    private static Task WriteResidualsAsync(IReadOnlyList<Residual> residuals, Stream destination, CancellationToken cancellationToken) =>
        OrderedBlockRendering.WriteAsync((residuals.Count + BatchResiduals - 1) / BatchResiduals,
            (batch, buffer) => Render(residuals, batch, buffer), bytes => destination.WriteAsync(bytes, cancellationToken));

    private static void Render(IReadOnlyList<Residual> residuals, int batch, PooledBufferWriter buffer)
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
