using System.Buffers;
using System.Text.Json;

namespace QaService.Core.Reporting;

/// <summary>
/// Renders residual objects straight to UTF-8: the one definition of a residual's JSON (names, order, fixed-resolution
/// numbers), used by <see cref="ResidualJsonConverter"/> and by the parallel report writer. Strings are escaped as
/// <see cref="Utf8JsonWriter"/> does with the default encoder: printable ASCII that the encoder leaves alone is copied
/// as it is; any other string goes through <see cref="JsonEncodedText"/>, the encoder itself.
/// </summary>
internal static class ResidualJsonBytes
{
    private static readonly byte[] MarkPrefix = "{\"mark\":"u8.ToArray(), FixPrefix = ",\"fix\":"u8.ToArray(),
        DEPrefix = ",\"dE\":"u8.ToArray(), DNPrefix = ",\"dN\":"u8.ToArray(), DUPrefix = ",\"dU\":"u8.ToArray(),
        DHPrefix = ",\"dH\":"u8.ToArray(), PairedByPrefix = ",\"pairedBy\":"u8.ToArray(), ExcludedPrefix = ",\"excluded\":"u8.ToArray(),
        LatitudePrefix = ",\"markLatitude\":"u8.ToArray(), LongitudePrefix = ",\"markLongitude\":"u8.ToArray(), Null = "null"u8.ToArray(),
        FeatureClassPrefix = ",\"featureClass\":"u8.ToArray(), CrewPrefix = ",\"crew\":"u8.ToArray(), ReceiverPrefix = ",\"receiver\":"u8.ToArray(),
        FixSigmaHPrefix = ",\"fixSigmaH\":"u8.ToArray(), HdopPrefix = ",\"hdop\":"u8.ToArray(), QualityPrefix = ",\"quality\":"u8.ToArray();

    /// <summary>Decimals written for a reported HDOP (receivers give one or two).</summary>
    public const int HdopDecimals = 3;

    /// <summary>Fixed bytes of one object besides its strings: names, punctuation and six numbers at their longest.</summary>
    private const int FixedPartBytes = 260 + 8 * FixedDecimalUtf8.MaximumBytes;

    /// <summary>Most bytes one character can become (<c>\uXXXX</c>, or a surrogate pair's 12 bytes for 2 chars).</summary>
    private const int MaximumBytesPerChar = 6;

    /// <summary>An upper bound of the bytes <see cref="Write"/> needs for <paramref name="residual"/>.</summary>
    public static int MaximumLength(in ResidualFields residual) =>
        FixedPartBytes + MaximumBytesPerChar * (residual.Mark.Length + residual.Fix.Length + residual.PairedBy.Length + (residual.Excluded?.Length ?? 0) + 8
            + (residual.Attributes is { } a ? (a.FeatureClass?.Length ?? 0) + (a.Crew?.Length ?? 0) + (a.Receiver?.Length ?? 0) + (a.Quality?.Length ?? 0) : 0));

    /// <summary>Writes one residual object; the destination holds at least <see cref="MaximumLength"/> bytes. Returns bytes written.</summary>
    public static int Write(in ResidualFields residual, Span<byte> destination, ref EncodedStringCache cache)
    {
        var at = 0;
        Append(MarkPrefix, destination, ref at);
        AppendString(residual.Mark, destination, ref at, ref cache);
        Append(FixPrefix, destination, ref at);
        AppendString(residual.Fix.Span, destination, ref at);
        Append(DEPrefix, destination, ref at);
        AppendNumber(residual.DE, ResidualJsonConverter.ComponentDecimals, destination, ref at);
        Append(DNPrefix, destination, ref at);
        AppendNumber(residual.DN, ResidualJsonConverter.ComponentDecimals, destination, ref at);
        Append(DUPrefix, destination, ref at);
        if (residual.DU is { } up)
            AppendNumber(up, ResidualJsonConverter.ComponentDecimals, destination, ref at);
        else
            Append(Null, destination, ref at);
        Append(DHPrefix, destination, ref at);
        AppendNumber(residual.DH, ResidualJsonConverter.ComponentDecimals, destination, ref at);
        Append(PairedByPrefix, destination, ref at);
        AppendString(residual.PairedBy, destination, ref at, ref cache);
        Append(ExcludedPrefix, destination, ref at);
        if (residual.Excluded is { } reason)
            AppendString(reason, destination, ref at, ref cache);
        else
            Append(Null, destination, ref at);
        Append(LatitudePrefix, destination, ref at);
        AppendNumber(residual.MarkLatitude, ResidualJsonConverter.DegreeDecimals, destination, ref at);
        Append(LongitudePrefix, destination, ref at);
        AppendNumber(residual.MarkLongitude, ResidualJsonConverter.DegreeDecimals, destination, ref at);
        // The fix's attributes, each only when given: a report without them keeps the bytes it always had.
        if (residual.Attributes is { } attributes)
        {
            OptionalString(FeatureClassPrefix, attributes.FeatureClass, destination, ref at, ref cache);
            OptionalString(CrewPrefix, attributes.Crew, destination, ref at, ref cache);
            OptionalString(ReceiverPrefix, attributes.Receiver, destination, ref at, ref cache);
            if (attributes.SigmaHorizontalMetres is { } sigma)
            {
                Append(FixSigmaHPrefix, destination, ref at);
                AppendNumber(sigma, ResidualJsonConverter.ComponentDecimals, destination, ref at);
            }
            if (attributes.Hdop is { } hdop)
            {
                Append(HdopPrefix, destination, ref at);
                AppendNumber(hdop, HdopDecimals, destination, ref at);
            }
            OptionalString(QualityPrefix, attributes.Quality, destination, ref at, ref cache);
        }
        destination[at++] = (byte)'}';
        return at;
    }

