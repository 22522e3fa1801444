using QaService.Core.SignOff;

namespace QaService.Api.Storage;

/// <summary>Projects (a contract's spec) and the reports that are their deliveries; every call is scoped by tenant.</summary>
public interface IProjectStore
{
    /// <summary>Stores a new project. Never overwrites.</summary>
    Task CreateAsync(StoredProject project, CancellationToken cancellationToken);

    /// <summary>The tenant's project with that id, or null.</summary>
    Task<StoredProject?> FindAsync(string tenant, string id, CancellationToken cancellationToken);

    /// <summary>The tenant's projects, newest first, at most <paramref name="limit"/>.</summary>
    Task<IReadOnlyList<StoredProject>> ListAsync(string tenant, int limit, CancellationToken cancellationToken);

    /// <summary>The project's reports, oldest first, each with its latest decision.</summary>
    Task<IReadOnlyList<DeliveryRow>> ListDeliveriesAsync(string tenant, string projectId, CancellationToken cancellationToken);
}

/// <summary>One project row; <paramref name="SpecJson"/> is the spec exactly as the client sent it.</summary>
public sealed record StoredProject(string Tenant, string Id, string Name, DateTimeOffset CreatedAt, string SpecJson);

/// <summary>A report of a project with its latest decision (null while it awaits one).</summary>
public sealed record DeliveryRow(ReportSummary Report, SignOffDecision? Latest);
