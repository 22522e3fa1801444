using Npgsql;

namespace QaService.Api.Storage;

/// <summary>Tenants in PostgreSQL (schema in <see cref="PostgresSchema"/>).</summary>
internal sealed class PostgresTenantStore(NpgsqlDataSource dataSource) : ITenantStore
{
    public async Task<bool> CreateAsync(StoredTenant tenant, CancellationToken cancellationToken)
    {
        await using var command = dataSource.CreateCommand(
            "INSERT INTO tenants (id, name, key_hash, created_at) VALUES ($1, $2, $3, $4) ON CONFLICT (name) DO NOTHING");
        command.Parameters.Add(new NpgsqlParameter { Value = tenant.Id });
        command.Parameters.Add(new NpgsqlParameter { Value = tenant.Name });
        command.Parameters.Add(new NpgsqlParameter { Value = tenant.KeyHash });
        command.Parameters.Add(new NpgsqlParameter { Value = tenant.CreatedAt.ToUniversalTime() });
        return await command.ExecuteNonQueryAsync(cancellationToken) == 1;
    }

    public Task<StoredTenant?> FindByKeyHashAsync(string keyHash, CancellationToken cancellationToken) =>
        FindAsync("key_hash", keyHash, cancellationToken);

    public Task<StoredTenant?> FindByNameAsync(string name, CancellationToken cancellationToken) =>
        FindAsync("name", name, cancellationToken);

    /// <param name="column">A fixed column name from this class, never caller input.</param>
    private async Task<StoredTenant?> FindAsync(string column, string value, CancellationToken cancellationToken)
    {
        await using var command = dataSource.CreateCommand($"SELECT id, name, key_hash, created_at FROM tenants WHERE {column} = $1");
        command.Parameters.Add(new NpgsqlParameter { Value = value });
        await using var reader = await command.ExecuteReaderAsync(cancellationToken);
        if (!await reader.ReadAsync(cancellationToken))
            return null;
        return new StoredTenant(reader.GetString(0), reader.GetString(1), reader.GetString(2), reader.GetFieldValue<DateTimeOffset>(3));
    }
}
