using QaService.Api.Problems;
using QaService.Api.Security;
using QaService.Api.Storage;

namespace QaService.Api.Assessments;

/// <summary>
/// The tenant's list of reports (newest first, keyset paging, filters) and deleting one. Tenant-scoped like every
/// report path: another tenant's report is not listed and deleting it is 404.
/// </summary>
internal static class ListingApi
{
    public static void MapListing(this IEndpointRouteBuilder routes)
    {
        var group = routes.MapGroup("/v1/assessments").WithTags("Assessments");

        group.MapGet("/", ListAsync)
            .WithName("ListAssessments")
            .WithSummary("The tenant's stored reports, newest first, one page at a time")
            .WithDescription("Items carry id, title, createdAt and verdict. Filters: verdict (pass, fail, inconclusive), q (case-insensitive text in the title, " +
                "taken literally), from (inclusive) and to (exclusive), RFC 3339 date-times bounding createdAt. limit 1..100 (default 20). " +
                "next is an opaque cursor for the following page (send it as cursor with the same filters), null on the last page; " +
                "reports added or deleted meanwhile neither repeat nor hide others.")
            .Produces<AssessmentList>()
            .ProducesProblem(StatusCodes.Status400BadRequest)
            .ProducesProblem(StatusCodes.Status401Unauthorized);

        group.MapDelete("/{id}", DeleteAsync)
            .WithName("DeleteAssessment")
            .WithSummary("Delete a stored report (its JSON, page and exports); a later GET is 404")
            .Produces(StatusCodes.Status204NoContent)
            .ProducesProblem(StatusCodes.Status404NotFound)
            .ProducesProblem(StatusCodes.Status401Unauthorized);
    }

    internal static async Task<IResult> ListAsync(string? limit, string? cursor, string? verdict, string? q, string? from, string? to,
        IReportStore store, ITenantContext tenant, CancellationToken cancellationToken)
    {
        var values = new Dictionary<string, string?> { ["limit"] = limit, ["cursor"] = cursor, ["verdict"] = verdict, ["q"] = q, ["from"] = from, ["to"] = to };
        var (query, errors) = ListingParameters.Read(tenant.TenantId, name => values[name]);
        if (query is null)
            return InputProblems.Invalid(errors);
        var page = await store.ListAsync(query, cancellationToken);
        return TypedResults.Ok(new AssessmentList(
            page.Items.Select(r => new AssessmentListItem(r.Id, r.Title, r.CreatedAt, r.Verdict)).ToList(),
            page.Next?.Encode()));
    }

    internal static async Task<IResult> DeleteAsync(string id, IReportStore store, ITenantContext tenant, CancellationToken cancellationToken) =>
        ReportIds.IsPlausible(id) && await store.DeleteAsync(tenant.TenantId, id, cancellationToken)
            ? TypedResults.NoContent()
            : InputProblems.Status(StatusCodes.Status404NotFound, "Assessment not found", $"there is no assessment with id \"{(id.Length <= 64 ? id : id[..64] + "…")}\"");
}

/// <summary>One page of the tenant's reports.</summary>
/// <param name="Items">Newest first.</param>
/// <param name="Next">Cursor of the following page, or null on the last page.</param>
internal sealed record AssessmentList(IReadOnlyList<AssessmentListItem> Items, string? Next);

/// <summary>One report in a list.</summary>
/// <param name="CreatedAt">When the report was made (UTC).</param>
/// <param name="Verdict"><c>pass</c>, <c>fail</c> or <c>inconclusive</c>.</param>
internal sealed record AssessmentListItem(string Id, string? Title, DateTimeOffset CreatedAt, string Verdict);
