using System.Buffers;
using System.Text.Json;

namespace QaService.Core.Reporting;

/// <summary>
/// Appends UTF-8 JSON pieces at a position in a span that the caller sized for them: the shared steps of the writers
/// that render many small objects straight to bytes (report residuals, transform points).
/// </summary>
public static class Utf8Appender
{
    public static void Append(ReadOnlySpan<byte> bytes, Span<byte> destination, ref int at)
    {
        bytes.CopyTo(destination[at..]);
        at += bytes.Length;
    }

    /// <summary>
    /// <paramref name="value"/> at a fixed resolution (<see cref="FixedDecimalUtf8"/>); outside its range (or not finite),
    /// <paramref name="fallback"/> as <see cref="Utf8JsonWriter"/> writes a number. At most <see cref="FixedDecimalUtf8.MaximumBytes"/> bytes.
    /// </summary>
    public static void AppendNumber(double value, int decimals, double fallback, Span<byte> destination, ref int at)
    {
        if (FixedDecimalUtf8.TryFormat(value, decimals, destination[at..], out var written))
        {
            at += written;
            return;
        }
        var buffer = new ArrayBufferWriter<byte>(FixedDecimalUtf8.MaximumBytes);
        using (var writer = new Utf8JsonWriter(buffer))
            writer.WriteNumberValue(fallback);
        Append(buffer.WrittenSpan, destination, ref at);
    }
}
