using System.Text.Json;
using System.Text.Json.Serialization;

namespace QaService.Core.Reporting;

/// <summary>
/// Writes and reads one <see cref="Residual"/> object. Writing is the hot loop of a large report (one object per fix),
/// so the names are pre-encoded and the numbers written at a fixed resolution: residual components to the
/// micrometre, mark positions to 1e-9 degree (about 0.1 mm on the ground), far below what any GNSS fix resolves
/// (the statistics are computed from the unrounded values). Reading accepts any number form, so reports stored
/// with full-precision numbers still load.
/// </summary>
public sealed class ResidualJsonConverter : JsonConverter<Residual>
{
    /// <summary>Decimals of a metre written for dE, dN, dU, dH: 1 µm.</summary>
    public const int ComponentDecimals = 6;

    /// <summary>Decimals of a degree written for the mark's latitude and longitude: 1e-9° ≈ 0.11 mm of latitude.</summary>
    public const int DegreeDecimals = 9;

    private static readonly JsonEncodedText MarkName = JsonEncodedText.Encode("mark"), FixName = JsonEncodedText.Encode("fix"),
        DEName = JsonEncodedText.Encode("dE"), DNName = JsonEncodedText.Encode("dN"), DUName = JsonEncodedText.Encode("dU"),
        DHName = JsonEncodedText.Encode("dH"), PairedByName = JsonEncodedText.Encode("pairedBy"), ExcludedName = JsonEncodedText.Encode("excluded"),
        LatitudeName = JsonEncodedText.Encode("markLatitude"), LongitudeName = JsonEncodedText.Encode("markLongitude");

    public override void Write(Utf8JsonWriter writer, Residual value, JsonSerializerOptions options)
    {
        writer.WriteStartObject();
        writer.WriteString(MarkName, value.Mark);
        writer.WriteString(FixName, value.Fix);
        WriteFixed(writer, DEName, value.DE, ComponentDecimals);
        WriteFixed(writer, DNName, value.DN, ComponentDecimals);
        if (value.DU is { } up)
            WriteFixed(writer, DUName, up, ComponentDecimals);
        else
            writer.WriteNull(DUName);
        WriteFixed(writer, DHName, value.DH, ComponentDecimals);
        writer.WriteString(PairedByName, value.PairedBy);
        if (value.Excluded is { } reason)
            writer.WriteString(ExcludedName, reason);
        else
            writer.WriteNull(ExcludedName);
        WriteFixed(writer, LatitudeName, value.MarkLatitude, DegreeDecimals);
        WriteFixed(writer, LongitudeName, value.MarkLongitude, DegreeDecimals);
        writer.WriteEndObject();
    }

    private static void WriteFixed(Utf8JsonWriter writer, JsonEncodedText name, double value, int decimals)
    {
        Span<byte> text = stackalloc byte[FixedDecimalUtf8.MaximumBytes];
        writer.WritePropertyName(name);
        if (FixedDecimalUtf8.TryFormat(value, decimals, text, out var length))
            writer.WriteRawValue(text[..length], skipInputValidation: true);
        else
            writer.WriteNumberValue(value);
    }

    public override Residual Read(ref Utf8JsonReader reader, Type typeToConvert, JsonSerializerOptions options)
    {
        if (reader.TokenType != JsonTokenType.StartObject)
            throw new JsonException("a residual is a JSON object");
        string? mark = null, fix = null, pairedBy = null, excluded = null;
        double dE = 0, dN = 0, dH = 0, latitude = 0, longitude = 0;
        double? dU = null;
        while (reader.Read() && reader.TokenType == JsonTokenType.PropertyName)
        {
            var name = reader.GetString();
            reader.Read();
            switch (name)
            {
                case "mark": mark = reader.GetString(); break;
                case "fix": fix = reader.GetString(); break;
                case "dE": dE = reader.GetDouble(); break;
                case "dN": dN = reader.GetDouble(); break;
                case "dU": dU = reader.TokenType == JsonTokenType.Null ? null : reader.GetDouble(); break;
                case "dH": dH = reader.GetDouble(); break;
                case "pairedBy": pairedBy = reader.GetString(); break;
                case "excluded": excluded = reader.TokenType == JsonTokenType.Null ? null : reader.GetString(); break;
                case "markLatitude": latitude = reader.GetDouble(); break;
                case "markLongitude": longitude = reader.GetDouble(); break;
                default: reader.Skip(); break; // a field from another build: reports stay readable
            }
        }
        if (reader.TokenType != JsonTokenType.EndObject)
            throw new JsonException("a residual object is not closed");
        return new Residual(mark ?? throw new JsonException("a residual has no mark"), fix ?? throw new JsonException("a residual has no fix"),
            dE, dN, dU, dH, pairedBy ?? "id", excluded, latitude, longitude);
    }
}
