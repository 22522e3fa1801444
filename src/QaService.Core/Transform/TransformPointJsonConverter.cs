using System.Text.Json;
using System.Text.Json.Serialization;
using QaService.Core.Reporting;

namespace QaService.Core.Transform;

/// <summary>
/// Reads one <see cref="TransformPoint"/> (a flat object of optional numbers) without the serializer's
/// constructor-argument path, which dominated reading a 200,000-point body. Strict like <c>ReportJson.Read</c>:
/// exact camelCase names, JSON numbers only, no unknown or repeated field. A failure names the field in
/// <see cref="Exception.Data"/> under <see cref="MemberKey"/>, so the request's problem can point at
/// <c>/points/3/lat</c>; the serializer adds the path up to the point.
/// </summary>
public sealed class TransformPointJsonConverter : JsonConverter<TransformPoint>
{
    /// <summary>Key in <see cref="Exception.Data"/> of the field a reading error is about.</summary>
    public const string MemberKey = "json-member";

    internal const int FieldCount = 8;

    public override TransformPoint Read(ref Utf8JsonReader reader, Type typeToConvert, JsonSerializerOptions options)
    {
        Span<double> values = stackalloc double[FieldCount];
        Span<bool> present = stackalloc bool[FieldCount];
        ReadFields(ref reader, values, present);
        return new TransformPoint(
            present[0] ? values[0] : null, present[1] ? values[1] : null, present[2] ? values[2] : null, present[3] ? values[3] : null,
            present[4] ? values[4] : null, present[5] ? values[5] : null, present[6] ? values[6] : null, present[7] ? values[7] : null);
    }

    /// <summary>
    /// Reads one point object at the reader into <paramref name="values"/> by field (TransformPoint
    /// order), <paramref name="present"/> set where a number was given; the one definition of a point's strictness.
    /// </summary>
    internal static void ReadFields(ref Utf8JsonReader reader, scoped Span<double> values, scoped Span<bool> present)
    {
        if (reader.TokenType != JsonTokenType.StartObject)
            throw new JsonException("The JSON value could not be converted to a point object.");
        Span<bool> seen = stackalloc bool[FieldCount];
        present.Clear();
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
            if (!PointFieldReading.TryReadNumber(ref reader, out values[field]))
                throw PointFieldReading.Failure("The JSON value could not be converted to a number.", Names[field]);
            present[field] = true;
        }
        if (reader.TokenType != JsonTokenType.EndObject)
            throw new JsonException("A point object is not closed.");
    }

    /// <summary>Writes the fields that are set, as a client sends them (the service itself only reads points).</summary>
    public override void Write(Utf8JsonWriter writer, TransformPoint value, JsonSerializerOptions options)
    {
        writer.WriteStartObject();
        double?[] fields = [value.Lat, value.Lon, value.E, value.N, value.X, value.Y, value.Z, value.H];
        for (var i = 0; i < fields.Length; i++)
        {
            if (fields[i] is { } number)
                writer.WriteNumber(Names[i], number);
        }
        writer.WriteEndObject();
    }

    /// <summary>Field names in <see cref="TransformPoint"/> constructor order.</summary>
    internal static readonly string[] Names = ["lat", "lon", "e", "n", "x", "y", "z", "h"];

    private static readonly FieldNameTable Fields = new(Names);
}
