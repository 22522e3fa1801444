namespace QaService.Api.Storage;

/// <summary>
/// Where reports live. Reports are stored as the exact JSON returned on creation, so a later GET
/// returns the same bytes whatever the code version.
/// </summary>
public interface IReportStore
{
    /// <summary>Creates the schema if needed. Called once at start-up.</summary>
    Task InitializeAsync(CancellationToken cancellationToken);

    /// <summary>Stores a new report. Never overwrites: an existing id is an error.</summary>
    Task SaveAsync(StoredReport report, CancellationToken cancellationToken);

    /// <summary>The report's JSON, or null when the tenant has no report with that id.</summary>
    Task<string?> FindJsonAsync(string tenant, string id, CancellationToken cancellationToken);

    /// <summary>
    /// The tenant's newest reports first (id, time, title, verdict; no JSON), at most <paramref name="limit"/>.
    /// The default (an empty list) keeps stores and test doubles that do not list compiling.
    /// </summary>
    Task<IReadOnlyList<ReportSummary>> ListRecentAsync(string tenant, int limit, CancellationToken cancellationToken) =>
        Task.FromResult<IReadOnlyList<ReportSummary>>([]);

    /// <summary>True when the store answers a trivial query.</summary>
    Task<bool> IsReachableAsync(CancellationToken cancellationToken);
}

/// <summary>One report row.</summary>
public sealed record StoredReport(string Tenant, string Id, DateTimeOffset CreatedAt, string? Title, string Verdict, string Json);

/// <summary>One line of a report list.</summary>
public sealed record ReportSummary(string Id, DateTimeOffset CreatedAt, string? Title, string Verdict);
