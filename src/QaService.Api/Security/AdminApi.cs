using QaService.Api.Assessments;
using QaService.Api.OpenApi;
using QaService.Api.Problems;
using QaService.Api.Storage;
using QaService.Core.Assessment;

namespace QaService.Api.Security;

/// <summary><c>POST /v1/admin/tenants</c> (api-v1 "Tenants and keys"): creates a tenant and shows its key once.</summary>
internal static class AdminApi
{
    /// <summary>Longest tenant name: a label, not a description.</summary>
    public const int MaximumNameLength = 64;

    public static RouteGroupBuilder MapAdmin(this IEndpointRouteBuilder routes)
    {
        var group = routes.MapGroup("/v1/admin").WithTags("Admin");
        group.MapPost("/tenants", CreateTenantAsync)
            .WithName("CreateTenant")
            .WithSummary("Create a tenant and its API key (admin token required; the key is shown only in this response)")
            .WithMetadata(new JsonRequestBody(typeof(TenantRequest)))
            .Produces<TenantCreated>(StatusCodes.Status201Created)
            .ProducesProblem(StatusCodes.Status400BadRequest)
            .ProducesProblem(StatusCodes.Status409Conflict)
            .ProducesProblem(StatusCodes.Status413PayloadTooLarge)
            .ProducesProblem(StatusCodes.Status415UnsupportedMediaType);
        return group;
    }

    internal static async Task<IResult> CreateTenantAsync(
        HttpRequest request, JsonBodyReader<TenantRequest> reader, ITenantStore tenants, TimeProvider clock, ILogger<TenantRequest> logger, CancellationToken cancellationToken)
    {
        var (body, problem) = await reader.ReadAsync(request, cancellationToken);
        if (problem is not null)
            return problem;
        var name = body!.Name?.Trim();
        if (string.IsNullOrEmpty(name) || name.Length > MaximumNameLength || name.Any(char.IsControl))
            return InputProblems.Invalid([new InputError("/name", $"name is required: 1 to {MaximumNameLength} printable characters")]);

        var key = ApiKeys.NewKey();
        var tenant = new StoredTenant("t_" + ReportIds.New(), name, ApiKeys.Hash(key), clock.GetUtcNow());
        if (!await tenants.CreateAsync(tenant, cancellationToken))
            return InputProblems.Status(StatusCodes.Status409Conflict, "Tenant exists", $"a tenant named \"{name}\" exists already; choose another name");
        AdminLog.TenantCreated(logger, tenant.Id, name);
        return TypedResults.Created((string?)null, new TenantCreated(tenant.Id, name, key));
    }
}

/// <summary>Body of <c>POST /v1/admin/tenants</c>.</summary>
/// <param name="Name">A label for the tenant, unique, e.g. <c>north-depot</c>.</param>
public sealed record TenantRequest(string? Name);

/// <summary>The new tenant. <paramref name="ApiKey"/> is shown only here; the service keeps its SHA-256.</summary>
public sealed record TenantCreated(string Tenant, string Name, string ApiKey);

internal static partial class AdminLog
{
    [LoggerMessage(EventId = 1201, EventName = "TenantCreated", Level = LogLevel.Information,
        Message = "Tenant {TenantId} created with name {TenantName}")]
    public static partial void TenantCreated(ILogger logger, string tenantId, string tenantName);
}
