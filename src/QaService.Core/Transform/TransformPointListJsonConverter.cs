using System.Text.Json;
using System.Text.Json.Serialization;

namespace QaService.Core.Transform;

/// <summary>
/// Reads a transform request's <c>points</c> array straight into <see cref="TransformPointColumns"/>, each point by
/// <see cref="TransformPointJsonConverter.ReadFields"/> (the same strictness). The serializer hands over the whole array
/// at once, so the points are read in one tight loop rather than one serializer step and one object each. A failure
/// names the point's index in <see cref="Exception.Data"/> under <see cref="IndexKey"/> (and the field under
/// <see cref="TransformPointJsonConverter.MemberKey"/>), so the problem can point at <c>/points/3/lat</c>.
/// </summary>
public sealed class TransformPointListJsonConverter : JsonConverter<IReadOnlyList<TransformPoint?>>
{
    /// <summary>Key in <see cref="Exception.Data"/> of the index of the point a reading error is about.</summary>
    public const string IndexKey = "json-index";

    private static readonly TransformPointJsonConverter Point = new();

    public override IReadOnlyList<TransformPoint?> Read(ref Utf8JsonReader reader, Type typeToConvert, JsonSerializerOptions options)
    {
        if (reader.TokenType != JsonTokenType.StartArray)
            throw new JsonException("The JSON value could not be converted to a list of points.");
        var columns = new TransformPointColumns();
        Span<double> values = stackalloc double[TransformPointJsonConverter.FieldCount];
        Span<bool> present = stackalloc bool[TransformPointJsonConverter.FieldCount];
        while (reader.Read() && reader.TokenType != JsonTokenType.EndArray)
        {
            try
            {
                if (reader.TokenType == JsonTokenType.Null)
                {
                    columns.AddNull();
                    continue;
                }
                TransformPointJsonConverter.ReadFields(ref reader, values, present);
                columns.Add(values, present);
            }
            catch (JsonException exception)
            {
                exception.Data[IndexKey] = columns.Count;
                throw;
            }
        }
        return columns;
    }

    public override void Write(Utf8JsonWriter writer, IReadOnlyList<TransformPoint?> value, JsonSerializerOptions options)
    {
        writer.WriteStartArray();
        foreach (var point in value)
        {
            if (point is null)
                writer.WriteNullValue();
            else
                Point.Write(writer, point, options);
        }
        writer.WriteEndArray();
    }

    /// <summary>
    /// Where a body broke off inside the <c>points</c> array when the serializer rejected it before this converter ran
    /// (it checks that the whole array is complete first): the index of the first point that is not a complete JSON
    /// value, or null when the body breaks elsewhere. Reads only the structure, once, on the failure path.
    /// </summary>
    public static int? BrokenPointIndex(ReadOnlySpan<byte> body)
    {
        var reader = new Utf8JsonReader(body, new JsonReaderOptions { CommentHandling = JsonCommentHandling.Disallow });
        var inPoints = false;
        var complete = 0;
        try
        {
            while (reader.Read())
            {
                if (!inPoints)
                {
                    if (reader.CurrentDepth == 1 && reader.TokenType == JsonTokenType.PropertyName && reader.ValueTextEquals("points"))
                    {
                        reader.Read();
                        if (reader.TokenType != JsonTokenType.StartArray)
                            return null;
                        inPoints = true;
                    }
                    continue;
                }
                if (reader.TokenType == JsonTokenType.EndArray && reader.CurrentDepth == 1)
                    return null;
                reader.Skip();
                complete++;
            }
        }
        catch (JsonException)
        {
            return inPoints ? complete : null;
        }
        return inPoints ? complete : null;
    }
}
