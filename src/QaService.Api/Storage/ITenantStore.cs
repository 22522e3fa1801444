namespace QaService.Api.Storage;

/// <summary>Tenants and the SHA-256 of their API keys (never the keys themselves).</summary>
public interface ITenantStore
{
    /// <summary>Stores a new tenant. Returns false when the name is taken (names are unique).</summary>
    Task<bool> CreateAsync(StoredTenant tenant, CancellationToken cancellationToken);

    /// <summary>The tenant whose key hashes to <paramref name="keyHash"/>, or null.</summary>
    Task<StoredTenant?> FindByKeyHashAsync(string keyHash, CancellationToken cancellationToken);

    /// <summary>The tenant with exactly this name, or null (a JWT's tenant claim names its tenant this way).</summary>
    Task<StoredTenant?> FindByNameAsync(string name, CancellationToken cancellationToken);
}

/// <summary>One tenant row. <paramref name="KeyHash"/> is lower-case hex SHA-256 of the key.</summary>
public sealed record StoredTenant(string Id, string Name, string KeyHash, DateTimeOffset CreatedAt);