    private static void OptionalString(ReadOnlySpan<byte> prefix, string? text, Span<byte> destination, ref int at, ref EncodedStringCache cache)
    {
        if (text is null)
            return;
        Append(prefix, destination, ref at);
        AppendString(text, destination, ref at, ref cache);
    }

    private static void Append(ReadOnlySpan<byte> bytes, Span<byte> destination, ref int at) => Utf8Appender.Append(bytes, destination, ref at);

    /// <summary>Out of the fixed range (or not finite): the writer's own number form, as the converter falls back to.</summary>
    private static void AppendNumber(double value, int decimals, Span<byte> destination, ref int at) =>
        Utf8Appender.AppendNumber(value, decimals, value, destination, ref at);

    /// <summary>A text that is not one shared string (a fix id read in place): escaped without the cache when it needs it.</summary>
    private static void AppendString(ReadOnlySpan<char> text, Span<byte> destination, ref int at)
    {
        if (!TryAppendPlain(text, destination, ref at))
            AppendQuoted(JsonEncodedText.Encode(text).EncodedUtf8Bytes, destination, ref at);
    }

    private static void AppendString(string text, Span<byte> destination, ref int at, ref EncodedStringCache cache)
    {
        if (!TryAppendPlain(text, destination, ref at))
            AppendQuoted(cache.Encode(text), destination, ref at);
    }

    /// <summary>Writes a text the encoder leaves alone, quoted, byte per character; false (nothing written) for any other.</summary>
    private static bool TryAppendPlain(ReadOnlySpan<char> text, Span<byte> destination, ref int at)
    {
        if (!IsPlain(text))
            return false;
        destination[at] = (byte)'"';
        for (var i = 0; i < text.Length; i++)
            destination[at + 1 + i] = (byte)text[i];
        at += text.Length + 1;
        destination[at++] = (byte)'"';
        return true;
    }

    private static void AppendQuoted(ReadOnlySpan<byte> encoded, Span<byte> destination, ref int at)
    {
        destination[at++] = (byte)'"';
        Append(encoded, destination, ref at);
        destination[at++] = (byte)'"';
    }

    /// <summary>
    /// True when the default encoder (System.Text.Encodings.Web JavaScriptEncoder.Default, which System.Text.Json
    /// writes with) leaves every character as it is: printable ASCII except <c>" \ &amp; ' &lt; &gt; + `</c>.
    /// </summary>
    private static bool IsPlain(ReadOnlySpan<char> text)
    {
        foreach (var c in text)
        {
            if (c < ' ' || c > '~' || c is '"' or '\\' or '&' or '\'' or '<' or '>' or '+' or '`')
                return false;
        }
        return true;
    }
}

/// <summary>
/// The last string that needed escaping and its encoding: consecutive residuals of one mark repeat the same id
/// string instance, so one entry saves encoding it again. One per rendering thread.
/// </summary>
internal struct EncodedStringCache
{
    private string? last;
    private byte[]? lastEncoded;

    public ReadOnlySpan<byte> Encode(string text)
    {
        if (!ReferenceEquals(text, last))
        {
            lastEncoded = JsonEncodedText.Encode(text).EncodedUtf8Bytes.ToArray();
            last = text;
        }
        return lastEncoded;
    }
}

/// <summary>
/// One residual's values as the writer reads them, from a <see cref="Residual"/> object or straight from a row of an
/// <see cref="Assessment.ResidualTable"/> (a value on the stack: no object per residual).
/// </summary>
internal readonly record struct ResidualFields(string Mark, ReadOnlyMemory<char> Fix, double DE, double DN, double? DU, double DH, string PairedBy, string? Excluded,
    double MarkLatitude, double MarkLongitude, Assessment.FixAttributes? Attributes)
{
    public static ResidualFields Of(Residual r) =>
        new(r.Mark, r.Fix.AsMemory(), r.DE, r.DN, r.DU, r.DH, r.PairedBy, r.Excluded, r.MarkLatitude, r.MarkLongitude, r.Attributes);

    public static ResidualFields Of(Assessment.ResidualTable table, int row)
    {
        var mark = table.MarkPosition(row);
        return new(table.MarkId(row), table.FixIdText(row), table.East[row], table.North[row], table.UpOrNull(row), table.Horizontal[row],
            table.PairedBy(row), table.ExclusionReason(row), mark.LatitudeDegrees, mark.LongitudeDegrees, table.Attributes(row));
    }
}
