using System.Text.Json;
using Microsoft.AspNetCore.Mvc;
using Microsoft.Extensions.Options;
using QaService.Api.Limits;
using QaService.Api.Observability;
using QaService.Api.OpenApi;
using QaService.Api.Problems;
using QaService.Api.Projects;
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
            .WithMetadata(new MultipartRequestBody(MultipartUploadReader.OptionsPart, typeof(UploadOptions),
                [MultipartUploadReader.MarksPart, MultipartUploadReader.FixesPart],
                "A field file: CSV with a header row, GeoJSON (RFC 7946) Point features, GPX 1.1 or NMEA 0183; the format is recognised from the content."))
            .Produces<AssessmentReport>(StatusCodes.Status201Created)
            .ProducesProblem(StatusCodes.Status400BadRequest)
            .ProducesProblem(StatusCodes.Status413PayloadTooLarge)
            .ProducesProblem(StatusCodes.Status415UnsupportedMediaType);

        group.MapGet("/{id}", GetAsync)
            .WithName("GetAssessment")
            .WithSummary("Read a stored conformance report")
            .AddEndpointFilter<Reports.HtmlNegotiation>()
            .Produces<AssessmentReport>()
            .ProducesProblem(StatusCodes.Status404NotFound);

        return group;
    }

    internal static async Task<IResult> CreateAsync(
        HttpRequest request,
        JsonBodyReader<AssessmentRequest> reader,
        MultipartUploadReader uploads,
        IReportStore store,
        IProjectStore projects,
        ITenantContext tenant,
        IOptions<LimitsOptions> limits,
        QaMetrics metrics,
        TimeProvider clock,
        ILogger<AssessmentRequest> logger,
        CancellationToken cancellationToken)
    {
        // Large uploads: the input is held only inside AssessAsync, so it is garbage once the report exists, and the
        // report is dropped once serialised: the points, the residuals and the JSON are never all held at once.
        var (report, projectId, problem) = await AssessAsync(request, reader, uploads, new ProjectScope(projects, tenant.TenantId), limits.Value, clock, cancellationToken);
        if (problem is not null)
            return problem;
        await LargeRequestMemory.ReleaseAsync(report!.Counts.Fixes);
        var header = new ReportHeader(tenant.TenantId, report.Id, report.CreatedAt, report.Title, VerdictText(report), projectId);
        var (paired, points) = (report.Counts.Paired, report.Counts.Marks + report.Counts.Fixes);
        var json = await ReportSerialisation.SerialiseAsync(report, store, cancellationToken);
        report = null;
        try
        {
            await store.SaveAsync(header, json, cancellationToken);
            json.Position = 0;
        }
        catch
        {
            await json.DisposeAsync();
            throw;
        }
        AssessmentLog.Created(logger, header.Id, header.Verdict, paired);
        metrics.AssessmentStored(header.Verdict, points);
        return new JsonStreamResult(json, StatusCodes.Status201Created, $"/v1/assessments/{header.Id}");
    }

    /// <summary>Validates the request and runs the assessment; the validated input is garbage once this returns.</summary>
    private static async Task<(AssessmentReport? Report, string? ProjectId, IResult? Problem)> AssessAsync(HttpRequest request, JsonBodyReader<AssessmentRequest> reader,
        MultipartUploadReader uploads, ProjectScope projects, LimitsOptions limits, TimeProvider clock, CancellationToken cancellationToken)
    {
        var (outcome, ingest, projectId, problem) = MultipartUploadReader.IsMultipart(request)
            ? await ValidateUploadAsync(request, uploads, projects, limits, cancellationToken)
            : await ValidateJsonAsync(request, reader, projects, limits, cancellationToken);
        if (problem is not null)
            return (null, null, problem);
        if (outcome!.Assessment is null)
            return (null, null, InputProblems.Invalid(outcome.Errors));
        await LargeRequestMemory.ReleaseAsync(outcome.Assessment.Fixes.Count);
        return (AssessmentRunner.Run(outcome.Assessment, ReportIds.New(), clock.GetUtcNow()) with { Ingest = ingest }, projectId, null);
    }

    /// <summary>Reads and validates a multipart upload; the parsed files are garbage once this returns.</summary>
    private static async Task<(ValidationOutcome? Outcome, IngestSummary? Ingest, string? ProjectId, IResult? Problem)> ValidateUploadAsync(
        HttpRequest request, MultipartUploadReader uploads, ProjectScope projects, LimitsOptions limits, CancellationToken cancellationToken)
    {
        var (options, marks, fixes, uploadProblem) = await uploads.ReadAsync(request, cancellationToken);
        if (uploadProblem is not null)
            return (null, null, null, uploadProblem);
        if (PointCap.Check(limits, ("/marks", marks!.Points.Count), ("/fixes", fixes!.Points.Count)) is { } tooManyRead)
            return (null, null, null, tooManyRead);
        var (spec, projectId, projectError) = await projects.ResolveAsync(options!.ProjectId, options.Spec, "/options/projectId", cancellationToken);
        if (projectError is not null)
            return (null, null, null, InputProblems.Invalid([projectError]));
        var (outcome, ingest) = UploadValidation.Validate(options with { Spec = spec }, marks, fixes);
        return (outcome, ingest, projectId, null);
    }

    /// <summary>Reads and validates a JSON request.</summary>
    private static async Task<(ValidationOutcome? Outcome, IngestSummary? Ingest, string? ProjectId, IResult? Problem)> ValidateJsonAsync(
        HttpRequest request, JsonBodyReader<AssessmentRequest> reader, ProjectScope projects, LimitsOptions limits, CancellationToken cancellationToken)
    {
        var (body, problem) = await reader.ReadAsync(request, cancellationToken);
        if (problem is not null)
            return (null, null, null, problem);
        var pointCount = (Marks: body!.Marks?.Points?.Count ?? 0, Fixes: body.Fixes?.Points?.Count ?? 0);
        if (PointCap.Check(limits, ("/marks/points", pointCount.Marks), ("/fixes/points", pointCount.Fixes)) is { } tooMany)
            return (null, null, null, tooMany);
        var (spec, projectId, projectError) = await projects.ResolveAsync(body.ProjectId, body.Spec, "/projectId", cancellationToken);
        if (projectError is not null)
            return (null, null, null, InputProblems.Invalid([projectError]));
        return (RequestValidator.Validate(body with { Spec = spec }), null, projectId, null);
    }

    /// <summary>
    /// Validates, runs and stores an upload already read into parts (the guided upload's run): the same rules as a
    /// multipart POST. Returns the new report's id, or the input errors (pointers as the multipart API gives them), or
    /// a problem other than bad input (the point cap).
    /// </summary>
    internal static async Task<(string? Id, IReadOnlyList<InputError> Errors, IResult? Problem)> CreateFromPartsAsync(
        UploadOptions options, PartReading marks, PartReading fixes, IReportStore store, string tenant, LimitsOptions limits,
        TimeProvider clock, QaMetrics metrics, ILogger logger, CancellationToken cancellationToken)
    {
        if (PointCap.Check(limits, ("/marks", marks.Points.Count), ("/fixes", fixes.Points.Count)) is { } tooMany)
            return (null, [], tooMany);
        var (outcome, ingest) = UploadValidation.Validate(options, marks, fixes);
        if (outcome.Assessment is null)
            return (null, outcome.Errors, null);
        var report = AssessmentRunner.Run(outcome.Assessment, ReportIds.New(), clock.GetUtcNow()) with { Ingest = ingest };
        await using (var json = await ReportSerialisation.SerialiseAsync(report, store, cancellationToken))
            await store.SaveAsync(new ReportHeader(tenant, report.Id, report.CreatedAt, report.Title, VerdictText(report)), json, cancellationToken);
        var verdict = VerdictText(report);
        AssessmentLog.Created(logger, report.Id, verdict, report.Counts.Paired);
        metrics.AssessmentStored(verdict, report.Counts.Marks + report.Counts.Fixes);
        return (report.Id, [], null);
    }

    internal static async Task<IResult> GetAsync(string id, IReportStore store, ITenantContext tenant, CancellationToken cancellationToken)
    {
        var json = ReportIds.IsPlausible(id) ? await store.OpenJsonAsync(tenant.TenantId, id, cancellationToken) : null;
        return json is null
            ? InputProblems.Status(StatusCodes.Status404NotFound, "Assessment not found", $"there is no assessment with id \"{Shorten(id)}\"")
            : new JsonStreamResult(json, StatusCodes.Status200OK, null);
    }

    /// <summary>Serialises the report and stores it unless the tenant already has that id; true when stored.</summary>
    internal static async Task<bool> StoreIfAbsentAsync(IReportStore store, string tenant, AssessmentReport report, CancellationToken cancellationToken)
    {
        await using var json = await ReportSerialisation.SerialiseAsync(report, store, cancellationToken);
        return await store.SaveIfAbsentAsync(new ReportHeader(tenant, report.Id, report.CreatedAt, report.Title, VerdictText(report)), json, cancellationToken);
    }

    /// <summary>The verdict as the report's JSON spells it (<c>pass</c>, <c>fail</c>, <c>inconclusive</c>).</summary>
    private static string VerdictText(AssessmentReport report) => JsonSerializer.Serialize(report.Verdict, ReportJson.Write).Trim('"');

    private static string Shorten(string id) => id.Length <= 64 ? id : id[..64] + "…";
}

/// <summary>Copies already-serialised UTF-8 JSON to the response with a status and optional Location, then disposes it.</summary>
internal sealed class JsonStreamResult(Stream json, int statusCode, string? location) : IResult
{
    private const int CopyBufferBytes = 81_920;

    public int StatusCode => statusCode;

    public string? Location => location;

    public async Task ExecuteAsync(HttpContext httpContext)
    {
        await using (json)
        {
            httpContext.Response.StatusCode = statusCode;
            if (location is not null)
                httpContext.Response.Headers.Location = location;
            httpContext.Response.ContentType = "application/json; charset=utf-8";
            httpContext.Response.ContentLength = json.Length - json.Position;
            await json.CopyToAsync(httpContext.Response.Body, CopyBufferBytes, httpContext.RequestAborted);
        }
    }
}

internal static partial class AssessmentLog
{
    [LoggerMessage(EventId = 1001, EventName = "AssessmentCreated", Level = LogLevel.Information,
        Message = "Assessment {AssessmentId} created: verdict {Verdict}, {PairedCount} paired fixes")]
    public static partial void Created(ILogger logger, string assessmentId, string verdict, int pairedCount);
}
