using System.Buffers;
using System.Text.Json;
using QaService.Core.Reporting;
using QaService.Core.Statistics;

namespace QaService.Core.Projects;

/// <summary>
/// The headline figures of one delivery (a stored report) for a project's trend, metres. Nothing is computed here:
/// each value is the report's own (<c>horizontal.n</c>, <c>horizontal.nssda95</c>, <c>horizontal.rmseR</c> = RMSE_H,
/// <c>vertical.n</c>, <c>vertical.nssda95</c>, <c>vertical.rmse</c> = RMSE_V); null where the report has no such block.
/// </summary>
public sealed record DeliveryFigures(int? HorizontalN, double? HorizontalNssda95, double? RmseH, int? VerticalN, double? VerticalNssda95, double? RmseV)
{
    /// <summary>
    /// Bytes asked for by the first read of the stored JSON; each further read asks for as much as has been read, so
    /// a long head costs a few reads. The two blocks sit in about the first kilobyte of a report (the report writes
    /// them right after its id, title, time, verdict and counts), so one read usually does: a project page reads every
    /// delivery's head, and a first read of 16 KiB made that page read (and page in, SQLite caching pages per
    /// connection) four to five database pages per delivery instead of one or two.
    /// </summary>
    internal const int FirstReadBytes = 2 * 1024;

    public static DeliveryFigures Of(AssessmentReport report) => From(report.Horizontal, report.Vertical);

    /// <summary>
    /// Reads only the top-level <c>horizontal</c> and <c>vertical</c> blocks of a report's JSON and stops there, so a
    /// report with a million residuals costs a few kilobytes (the report writes both blocks before <c>residuals</c>).
    /// Lenient like every stored-report reader: unknown fields are skipped.
    /// </summary>
    public static async Task<DeliveryFigures> ReadAsync(Stream json, CancellationToken cancellationToken)
    {
        var buffer = new ArrayBufferWriter<byte>(FirstReadBytes);
        while (true)
        {
            int step = Math.Max(FirstReadBytes, buffer.WrittenCount);
            int read = await json.ReadAsync(buffer.GetMemory(step)[..step], cancellationToken);
            buffer.Advance(read);
            bool final = read == 0;
            if (TryRead(buffer.WrittenSpan, final) is { } figures)
                return figures;
            if (final)
                throw new JsonException("the stored report ended before its horizontal and vertical blocks");
        }
    }

    /// <summary>The figures when the bytes so far hold both blocks (or the whole report); null when more bytes are needed.</summary>
    private static DeliveryFigures? TryRead(ReadOnlySpan<byte> data, bool final)
    {
        var reader = new Utf8JsonReader(data, final, default);
        (bool Seen, HorizontalAccuracy? Value) horizontal = default;
        (bool Seen, VerticalAccuracy? Value) vertical = default;
        if (!reader.Read())
            return null;
        if (reader.TokenType != JsonTokenType.StartObject)
            throw new JsonException("a stored report is a JSON object");
        while (!(horizontal.Seen && vertical.Seen))
        {
            if (!reader.Read())
                return null;
            if (reader.TokenType == JsonTokenType.EndObject)
                break;
            bool isHorizontal = reader.ValueTextEquals("horizontal"u8), isVertical = reader.ValueTextEquals("vertical"u8);
            if (!reader.Read())
                return null;
            long start = reader.TokenStartIndex;
            if (!reader.TrySkip())
                return null;
            var value = data[(int)start..(int)reader.BytesConsumed];
            if (isHorizontal)
                horizontal = (true, JsonSerializer.Deserialize<HorizontalAccuracy>(value, ReportJson.StoredReport));
            else if (isVertical)
                vertical = (true, JsonSerializer.Deserialize<VerticalAccuracy>(value, ReportJson.StoredReport));
        }

        return From(horizontal.Value, vertical.Value);
    }

    private static DeliveryFigures From(HorizontalAccuracy? h, VerticalAccuracy? v) =>
        new(h?.N, h?.Nssda95, h?.RmseR, v?.N, v?.Nssda95, v?.Rmse);
}
