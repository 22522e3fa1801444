using System.Text.Json;
using Microsoft.AspNetCore.Mvc;
using Microsoft.Extensions.Options;
using QaService.Api.Limits;
using QaService.Api.Observability;
using QaService.Api.OpenApi;
using QaService.Api.Problems;
using QaService.Api.Security;
using QaService.Api.Storage;
using QaService.Core.Assessment;
using QaService.Core.Ingest;
using QaService.Core.Reporting;

namespace QaService.Api.Assessments;

/// <summary>POST and GET of assessments (api-v1). Handlers validate and hand over; the maths is in Core.</summary>
internal static class AssessmentsApi
{
    public static RouteGroupBuilder MapAssessments(this IEndpointRouteBuilder routes)
    {
        var group = routes.MapGroup("/v1/assessments").WithTags("Assessments");

        group.MapPost("/", CreateAsync)
            .WithName("CreateAssessment")
            .WithSummary("Test fixes against marks and store the conformance report")
            .WithDescription("Pairs each fix with a mark, computes residuals in east-north-up at the mark, the NSSDA/RMSE/CEP figures and checks, and returns the stored report. " +
                "Takes application/json (the request with points) or multipart/form-data with parts \"options\" (the JSON request without points, plus CSV columns, lengthUnit, decimalSeparator, delimiter, rowErrors), " +
                "\"marks\" and \"fixes\" (files: CSV with a header row, GeoJSON Point features, GPX 1.1, NMEA 0183 GGA/GST/GSA/RMC; recognised from content). " +
                "Errors in a file row point at the part and row: /fixes/line/17/lat (CSV, GPX, NMEA: 1-based line) or /fixes/features/3/lat (GeoJSON: 0-based feature).")
            .WithMetadata(new JsonRequestBody(typeof(AssessmentRequest)))
            .Produces<AssessmentReport>(StatusCodes.Status201Created)
            .ProducesProblem(StatusCodes.Status400BadRequest)
            .ProducesProblem(StatusCodes.Status413PayloadTooLarge)
            .ProducesProblem(StatusCodes.Status415UnsupportedMediaType)
            .ProducesProblem(StatusCodes.Status401Unauthorized)
            .ProducesProblem(StatusCodes.Status429TooManyRequests);

        group.MapGet("/{id}", GetAsync)
            .WithName("GetAssessment")
            .WithSummary("Read a stored conformance report")
            .AddEndpointFilter<Reports.HtmlNegotiation>()
            .Produces<AssessmentReport>()
            .ProducesProblem(StatusCodes.Status404NotFound)
            .ProducesProblem(StatusCodes.Status401Unauthorized);

        return group;
    }

    internal static async Task<IResult> CreateAsync(
        HttpRequest request,
        JsonBodyReader<AssessmentRequest> reader,
        MultipartUploadReader uploads,
        IReportStore store,
        ITenantContext tenant,
        IOptions<LimitsOptions> limits,
        QaMetrics metrics,
        TimeProvider clock,
        ILogger<AssessmentRequest> logger,
        CancellationToken cancellationToken)
    {
        ValidationOutcome outcome;
        IngestSummary? ingest = null;
        if (MultipartUploadReader.IsMultipart(request))
        {
            var (options, marks, fixes, uploadProblem) = await uploads.ReadAsync(request, cancellationToken);
            if (uploadProblem is not null)
                return uploadProblem;
            if (PointCap.Check(limits.Value, ("/marks", marks!.Points.Count), ("/fixes", fixes!.Points.Count)) is { } tooManyRead)
                return tooManyRead;
            (outcome, ingest) = UploadValidation.Validate(options!, marks, fixes);
        }
        else
        {
            var (body, problem) = await reader.ReadAsync(request, cancellationToken);
            if (problem is not null)
                return problem;
            var pointCount = (Marks: body!.Marks?.Points?.Count ?? 0, Fixes: body.Fixes?.Points?.Count ?? 0);
            if (PointCap.Check(limits.Value, ("/marks/points", pointCount.Marks), ("/fixes/points", pointCount.Fixes)) is { } tooMany)
                return tooMany;
            outcome = RequestValidator.Validate(body);
        }
        if (outcome.Assessment is null)
            return InputProblems.Invalid(outcome.Errors);

        var report = AssessmentRunner.Run(outcome.Assessment, ReportIds.New(), clock.GetUtcNow()) with { Ingest = ingest };
        var json = await StoreAsync(store, tenant.TenantId, report, cancellationToken);
        AssessmentLog.Created(logger, report.Id, report.Verdict.ToString(), report.Counts.Paired);
        metrics.AssessmentStored(VerdictText(report), report.Counts.Marks + report.Counts.Fixes);
        return new JsonTextResult(json, StatusCodes.Status201Created, $"/v1/assessments/{report.Id}");
    }

    internal static async Task<IResult> GetAsync(string id, IReportStore store, ITenantContext tenant, CancellationToken cancellationToken)
    {
        var json = ReportIds.IsPlausible(id) ? await store.FindJsonAsync(tenant.TenantId, id, cancellationToken) : null;
        return json is null
            ? InputProblems.Status(StatusCodes.Status404NotFound, "Assessment not found", $"there is no assessment with id \"{Shorten(id)}\"")
            : new JsonTextResult(json, StatusCodes.Status200OK, null);
    }

    /// <summary>Serialises once and stores those bytes, so POST and every later GET return the same JSON.</summary>
    internal static async Task<string> StoreAsync(IReportStore store, string tenant, AssessmentReport report, CancellationToken cancellationToken)
    {
        var json = JsonSerializer.Serialize(report, ReportJson.Write);
        await store.SaveAsync(new StoredReport(tenant, report.Id, report.CreatedAt, report.Title, VerdictText(report), json), cancellationToken);
        return json;
    }

    /// <summary>The verdict as the report's JSON spells it (<c>pass</c>, <c>fail</c>, <c>inconclusive</c>).</summary>
    private static string VerdictText(AssessmentReport report) => JsonSerializer.Serialize(report.Verdict, ReportJson.Write).Trim('"');

    private static string Shorten(string id) => id.Length <= 64 ? id : id[..64] + "…";
}

/// <summary>Writes already-serialised JSON with a status and optional Location.</summary>
internal sealed class JsonTextResult(string json, int statusCode, string? location) : IResult
{
    public int StatusCode => statusCode;

    public string? Location => location;

    public Task ExecuteAsync(HttpContext httpContext)
    {
        httpContext.Response.StatusCode = statusCode;
        if (location is not null)
            httpContext.Response.Headers.Location = location;
        httpContext.Response.ContentType = "application/json; charset=utf-8";
        return httpContext.Response.WriteAsync(json);
    }
}

internal static partial class AssessmentLog
{
    [LoggerMessage(EventId = 1001, EventName = "AssessmentCreated", Level = LogLevel.Information,
        Message = "Assessment {AssessmentId} created: verdict {Verdict}, {PairedCount} paired fixes")]
    public static partial void Created(ILogger logger, string assessmentId, string verdict, int pairedCount);
}
