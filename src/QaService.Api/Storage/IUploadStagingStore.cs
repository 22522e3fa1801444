namespace QaService.Api.Storage;

/// <summary>
/// Files of a guided upload kept between its preview and its run, so they are sent once. Rows are found by the
/// SHA-256 of an unguessable token and the tenant together: another tenant's token is simply not there. The schema
/// is created with the reports' (<see cref="IReportStore.InitializeAsync"/>).
/// </summary>
public interface IUploadStagingStore
{
    /// <summary>Creates the row, or replaces it when the same tenant already has that token.</summary>
    Task SaveAsync(StagedUpload upload, CancellationToken cancellationToken);

    /// <summary>The tenant's staged upload (expired or not: the caller tells the two apart), or null.</summary>
    Task<StagedUpload?> FindAsync(string tenant, string tokenHash, CancellationToken cancellationToken);

    /// <summary>Removes the tenant's staged upload (after its run).</summary>
    Task DeleteAsync(string tenant, string tokenHash, CancellationToken cancellationToken);

    /// <summary>Removes every staged upload, of any tenant, that expired before <paramref name="now"/>; returns how many.</summary>
    Task<int> DeleteExpiredAsync(DateTimeOffset now, CancellationToken cancellationToken);
}

/// <summary>One staged upload.</summary>
/// <param name="Settings">The step-one choices as JSON (<see cref="Upload.GuidedSettings"/>), null until given.</param>
public sealed record StagedUpload(
    string Tenant,
    string TokenHash,
    DateTimeOffset CreatedAt,
    DateTimeOffset ExpiresAt,
    string? Settings,
    StagedFile? Marks,
    StagedFile? Fixes);

/// <summary>A staged file: the name the browser gave and its bytes as sent.</summary>
public sealed record StagedFile(string Name, byte[] Content);
