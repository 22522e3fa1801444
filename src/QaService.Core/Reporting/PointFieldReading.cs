using System.Text.Json;

namespace QaService.Core.Reporting;

/// <summary>
/// The steps the hand-written point readers share (transform points, assessment points; their field names are in a
/// <see cref="FieldNameTable"/>): a number read exactly, and a failure that names the field so the request's problem
/// can point at it.
/// </summary>
internal static class PointFieldReading
{
    /// <summary>A JSON number at the reader: plain decimals by the exact fast path (bit for bit the correctly rounded value), anything else by the reader.</summary>
    public static bool TryReadNumber(ref Utf8JsonReader reader, out double value)
    {
        value = 0;
        return reader.TokenType == JsonTokenType.Number
            && ((!reader.HasValueSequence && Ingest.ExactDecimal.TryRead(reader.ValueSpan, out value)) || reader.TryGetDouble(out value));
    }

    /// <summary>A reading failure naming <paramref name="member"/> under <see cref="Transform.TransformPointJsonConverter.MemberKey"/>.</summary>
    public static JsonException Failure(string message, string member)
    {
        var exception = new JsonException(message);
        exception.Data[Transform.TransformPointJsonConverter.MemberKey] = member;
        return exception;
    }
}
