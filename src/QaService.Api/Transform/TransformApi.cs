using System.Text.Json;
using Microsoft.Extensions.Options;
using QaService.Api.Assessments;
using QaService.Api.Limits;
using QaService.Api.Observability;
using QaService.Api.OpenApi;
using QaService.Api.Problems;
using QaService.Core.Geodesy.Catalog;
using QaService.Core.Reporting;
using QaService.Core.Transform;

namespace QaService.Api.Transform;

/// <summary>POST /v1/transform (api-v1): read, hand over to Core, write. The maths is in Core.Transform and Core.Geodesy.</summary>
internal static class TransformApi
{
    /// <summary>Decimal places written for degrees: 1e-10° ≈ 11 µm.</summary>
    private const int DegreeDecimals = 10;

    /// <summary>Decimal places written for metres and feet: 1e-6, a micrometre.</summary>
    private const int LinearDecimals = 6;

    public static RouteGroupBuilder MapTransform(this IEndpointRouteBuilder routes)
    {
        var group = routes.MapGroup("/v1/transform").WithTags("Transform");
        group.MapPost("/", TransformAsync)
            .WithName("Transform")
            .WithSummary("Transform a batch of points between two CRSs, frames and epochs")
            .WithDescription("Plans the operation (inverse projection, geocentric, Helmert / time-dependent Helmert at the epoch, geoid heights, projection) and returns the points in request order, fields by the target CRS kind, with the steps and their accuracy in \"operation\".")
            .WithMetadata(new JsonRequestBody(typeof(TransformRequest)))
            .Produces<TransformResponseSchema>()
            .ProducesProblem(StatusCodes.Status400BadRequest)
            .ProducesProblem(StatusCodes.Status413PayloadTooLarge)
            .ProducesProblem(StatusCodes.Status415UnsupportedMediaType);
        return group;
    }

    internal static async Task<IResult> TransformAsync(
        HttpRequest request, JsonBodyReader<TransformRequest> reader, IOptions<LimitsOptions> limits, QaMetrics metrics, CancellationToken cancellationToken)
    {
        var (body, problem) = await reader.ReadAsync(request, cancellationToken);
        if (problem is not null)
            return problem;
        var pointCount = body!.Points?.Count ?? 0;
        if (PointCap.Check(limits.Value, ("/points", pointCount)) is { } tooMany)
            return tooMany;
        var outcome = TransformRunner.Run(body);
        if (outcome.Result is null)
            return InputProblems.Invalid(outcome.Errors);
        metrics.PointsTransformed(pointCount);
        return new TransformJsonResult(outcome.Result);
    }

    /// <summary>
    /// Streams the response with <see cref="Utf8JsonWriter"/>: no object per point, numbers as plain decimals at the
    /// resolution above (the same value Math.Round gave before, written without the shortest-round-trip search).
    /// </summary>
    private sealed class TransformJsonResult(TransformResult result) : IResult
    {
        public async Task ExecuteAsync(HttpContext httpContext)
        {
            httpContext.Response.StatusCode = StatusCodes.Status200OK;
            httpContext.Response.ContentType = "application/json; charset=utf-8";
            await using var writer = new Utf8JsonWriter(httpContext.Response.BodyWriter);
            writer.WriteStartObject();
            writer.WriteString("from", result.Source.Identifier);
            writer.WriteString("to", result.Target.Identifier);
            writer.WriteStartArray("points");
            var p = result.Points;
            var (first, second, third) = result.Target.Kind switch
            {
                CrsKind.Geographic => ("lat", "lon", "h"),
                CrsKind.Projected => ("e", "n", "h"),
                _ => ("x", "y", "z"),
            };
            var planar = result.Target.Kind == CrsKind.Geographic ? DegreeDecimals : LinearDecimals;
            var geocentric = result.Target.Kind == CrsKind.Geocentric;
            var names = (First: JsonEncodedText.Encode(first), Second: JsonEncodedText.Encode(second), Third: JsonEncodedText.Encode(third));
            for (var i = 0; i < p.Count; i++)
            {
                writer.WriteStartObject();
                WriteFixed(writer, names.First, p.First[i], planar);
                WriteFixed(writer, names.Second, p.Second[i], planar);
                if (geocentric || result.HasHeight[i])
                    WriteFixed(writer, names.Third, p.Third[i], LinearDecimals);
                writer.WriteEndObject();
                if (writer.BytesPending > 32_768)
                    await writer.FlushAsync(httpContext.RequestAborted);
            }
            writer.WriteEndArray();
            writer.WriteString("operation", result.Operation);
            writer.WriteNumber("accuracy", result.AccuracyMetres);
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
            await writer.FlushAsync(httpContext.RequestAborted);
        }

        private static void WriteFixed(Utf8JsonWriter writer, JsonEncodedText name, double value, int decimals)
        {
            Span<byte> text = stackalloc byte[FixedDecimalUtf8.MaximumBytes];
            if (FixedDecimalUtf8.TryFormat(value, decimals, text, out var length))
            {
                writer.WritePropertyName(name);
                writer.WriteRawValue(text[..length], skipInputValidation: true);
            }
            else
                writer.WriteNumber(name, Math.Round(value, decimals));
        }
    }
}

/// <summary>Response shape for the OpenAPI document (the handler streams the same fields).</summary>
/// <param name="Points">Target coordinates in request order: lat/lon/h, e/n/h or x/y/z by the target CRS kind.</param>
/// <param name="Operation">The steps, each with its parameters and accuracy, the total accuracy and the epoch used.</param>
/// <param name="Accuracy">Sum of the steps' stated accuracies, metres.</param>
/// <param name="Warnings">Points (request indexes) outside an area of use of the source CRS, a datum operation or the target CRS; empty when none.</param>
internal sealed record TransformResponseSchema(string From, string To, IReadOnlyList<TransformPoint> Points, string Operation, double Accuracy,
    IReadOnlyList<TransformWarningSchema> Warnings);

/// <summary>One warning of a transformation.</summary>
/// <param name="Code">"outside-area-of-use".</param>
/// <param name="Message">Which area, its bounds, how many points.</param>
/// <param name="Points">Indexes of the points concerned, in request order.</param>
internal sealed record TransformWarningSchema(string Code, string Message, IReadOnlyList<int> Points);
