using QaService.Api.Assessments;
using QaService.Api.OpenApi;
using QaService.Api.Problems;
using QaService.Api.Security;
using QaService.Api.Storage;
using QaService.Core.SignOff;

namespace QaService.Api.SignOff;

/// <summary>
/// Sign-off of a delivery: <c>POST</c> appends a decision (accepted or rejected) bound to the SHA-256 of the report
/// bytes; <c>GET</c> lists them oldest first. There is no edit or delete: a later decision supersedes an earlier one,
/// and decisions go only with their report.
/// </summary>
internal static class DecisionsApi
{
    public static RouteGroupBuilder MapDecisions(this IEndpointRouteBuilder routes)
    {
        var group = routes.MapGroup("/v1/assessments/{id}/decisions").WithTags("Sign-off");

        group.MapPost("/", RecordAsync)
            .WithName("RecordDecision")
            .WithSummary("Record a decision on a delivery: accepted or rejected, by whom, why; bound to the report's SHA-256")
            .WithMetadata(new JsonRequestBody(typeof(DecisionRequest)))
            .Produces<SignOffDecision>(StatusCodes.Status201Created)
            .ProducesProblem(StatusCodes.Status400BadRequest)
            .ProducesProblem(StatusCodes.Status404NotFound)
            .ProducesProblem(StatusCodes.Status413PayloadTooLarge)
            .ProducesProblem(StatusCodes.Status415UnsupportedMediaType);

        group.MapGet("/", ListAsync)
            .WithName("ListDecisions")
            .WithSummary("The decisions on a delivery, oldest first")
            .Produces<DecisionList>()
            .ProducesProblem(StatusCodes.Status404NotFound);

        DecisionForm.Map(routes);
        return group;
    }

    internal static async Task<IResult> RecordAsync(string id, HttpRequest request, JsonBodyReader<DecisionRequest> reader, DecisionRecording recording,
        ITenantContext tenant, CancellationToken cancellationToken)
    {
        var (body, problem) = await reader.ReadAsync(request, cancellationToken);
        if (problem is not null)
            return problem;
        var outcome = await recording.RecordAsync(tenant.TenantId, id, body, cancellationToken);
        if (outcome.NotFound)
            return NotFound(id);
        return outcome.Recorded is { } decision
            ? TypedResults.Created($"/v1/assessments/{id}/decisions", decision)
            : InputProblems.Invalid(outcome.Errors);
    }

    internal static async Task<IResult> ListAsync(string id, IReportStore reports, IDecisionStore decisions, ITenantContext tenant, CancellationToken cancellationToken)
    {
        // The report decides 404 (not an empty list), so another tenant learns nothing.
        await using var json = ReportIds.IsPlausible(id) ? await reports.OpenJsonAsync(tenant.TenantId, id, cancellationToken) : null;
        if (json is null)
            return NotFound(id);
        return TypedResults.Ok(new DecisionList(id, await decisions.ListAsync(tenant.TenantId, id, cancellationToken)));
    }

    internal static IResult NotFound(string id) =>
        InputProblems.Status(StatusCodes.Status404NotFound, "Assessment not found", $"there is no assessment with id \"{(id.Length <= 64 ? id : id[..64] + "…")}\"");
}

/// <summary>The decisions on one assessment, oldest first (the last one is in force).</summary>
internal sealed record DecisionList(string Assessment, IReadOnlyList<SignOffDecision> Decisions);
