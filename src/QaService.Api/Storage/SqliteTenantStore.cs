using Microsoft.Data.Sqlite;
using Microsoft.Extensions.Options;

namespace QaService.Api.Storage;

/// <summary>Tenants in the same SQLite file as the reports (schema in <see cref="SqliteSchema"/>).</summary>
internal sealed class SqliteTenantStore(IOptions<StorageOptions> options) : ITenantStore
{
    private readonly string connectionString = options.Value.EffectiveConnectionString;

    public async Task<bool> CreateAsync(StoredTenant tenant, CancellationToken cancellationToken)
    {
        await using var connection = await SqliteConnections.OpenAsync(connectionString, cancellationToken);
        await using var command = connection.CreateCommand();
        command.CommandText = "INSERT INTO tenants (id, name, key_hash, created_at) VALUES ($id, $name, $hash, $created) ON CONFLICT (name) DO NOTHING";
        command.Parameters.AddWithValue("$id", tenant.Id);
        command.Parameters.AddWithValue("$name", tenant.Name);
        command.Parameters.AddWithValue("$hash", tenant.KeyHash);
        command.Parameters.AddWithValue("$created", tenant.CreatedAt.UtcDateTime.ToString("O"));
        return await command.ExecuteNonQueryAsync(cancellationToken) == 1;
    }

    public Task<StoredTenant?> FindByKeyHashAsync(string keyHash, CancellationToken cancellationToken) =>
        FindAsync("key_hash", keyHash, cancellationToken);

    public Task<StoredTenant?> FindByNameAsync(string name, CancellationToken cancellationToken) =>
        FindAsync("name", name, cancellationToken);

    /// <param name="column">A fixed column name from this class, never caller input.</param>
    private async Task<StoredTenant?> FindAsync(string column, string value, CancellationToken cancellationToken)
    {
        await using var connection = await SqliteConnections.OpenAsync(connectionString, cancellationToken);
        await using var command = connection.CreateCommand();
        command.CommandText = $"SELECT id, name, key_hash, created_at FROM tenants WHERE {column} = $value";
        command.Parameters.AddWithValue("$value", value);
        await using var reader = await command.ExecuteReaderAsync(cancellationToken);
        if (!await reader.ReadAsync(cancellationToken))
            return null;
        return new StoredTenant(reader.GetString(0), reader.GetString(1), reader.GetString(2),
            DateTimeOffset.Parse(reader.GetString(3), System.Globalization.CultureInfo.InvariantCulture));
    }
}
