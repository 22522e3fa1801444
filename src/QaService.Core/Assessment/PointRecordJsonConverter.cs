using System.Text.Json;
using System.Text.Json.Serialization;
using QaService.Core.Reporting;

namespace QaService.Core.Assessment;

/// <summary>
/// Reads one <see cref="PointRecord"/> (a flat object of optional numbers, strings and a time) without the serializer's
/// path for records with many constructor parameters, which boxes every argument into an array per point (the largest
/// allocation of a small JSON assessment). Strict like <c>ReportJson.Read</c>: exact camelCase names, JSON numbers for
/// numbers, JSON strings for names and the ISO 8601 time (read as the serializer reads a DateTimeOffset), no unknown or
/// repeated field. A failure names the field in <see cref="Exception.Data"/> under
/// <see cref="Transform.TransformPointJsonConverter.MemberKey"/>, so the problem points at <c>/fixes/points/3/lat</c>.
/// </summary>
public sealed class PointRecordJsonConverter : JsonConverter<PointRecord>
{
    /// <summary>Field names in <see cref="PointRecord"/> constructor order.</summary>
    private static readonly string[] Names =
        ["id", "mark", "lat", "lon", "e", "n", "x", "y", "z", "h", "sigmaH", "sigmaV", "time", "featureClass", "crew", "receiver", "hdop", "quality", "vE", "vN", "vU"];

    private static readonly FieldNameTable Fields = new(Names);

    private enum Kind { Text, Number, Time }

    private static readonly Kind[] Kinds =
    [
        Kind.Text, Kind.Text, Kind.Number, Kind.Number, Kind.Number, Kind.Number, Kind.Number, Kind.Number, Kind.Number, Kind.Number, Kind.Number,
        Kind.Number, Kind.Time, Kind.Text, Kind.Text, Kind.Text, Kind.Number, Kind.Text, Kind.Number, Kind.Number, Kind.Number,
    ];

    /// <summary>One text slot per field (only the text fields are used), held on the stack.</summary>
    [System.Runtime.CompilerServices.InlineArray(FieldCount)]
    private struct FieldTexts
    {
        private string? first;
    }

    private const int FieldCount = 21;

    public override PointRecord Read(ref Utf8JsonReader reader, Type typeToConvert, JsonSerializerOptions options)
    {
        if (reader.TokenType != JsonTokenType.StartObject)
            throw new JsonException("The JSON value could not be converted to a point object.");
        System.Diagnostics.Debug.Assert(Names.Length == FieldCount && Kinds.Length == FieldCount);
        Span<double> numbers = stackalloc double[FieldCount];
        Span<bool> given = stackalloc bool[FieldCount];
        Span<bool> seen = stackalloc bool[FieldCount];
        var texts = new FieldTexts(); // on the stack: no array per point
        DateTimeOffset? time = null;
        while (reader.Read() && reader.TokenType == JsonTokenType.PropertyName)
        {
            var field = Fields.IndexOf(ref reader);
            if (field < 0)
                throw PointFieldReading.Failure($"The JSON property '{reader.GetString()}' could not be mapped to a point.", reader.GetString()!);
            if (seen[field])
                throw PointFieldReading.Failure("Duplicate property in a point.", Names[field]);
            seen[field] = true;
            reader.Read();
            if (reader.TokenType == JsonTokenType.Null)
                continue;
            switch (Kinds[field])
            {
                case Kind.Number when PointFieldReading.TryReadNumber(ref reader, out numbers[field]):
                    given[field] = true;
                    break;
                case Kind.Text when reader.TokenType == JsonTokenType.String:
                    texts[field] = reader.GetString();
                    break;
                case Kind.Time when reader.TokenType == JsonTokenType.String && reader.TryGetDateTimeOffset(out var t):
                    time = t;
                    break;
                default:
                    throw PointFieldReading.Failure("The JSON value could not be converted to the field's type.", Names[field]);
            }
        }
        if (reader.TokenType != JsonTokenType.EndObject)
            throw new JsonException("A point object is not closed.");
        double? Number(int field, ReadOnlySpan<double> values, ReadOnlySpan<bool> present) => present[field] ? values[field] : null;
        return new PointRecord(texts[0], texts[1], Number(2, numbers, given), Number(3, numbers, given), Number(4, numbers, given), Number(5, numbers, given),
            Number(6, numbers, given), Number(7, numbers, given), Number(8, numbers, given), Number(9, numbers, given), Number(10, numbers, given),
            Number(11, numbers, given), time, texts[13], texts[14], texts[15], Number(16, numbers, given), texts[17],
            Number(18, numbers, given), Number(19, numbers, given), Number(20, numbers, given));
    }

    /// <summary>Writes the fields that are set, as a client sends them (the service itself only reads points).</summary>
    public override void Write(Utf8JsonWriter writer, PointRecord value, JsonSerializerOptions options)
    {
        writer.WriteStartObject();
        object?[] fields =
        [
            value.Id, value.Mark, value.Lat, value.Lon, value.E, value.N, value.X, value.Y, value.Z, value.H, value.SigmaH, value.SigmaV, value.Time,
            value.FeatureClass, value.Crew, value.Receiver, value.Hdop, value.Quality, value.VE, value.VN, value.VU,
        ];
        for (var i = 0; i < fields.Length; i++)
        {
            switch (fields[i])
            {
                case string text:
                    writer.WriteString(Names[i], text);
                    break;
                case double number:
                    writer.WriteNumber(Names[i], number);
                    break;
                case DateTimeOffset time:
                    writer.WriteString(Names[i], time);
                    break;
            }
        }
        writer.WriteEndObject();
    }
}
