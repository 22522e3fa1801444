using System.Text;

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

    /// <summary>
    /// Stores a new report whose UTF-8 JSON is read from <paramref name="json"/> (from its position to its end),
    /// so a large report never has to sit in memory as one string. Never overwrites. Stores that cannot stream
    /// fall back to <see cref="SaveAsync(StoredReport, CancellationToken)"/>.
    /// </summary>
    async Task SaveAsync(ReportHeader header, Stream json, CancellationToken cancellationToken)
    {
        using var reader = new StreamReader(json, Encoding.UTF8, detectEncodingFromByteOrderMarks: false, leaveOpen: true);
        var text = await reader.ReadToEndAsync(cancellationToken);
        await SaveAsync(new StoredReport(header.Tenant, header.Id, header.CreatedAt, header.Title, header.Verdict, text, header.ProjectId), cancellationToken);
    }

    /// <summary>
    /// An empty, readable and writable stream to serialise a large report into (its size is not known up front) before
    /// <see cref="SaveAsync(ReportHeader, Stream, CancellationToken)"/>; the caller disposes it. A store may keep those very
    /// bytes without a copy (SQLite renames the file into its report folder). Default: a self-deleting temporary file.
    /// </summary>
    Stream CreateJsonSpool() => TemporaryJsonSpool.Create();

    /// <summary>The report's JSON, or null when the tenant has no report with that id.</summary>
    Task<string?> FindJsonAsync(string tenant, string id, CancellationToken cancellationToken);

    /// <summary>
    /// The report's UTF-8 JSON as a readable stream with a known <see cref="Stream.Length"/> (the caller disposes it),
    /// or null when the tenant has no report with that id. Stores that cannot stream fall back to <see cref="FindJsonAsync"/>.
    /// </summary>
    async Task<Stream?> OpenJsonAsync(string tenant, string id, CancellationToken cancellationToken) =>
        await FindJsonAsync(tenant, id, cancellationToken) is { } json ? new MemoryStream(Encoding.UTF8.GetBytes(json), writable: false) : null;

    /// <summary>
    /// Stores the report unless the tenant already has one with that id (INSERT ... ON CONFLICT DO NOTHING), in one
    /// statement, so instances starting together can both store the demo. True when this call stored it.
    /// </summary>
    Task<bool> SaveIfAbsentAsync(ReportHeader header, Stream json, CancellationToken cancellationToken) =>
        throw new NotSupportedException($"{GetType().Name} cannot store a report only if it is absent");

    /// <summary>
    /// One page of the tenant's reports, newest first (created_at DESC, id DESC; no JSON). The one listing path: the
    /// API, the list page and the home page's recent list all read through it. The default (an empty page) keeps
    /// test doubles that do not list compiling.
    /// </summary>
    Task<ReportSummaryPage> ListAsync(ReportListQuery query, CancellationToken cancellationToken) => Task.FromResult(ReportSummaryPage.Empty);

    /// <summary>The tenant's newest reports first, at most <paramref name="limit"/> (the first page of <see cref="ListAsync"/>).</summary>
    async Task<IReadOnlyList<ReportSummary>> ListRecentAsync(string tenant, int limit, CancellationToken cancellationToken) =>
        (await ListAsync(new ReportListQuery(tenant, limit), cancellationToken)).Items;

    /// <summary>Deletes the tenant's report; false when the tenant has no report with that id.</summary>
    Task<bool> DeleteAsync(string tenant, string id, CancellationToken cancellationToken) =>
        throw new NotSupportedException($"{GetType().Name} cannot delete reports");

    /// <summary>
    /// Deletes at most <paramref name="batchSize"/> reports of any tenant created before <paramref name="cutoff"/>, in one
    /// short transaction; returns how many. Callers repeat until fewer than a batch come back (retention).
    /// </summary>
    Task<int> DeleteCreatedBeforeAsync(DateTimeOffset cutoff, int batchSize, CancellationToken cancellationToken) =>
        throw new NotSupportedException($"{GetType().Name} cannot delete reports");

    /// <summary>True when the store answers a trivial query.</summary>
    Task<bool> IsReachableAsync(CancellationToken cancellationToken);
}

/// <summary>One report row; <paramref name="ProjectId"/> names the project the report is a delivery of (null: none).</summary>
public sealed record StoredReport(string Tenant, string Id, DateTimeOffset CreatedAt, string? Title, string Verdict, string Json, string? ProjectId = null);

/// <summary>One report row without its JSON (which travels as a stream).</summary>
public sealed record ReportHeader(string Tenant, string Id, DateTimeOffset CreatedAt, string? Title, string Verdict, string? ProjectId = null);

/// <summary>One line of a report list.</summary>
public sealed record ReportSummary(string Id, DateTimeOffset CreatedAt, string? Title, string Verdict);
