using System.Buffers;
using System.Text.Json;
using QaService.Core.Geodesy.Catalog;
using QaService.Core.Reporting;
using QaService.Core.Transform;

namespace QaService.Api.Transform;

/// <summary>
/// Streams a transform's response: no object per point, numbers as plain decimals at a fixed resolution (the value
/// Math.Round gives, written without the shortest-round-trip search). The small head and tail go through
/// <see cref="Utf8JsonWriter"/>; each point is rendered straight from the result's columns into the response pipe, the
/// same bytes the writer made for it (names and punctuation are ASCII constants).
/// </summary>
internal sealed class TransformJsonResult(TransformResult result) : IResult
{
    /// <summary>Decimal places written for degrees: 1e-10° ≈ 11 µm.</summary>
    private const int DegreeDecimals = 10;

    /// <summary>Decimal places written for metres and feet: 1e-6, a micrometre.</summary>
    private const int LinearDecimals = 6;

    /// <summary>Most bytes one point takes: three names, punctuation and three numbers at their longest.</summary>
    private const int MaximumPointBytes = 32 + 3 * FixedDecimalUtf8.MaximumBytes;

    /// <summary>Bytes rendered before the pipe is flushed to the client.</summary>
    private const int FlushEveryBytes = 65_536;

    public async Task ExecuteAsync(HttpContext httpContext)
    {
        httpContext.Response.StatusCode = StatusCodes.Status200OK;
        httpContext.Response.ContentType = "application/json; charset=utf-8";
        var pipe = httpContext.Response.BodyWriter;
        pipe.Write(Head());
        var names = result.Target.Kind switch
        {
            CrsKind.Geographic => ("{\"lat\":"u8.ToArray(), ",\"lon\":"u8.ToArray(), ",\"h\":"u8.ToArray()),
            CrsKind.Projected => ("{\"e\":"u8.ToArray(), ",\"n\":"u8.ToArray(), ",\"h\":"u8.ToArray()),
            _ => ("{\"x\":"u8.ToArray(), ",\"y\":"u8.ToArray(), ",\"z\":"u8.ToArray()),
        };
        var planar = result.Target.Kind == CrsKind.Geographic ? DegreeDecimals : LinearDecimals;
        var geocentric = result.Target.Kind == CrsKind.Geocentric;
        var p = result.Points;
        var sinceFlush = 0;
        for (var i = 0; i < p.Count; i++)
        {
            var span = pipe.GetSpan(MaximumPointBytes);
            var at = 0;
            if (i > 0)
                span[at++] = (byte)',';
            Append(names.Item1, span, ref at);
            AppendNumber(p.First[i], planar, span, ref at);
            Append(names.Item2, span, ref at);
            AppendNumber(p.Second[i], planar, span, ref at);
            if (geocentric || result.HasHeight[i])
            {
                Append(names.Item3, span, ref at);
                AppendNumber(p.Third[i], LinearDecimals, span, ref at);
            }
            span[at++] = (byte)'}';
            pipe.Advance(at);
            if ((sinceFlush += at) >= FlushEveryBytes)
            {
                sinceFlush = 0;
                await pipe.FlushAsync(httpContext.RequestAborted);
            }
        }
        pipe.Write(Tail());
        await pipe.FlushAsync(httpContext.RequestAborted);
    }

    /// <summary><c>{"from":…,"to":…,"points":[</c></summary>
    private byte[] Head()
    {
        var buffer = new ArrayBufferWriter<byte>();
        using (var writer = new Utf8JsonWriter(buffer))
        {
            writer.WriteStartObject();
            writer.WriteString("from", result.Source.Identifier);
            writer.WriteString("to", result.Target.Identifier);
            writer.WriteStartArray("points");
            writer.Flush();
        }
        return buffer.WrittenSpan.ToArray();
    }

    /// <summary><c>],"operation":…,"accuracy":…,"warnings":[…]}</c>: written as an object of its own, its opening brace dropped.</summary>
    private byte[] Tail()
    {
        var buffer = new ArrayBufferWriter<byte>();
        using (var writer = new Utf8JsonWriter(buffer))
        {
            writer.WriteStartObject();
            writer.WriteString("operation", result.Operation);
            if (result.AccuracyMetres is { } accuracy)
                writer.WriteNumber("accuracy", accuracy);
            else
                writer.WriteNull("accuracy");
            writer.WriteStartArray("warnings");
            foreach (var warning in result.Warnings)
            {
                writer.WriteStartObject();
                writer.WriteString("code", warning.Code);
                writer.WriteString("message", warning.Message);
                writer.WriteStartArray("points");
                foreach (var index in warning.PointIndexes)
                    writer.WriteNumberValue(index);
                writer.WriteEndArray();
                writer.WriteEndObject();
            }
            writer.WriteEndArray();
            writer.WriteEndObject();
        }
        return [.. "],"u8, .. buffer.WrittenSpan[1..]];
    }

    private static void Append(ReadOnlySpan<byte> bytes, Span<byte> destination, ref int at) => Utf8Appender.Append(bytes, destination, ref at);

    /// <summary>The fixed-resolution decimal; out of its range, the writer's own number for the rounded value, as before.</summary>
    private static void AppendNumber(double value, int decimals, Span<byte> destination, ref int at) =>
        Utf8Appender.AppendNumber(value, decimals, Math.Round(value, decimals), destination, ref at);
}
