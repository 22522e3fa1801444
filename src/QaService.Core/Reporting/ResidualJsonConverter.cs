using System.Buffers;
using System.Text.Json;
using System.Text.Json.Serialization;

namespace QaService.Core.Reporting;

/// <summary>
/// Writes and reads one <see cref="Residual"/> object. Writing is the hot loop of a large report (one object per fix),
/// so it is rendered straight to UTF-8 (<see cref="ResidualJsonBytes"/>) with the numbers at a fixed resolution: residual components to the
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

    /// <summary>Renders through <see cref="ResidualJsonBytes"/>, the one definition of a residual's JSON, as a raw value.</summary>
    public override void Write(Utf8JsonWriter writer, Residual value, JsonSerializerOptions options)
    {
        var fields = ResidualFields.Of(value);
        var buffer = ArrayPool<byte>.Shared.Rent(ResidualJsonBytes.MaximumLength(fields));
        try
        {
            var cache = new EncodedStringCache();
            var length = ResidualJsonBytes.Write(fields, buffer, ref cache);
            writer.WriteRawValue(buffer.AsSpan(0, length), skipInputValidation: true);
        }
        finally
        {
            ArrayPool<byte>.Shared.Return(buffer);
        }
    }

    public override Residual Read(ref Utf8JsonReader reader, Type typeToConvert, JsonSerializerOptions options)
    {
        if (reader.TokenType != JsonTokenType.StartObject)
            throw new JsonException("a residual is a JSON object");
        string? mark = null, fix = null, pairedBy = null, excluded = null, featureClass = null, crew = null, receiver = null, quality = null;
        double? sigma = null, hdop = null;
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
                case "featureClass": featureClass = reader.GetString(); break;
                case "crew": crew = reader.GetString(); break;
                case "receiver": receiver = reader.GetString(); break;
                case "fixSigmaH": sigma = reader.GetDouble(); break;
                case "hdop": hdop = reader.GetDouble(); break;
                case "quality": quality = reader.GetString(); break;
                default: reader.Skip(); break; // a field from another build: reports stay readable
            }
        }
        if (reader.TokenType != JsonTokenType.EndObject)
            throw new JsonException("a residual object is not closed");
        return new Residual(mark ?? throw new JsonException("a residual has no mark"), fix ?? throw new JsonException("a residual has no fix"),
            dE, dN, dU, dH, pairedBy ?? "id", excluded, latitude, longitude)
        {
            Attributes = featureClass is null && crew is null && receiver is null && sigma is null && hdop is null && quality is null
                ? null
                : new Assessment.FixAttributes(featureClass, crew, receiver, sigma, hdop, quality),
        };
    }
}
