using System.Text.Json;

namespace QaService.Core.Reporting;

/// <summary>
/// The steps the hand-written point readers share (transform points, assessment points): which field a property names,
/// a number read exactly, and a failure that names the field so the request's problem can point at it.
/// </summary>
internal static class PointFieldReading
{
    /// <summary>The UTF-8 bytes of each name, for <see cref="FieldOf"/>.</summary>
    public static byte[][] Utf8(string[] names) => [.. names.Select(System.Text.Encoding.UTF8.GetBytes)];

    /// <summary>
    /// The index in <paramref name="names"/> of the property at the reader (exact, case-sensitive), or −1. A plain name
    /// is compared as bytes with <paramref name="utf8Names"/>; the reader's comparison with a string transcodes the
    /// string on every call, which was a few percent of a small assessment. An escaped name (<c>"\u006cat"</c>) or one
    /// split across buffers goes through the reader, which unescapes it.
    /// </summary>
    public static int FieldOf(ref Utf8JsonReader reader, string[] names, byte[][] utf8Names)
    {
        if (!reader.ValueIsEscaped && !reader.HasValueSequence)
        {
            var name = reader.ValueSpan;
            for (var i = 0; i < utf8Names.Length; i++)
            {
                if (name.SequenceEqual(utf8Names[i]))
                    return i;
            }
            return -1;
        }

        for (var i = 0; i < names.Length; i++)
        {
            if (reader.ValueTextEquals(names[i]))
                return i;
        }
        return -1;
    }

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
