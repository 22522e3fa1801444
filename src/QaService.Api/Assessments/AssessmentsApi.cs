using System.Text.Json;
using Microsoft.AspNetCore.Mvc;
using QaService.Api.OpenApi;
using QaService.Api.Problems;
using QaService.Api.Storage;
using QaService.Core.Assessment;
using QaService.Core.Reporting;

namespace QaService.Api.Assessments;

/// <summary>POST and GET of assessments (api-v1). Handlers validate and hand over; the maths is in Core.</summary>
internal static class AssessmentsApi
{
    /// <summary>The tenant used while <c>Auth:Mode</c> is <c>none</c>.</summary>
    public const string LocalTenant = "local";

    public static RouteGroupBuilder MapAssessments(this IEndpointRouteBuilder routes)
    {
        var group = routes.MapGroup("/v1/assessments").WithTags("Assessments");

        group.MapPost("/", CreateAsync)
            .WithName("CreateAssessment")
            .WithSummary("Test fixes against marks and store the conformance report")
            .WithDescription("Pairs each fix with a mark, computes residuals in east-north-up at the mark, the NSSDA/RMSE/CEP figures and checks, and returns the stored report.")
            .WithMetadata(new JsonRequestBody(typeof(AssessmentRequest)))
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
        IReportStore store,
        TimeProvider clock,
        ILogger<AssessmentRequest> logger,
        CancellationToken cancellationToken)
    {
        var (body, problem) = await reader.ReadAsync(request, cancellationToken);
        if (problem is not null)
            return problem;

        var outcome = RequestValidator.Validate(body);
        if (outcome.Assessment is null)
            return InputProblems.Invalid(outcome.Errors);

        var report = AssessmentRunner.Run(outcome.Assessment, ReportIds.New(), clock.GetUtcNow());
        var json = await StoreAsync(store, LocalTenant, report, cancellationToken);
        AssessmentLog.Created(logger, report.Id, report.Verdict.ToString(), report.Counts.Paired);
        return new JsonTextResult(json, StatusCodes.Status201Created, $"/v1/assessments/{report.Id}");
    }

    internal static async Task<IResult> GetAsync(string id, IReportStore store, CancellationToken cancellationToken)
    {
        var json = ReportIds.IsPlausible(id) ? await store.FindJsonAsync(LocalTenant, id, cancellationToken) : null;
        return json is null
            ? InputProblems.Status(StatusCodes.Status404NotFound, "Assessment not found", $"there is no assessment with id \"{Shorten(id)}\"")
            : new JsonTextResult(json, StatusCodes.Status200OK, null);
    }

    /// <summary>Serialises once and stores those bytes, so POST and every later GET return the same JSON.</summary>
    internal static async Task<string> StoreAsync(IReportStore store, string tenant, AssessmentReport report, CancellationToken cancellationToken)
    {
        var json = JsonSerializer.Serialize(report, ReportJson.Write);
        var verdict = JsonSerializer.Serialize(report.Verdict, ReportJson.Write).Trim('"');
        await store.SaveAsync(new StoredReport(tenant, report.Id, report.CreatedAt, report.Title, verdict, json), cancellationToken);
        return json;
    }

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
