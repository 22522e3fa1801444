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
        var (body, problem) = await reader.ReadWholeAsync(request, LocatePointFailure, cancellationToken,
            bytes => ParallelPointReading.TryRead(bytes, ReportJson.Read));
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

    /// <summary>The point a syntax error broke off at (<c>/3</c> under <c>/points</c>), when the serializer names only the array.</summary>
    private static string? LocatePointFailure(ReadOnlyMemory<byte> body) =>
        TransformPointListJsonConverter.BrokenPointIndex(body.Span) is { } index ? string.Create(System.Globalization.CultureInfo.InvariantCulture, $"/{index}") : null;

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
