namespace QaService.Api.Storage;

/// <summary>Share links of reports: who may read which report without credentials, until when.</summary>
public interface IShareLinkStore
{
    /// <summary>Stores a link only if its tenant owns the report; false when there is no such report for that tenant.</summary>
    Task<bool> CreateAsync(StoredShareLink link, CancellationToken cancellationToken);

    /// <summary>Removes a link of one of the tenant's reports; false when there is none with that id.</summary>
    Task<bool> DeleteAsync(string tenant, string reportId, string linkId, CancellationToken cancellationToken);

    /// <summary>
    /// The link with this token hash whose report still exists (joined on the reports table, so a deleted report's
    /// links are dead at once), or null. Expiry is the caller's to check, against its injected clock.
    /// </summary>
    Task<StoredShareLink?> FindAsync(string tokenHash, CancellationToken cancellationToken);

    /// <summary>The secret stored under <paramref name="name"/>; stores <paramref name="candidate"/> first if there is none (the first instance wins).</summary>
    Task<string> GetOrAddSecretAsync(string name, string candidate, CancellationToken cancellationToken);

    /// <summary>Every secret whose name starts with <paramref name="prefix"/> (the Data Protection key ring).</summary>
    Task<IReadOnlyList<string>> ListSecretsAsync(string prefix, CancellationToken cancellationToken);
}

/// <summary>One share link row. <paramref name="TokenHash"/> is lower-case hex SHA-256 of the link's token.</summary>
public sealed record StoredShareLink(string Id, string TokenHash, string Tenant, string ReportId, DateTimeOffset CreatedAt, DateTimeOffset ExpiresAt);
