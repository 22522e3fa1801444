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
/// same bytes the writer made for it (names and punctuation are ASCII constants). A large result is rendered in blocks
/// side by side and written in order: the same bytes.
/// </summary>
internal sealed class TransformJsonResult(TransformResult result) : IResult
{
    /// <summary>Decimal places written for degrees: 1e-10° ≈ 11 µm.</summary>
    private const int DegreeDecimals = 10;

    /// <summary>Decimal places written for metres and feet: 1e-6, a micrometre.</summary>
    private const int LinearDecimals = 6;

    /// <summary>Most bytes one point takes: three names, punctuation and three numbers at their longest.</summary>
    private const int MaximumPointBytes = 32 + 3 * FixedDecimalUtf8.MaximumBytes;

    /// <summary>Points rendered per block when a large result is rendered side by side (~0.8 MB of JSON).</summary>
    private const int BlockPoints = 16_384;

    public async Task ExecuteAsync(HttpContext httpContext)
    {
        httpContext.Response.StatusCode = StatusCodes.Status200OK;
        httpContext.Response.ContentType = "application/json; charset=utf-8";
        var pipe = httpContext.Response.BodyWriter;
        pipe.Write(Head());
        var format = new PointFormat(result);
        var count = result.Points.Count;
        if (count < 2 * BlockPoints || Environment.ProcessorCount < 2)
        {
            // Straight into the response pipe, flushed as it fills.
            for (var start = 0; start < count; start += FlushEveryPoints)
            {
                format.Render(start, Math.Min(count, start + FlushEveryPoints), pipe);
                await pipe.FlushAsync(httpContext.RequestAborted);
            }
        }
        else
        {
            // Blocks rendered side by side into pooled buffers, then written in order.
            await OrderedBlockRendering.WriteAsync((count + BlockPoints - 1) / BlockPoints,
                (block, buffer) => format.Render(block * BlockPoints, Math.Min(count, (block + 1) * BlockPoints), buffer),
                async bytes =>
                {
                    pipe.Write(bytes.Span);
                    await pipe.FlushAsync(httpContext.RequestAborted);
                },
                BlockPoints * 64);
        }
        pipe.Write(Tail());
        await pipe.FlushAsync(httpContext.RequestAborted);
    }

    /// <summary>Points rendered into the pipe between flushes on the sequential path (~64 kB).</summary>
    private const int FlushEveryPoints = 1_024;

    /// <summary>How the points are spelled: names by the target's kind, decimals by its unit.</summary>
    private sealed class PointFormat(TransformResult result)
    {
        private readonly (byte[] First, byte[] Second, byte[] Third) names = result.Target.Kind switch
        {
            CrsKind.Geographic => ("{\"lat\":"u8.ToArray(), ",\"lon\":"u8.ToArray(), ",\"h\":"u8.ToArray()),
            CrsKind.Projected => ("{\"e\":"u8.ToArray(), ",\"n\":"u8.ToArray(), ",\"h\":"u8.ToArray()),
            _ => ("{\"x\":"u8.ToArray(), ",\"y\":"u8.ToArray(), ",\"z\":"u8.ToArray()),
        };

        private readonly int planar = result.Target.Kind == CrsKind.Geographic ? DegreeDecimals : LinearDecimals;

        private readonly bool geocentric = result.Target.Kind == CrsKind.Geocentric;

        /// <summary>Points <paramref name="start"/> … end − 1, each preceded by a comma except the very first.</summary>
        public void Render(int start, int end, IBufferWriter<byte> destination)
        {
            var p = result.Points;
            for (var i = start; i < end; i++)
            {
                var span = destination.GetSpan(MaximumPointBytes);
                var at = 0;
                if (i > 0)
                    span[at++] = (byte)',';
                Append(names.First, span, ref at);
                AppendNumber(p.First[i], planar, span, ref at);
                Append(names.Second, span, ref at);
                AppendNumber(p.Second[i], planar, span, ref at);
                if (geocentric || result.HasHeight[i])
                {
                    Append(names.Third, span, ref at);
                    AppendNumber(p.Third[i], LinearDecimals, span, ref at);
                }
                span[at++] = (byte)'}';
                destination.Advance(at);
            }
        }
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
