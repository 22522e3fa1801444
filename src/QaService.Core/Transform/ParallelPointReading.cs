using System.Text.Json;

namespace QaService.Core.Transform;

/// <summary>
/// A large transform body read with its <c>points</c> array cut into pieces parsed side by side. Only a shortcut: every
/// piece is parsed with <see cref="TransformPointJsonConverter.ReadFields"/> (the one definition of a point), the rest of
/// the request by the serializer with the same options, and anything unexpected (a syntax error, a piece boundary that
/// does not fall between two points, a duplicate field) gives up and leaves the body to the serializer's single pass,
/// which then reports the error with its exact pointer and position. The result is the request that pass would give.
/// </summary>
/// <remarks>
/// Pieces start at a <c>},{</c> found near evenly spaced offsets. A point holds only numbers, so that sequence occurs
/// only between two points or inside a field name; each piece is parsed from a known point boundary and only within
/// its own bytes, so a piece that ended inside a name would fail to parse, never be misread.
/// </remarks>
public static class ParallelPointReading
{
    /// <summary>Smallest body worth splitting (~20,000 points): below it the single pass is about as quick.</summary>
    public const int MinimumBodyBytes = 1 << 20;

    /// <summary>Pieces per processor, so a worker slowed by other load does not hold up the rest.</summary>
    private const int PiecesPerProcessor = 2;

    /// <summary>The request, or null when the body is small or anything in it is not the plain case (the caller then deserialises it whole).</summary>
    public static TransformRequest? TryRead(ReadOnlyMemory<byte> bytes, JsonSerializerOptions options)
    {
        var body = bytes.Span;
        if (body.Length < MinimumBodyBytes || Environment.ProcessorCount < 2 || !TryFindPoints(body, options, out var arrayStart))
            return null;
        var starts = PieceStarts(body, arrayStart, Environment.ProcessorCount * PiecesPerProcessor);
        var pieces = new TransformPointColumns[starts.Count];
        var arrayEnd = -1;
        var failed = 0;
        var readerOptions = new JsonReaderOptions { MaxDepth = options.MaxDepth, CommentHandling = JsonCommentHandling.Disallow };
        Parallel.For(0, starts.Count, k =>
        {
            var last = k == starts.Count - 1;
            var end = last ? bytes.Length : starts[k + 1] - 1; // the comma before the next piece
            pieces[k] = new TransformPointColumns();
            if (!TryReadPiece(bytes.Span, starts[k], end, last, readerOptions, pieces[k], out var closing))
                Interlocked.Exchange(ref failed, 1);
            else if (last)
                arrayEnd = closing;
        });
        if (failed != 0 || arrayEnd < 0)
            return null;

        // Everything but the points, by the serializer: the body with the points array emptied.
        var frame = new byte[arrayStart + 1 + (body.Length - arrayEnd)];
        body[..(arrayStart + 1)].CopyTo(frame);
        body[arrayEnd..].CopyTo(frame.AsSpan(arrayStart + 1));
        TransformRequest? request;
        try
        {
            request = JsonSerializer.Deserialize<TransformRequest>(frame, options);
        }
        catch (JsonException)
        {
            return null;
        }
        return request is { Points.Count: 0 } ? request with { Points = TransformPointColumns.Concatenate(pieces) } : null;
    }

    /// <summary>Where the top-level <c>points</c> array opens, reading only the members before it.</summary>
    private static bool TryFindPoints(ReadOnlySpan<byte> body, JsonSerializerOptions options, out int arrayStart)
    {
        arrayStart = -1;
        var reader = new Utf8JsonReader(body, new JsonReaderOptions { MaxDepth = options.MaxDepth, CommentHandling = JsonCommentHandling.Disallow });
        try
        {
            if (!reader.Read() || reader.TokenType != JsonTokenType.StartObject)
                return false;
            while (reader.Read() && reader.TokenType == JsonTokenType.PropertyName)
            {
                var isPoints = reader.ValueTextEquals("points"u8);
                if (!reader.Read())
                    return false;
                if (isPoints)
                {
                    arrayStart = (int)reader.TokenStartIndex;
                    return reader.TokenType == JsonTokenType.StartArray;
                }
                if (!reader.TrySkip())
                    return false;
            }
            return false;
        }
        catch (JsonException)
        {
            return false;
        }
    }

    /// <summary>The first piece starts after the bracket; the others at the brace of a <c>},{</c> past an even share of the body.</summary>
    private static List<int> PieceStarts(ReadOnlySpan<byte> body, int arrayStart, int pieces)
    {
        var starts = new List<int> { arrayStart + 1 };
        var length = body.Length - arrayStart;
        for (var k = 1; k < pieces; k++)
        {
            var target = arrayStart + (int)((long)length * k / pieces);
            if (target <= starts[^1])
                continue;
            var found = body[target..].IndexOf("},{"u8);
            if (found < 0)
                break;
            starts.Add(target + found + 2);
        }
        return starts;
    }

    /// <summary>
    /// Reads the points of one piece, each followed by a comma, up to <paramref name="end"/> (a piece boundary) or, for the
    /// last piece, up to the array's closing bracket (its index in <paramref name="arrayEnd"/>). False on anything else.
    /// </summary>
    private static bool TryReadPiece(ReadOnlySpan<byte> body, int start, int end, bool last, JsonReaderOptions options,
        TransformPointColumns into, out int arrayEnd)
    {
        arrayEnd = -1;
        Span<double> values = stackalloc double[TransformPointJsonConverter.FieldCount];
        Span<bool> present = stackalloc bool[TransformPointJsonConverter.FieldCount];
        var at = SkipWhitespace(body, start);
        try
        {
            while (at < end)
            {
                var reader = new Utf8JsonReader(body[at..end], isFinalBlock: true, new JsonReaderState(options));
                if (!reader.Read())
                    return false;
                if (reader.TokenType == JsonTokenType.Null)
                    into.AddNull();
                else
                {
                    TransformPointJsonConverter.ReadFields(ref reader, values, present);
                    into.Add(values, present);
                }
                at = SkipWhitespace(body, at + (int)reader.BytesConsumed);
                if (!last && at == end)
                    return true;
                if (at >= body.Length)
                    return false;
                if (body[at] == (byte)']')
                {
                    arrayEnd = at;
                    return last;
                }
                if (body[at] != (byte)',')
                    return false;
                at = SkipWhitespace(body, at + 1);
            }
            return false;
        }
        catch (JsonException)
        {
            return false;
        }
    }

    /// <summary>Past JSON whitespace (RFC 8259 §2: space, tab, line feed, carriage return).</summary>
    private static int SkipWhitespace(ReadOnlySpan<byte> body, int at)
    {
        while (at < body.Length && body[at] is (byte)' ' or (byte)'\t' or (byte)'\n' or (byte)'\r')
            at++;
        return at;
    }
}
