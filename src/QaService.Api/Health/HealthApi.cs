using QaService.Api.Problems;
using QaService.Api.Storage;

namespace QaService.Api.Health;

/// <summary>Liveness and readiness probes (api-v1 "Health"); for the platform, so kept out of the OpenAPI document.</summary>
internal static class HealthApi
{
    public static void MapHealth(this IEndpointRouteBuilder routes)
    {
        routes.MapGet("/healthz", () => TypedResults.Ok(new ProbeStatus("serving")))
            .WithName("Liveness").WithSummary("200 while the process serves").WithTags("Health").ExcludeFromDescription();

        routes.MapGet("/readyz", async (IReportStore store, CancellationToken cancellationToken) =>
                await store.IsReachableAsync(cancellationToken)
                    ? TypedResults.Ok(new ProbeStatus("ready"))
                    : InputProblems.Status(StatusCodes.Status503ServiceUnavailable, "Storage unreachable", "the report store did not answer; reports can be neither saved nor read"))
            .WithName("Readiness").WithSummary("200 when storage is reachable, 503 otherwise").WithTags("Health")
            .ExcludeFromDescription();
    }
}

/// <summary>Body of a successful probe.</summary>
/// <param name="Status"><c>serving</c> (liveness) or <c>ready</c> (storage reachable).</param>
internal sealed record ProbeStatus(string Status);
