using System.Globalization;
using Microsoft.Extensions.Options;
using QaService.Api.Assessments;
using QaService.Api.OpenApi;
using QaService.Api.Problems;
using QaService.Api.Security;
using QaService.Api.Storage;
using QaService.Core.Assessment;

namespace QaService.Api.Sharing;

/// <summary>
/// <c>POST /v1/assessments/{id}/share-links</c> and <c>DELETE …/share-links/{linkId}</c>: the report's owner makes
/// and revokes links that open its HTML report, CSV and GeoJSON without credentials (<see cref="SharedReportViews"/>).
/// Another tenant gets 404 for both, as for every report path.
/// </summary>
internal static class ShareLinksApi
{
    /// <summary>Shortest link lifetime, hours (3.6 s): short links exist for tests and demonstrations; nothing is gained by forbidding them.</summary>
    public const double MinimumHours = 0.001;

    /// <summary>Lifetime when the body leaves <c>expiresInHours</c> out: three days.</summary>
    public const double DefaultHours = 72;

    public static RouteGroupBuilder MapShareLinks(this IEndpointRouteBuilder routes)
    {
        var group = routes.MapGroup("/v1/assessments/{id}/share-links").WithTags("Share links");
        group.MapPost("/", CreateAsync)
            .WithName("CreateShareLink")
            .WithSummary("Create a link that opens this report's HTML, CSV and GeoJSON views without credentials until it expires or is revoked")
            .WithMetadata(new JsonRequestBody(typeof(ShareLinkRequest)))
            .Produces<ShareLinkCreated>(StatusCodes.Status201Created)
            .ProducesProblem(StatusCodes.Status400BadRequest)
            .ProducesProblem(StatusCodes.Status401Unauthorized)
            .ProducesProblem(StatusCodes.Status404NotFound)
            .ProducesProblem(StatusCodes.Status413PayloadTooLarge)
            .ProducesProblem(StatusCodes.Status415UnsupportedMediaType);
        group.MapDelete("/{linkId}", DeleteAsync)
            .WithName("RevokeShareLink")
            .WithSummary("Revoke a share link: from now on it answers 404")
            .Produces(StatusCodes.Status204NoContent)
            .ProducesProblem(StatusCodes.Status401Unauthorized)
            .ProducesProblem(StatusCodes.Status404NotFound);
        return group;
    }

    internal static async Task<IResult> CreateAsync(
        string id, HttpRequest request, JsonBodyReader<ShareLinkRequest> reader, ITenantContext tenant, IShareLinkStore links,
        ShareLinkSigning signing, TimeProvider clock, IOptions<AuthOptions> auth, CancellationToken cancellationToken)
    {
        var (body, problem) = await reader.ReadAsync(request, cancellationToken);
        if (problem is not null)
            return problem;
        double maximum = auth.Value.ShareLinkMaxHours;
        double hours = body!.ExpiresInHours ?? Math.Min(DefaultHours, maximum);
        if (!double.IsFinite(hours) || hours < MinimumHours || hours > maximum)
            return InputProblems.Invalid([new InputError("/expiresInHours",
                string.Create(CultureInfo.InvariantCulture, $"expiresInHours must be a number of hours from {MinimumHours} to {maximum} (Auth:ShareLinkMaxHours)"))]);
        if (!ReportIds.IsPlausible(id))
            return NotFound(id);

        var created = await IssueAsync(tenant.TenantId, id, hours, request, links, signing, clock, cancellationToken);
        return created is null ? NotFound(id) : TypedResults.Created(created.Url, created);
    }

    /// <summary>Stores a new link to the tenant's report for <paramref name="hours"/>; null when the tenant has no such report.</summary>
    internal static async Task<ShareLinkCreated?> IssueAsync(string tenant, string id, double hours, HttpRequest request, IShareLinkStore links,
        ShareLinkSigning signing, TimeProvider clock, CancellationToken cancellationToken)
    {
        var token = await signing.NewTokenAsync(cancellationToken);
        var now = clock.GetUtcNow();
        var link = new StoredShareLink("sl_" + ReportIds.New(), ShareLinkSigning.Hash(token), tenant, id, now, now + TimeSpan.FromHours(hours));
        if (!await links.CreateAsync(link, cancellationToken))
            return null;
        return new ShareLinkCreated(link.Id, $"{request.Scheme}://{request.Host}{SharedReportViews.PagePath(token)}", link.ExpiresAt);
    }

    internal static async Task<IResult> DeleteAsync(string id, string linkId, ITenantContext tenant, IShareLinkStore links, CancellationToken cancellationToken) =>
        ReportIds.IsPlausible(id) && linkId.Length <= 64 && await links.DeleteAsync(tenant.TenantId, id, linkId, cancellationToken)
            ? TypedResults.NoContent()
            : InputProblems.Status(StatusCodes.Status404NotFound, "Share link not found", "this assessment has no share link with that id");

    private static IResult NotFound(string id) =>
        InputProblems.Status(StatusCodes.Status404NotFound, "Assessment not found", $"there is no assessment with id \"{(id.Length <= 64 ? id : id[..64] + "…")}\"");
}

/// <summary>Body of <c>POST /v1/assessments/{id}/share-links</c>.</summary>
/// <param name="ExpiresInHours">Lifetime of the link in hours (fractions allowed), 0.001 to Auth:ShareLinkMaxHours; 72 when left out.</param>
public sealed record ShareLinkRequest(double? ExpiresInHours);

/// <summary>A new share link. <paramref name="Url"/> opens the HTML report without credentials; <paramref name="Id"/> revokes it.</summary>
public sealed record ShareLinkCreated(string Id, string Url, DateTimeOffset ExpiresAt);
