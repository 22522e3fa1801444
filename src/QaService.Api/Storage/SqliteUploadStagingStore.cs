using Microsoft.Data.Sqlite;
using Microsoft.Extensions.Options;

namespace QaService.Api.Storage;

/// <summary>Staged uploads in the reports' SQLite file (table from <see cref="SqliteSchema"/> migration 3).</summary>
internal sealed class SqliteUploadStagingStore(IOptions<StorageOptions> options) : IUploadStagingStore
{
    private readonly string connectionString = options.Value.EffectiveConnectionString;

    public async Task SaveAsync(StagedUpload upload, CancellationToken cancellationToken)
    {
        await using var connection = await SqliteConnections.OpenAsync(connectionString, cancellationToken);
        await using var command = connection.CreateCommand();
        // The WHERE keeps another tenant's row with a colliding hash untouched (it cannot collide in practice).
        command.CommandText = """
            INSERT INTO staged_uploads (token_hash, tenant, created_ms, expires_ms, settings, marks_name, marks, fixes_name, fixes)
            VALUES ($hash, $tenant, $created, $expires, $settings, $marksName, $marks, $fixesName, $fixes)
            ON CONFLICT (token_hash) DO UPDATE SET expires_ms = excluded.expires_ms, settings = excluded.settings,
                marks_name = excluded.marks_name, marks = excluded.marks, fixes_name = excluded.fixes_name, fixes = excluded.fixes
            WHERE staged_uploads.tenant = excluded.tenant
            """;
        command.Parameters.AddWithValue("$hash", upload.TokenHash);
        command.Parameters.AddWithValue("$tenant", upload.Tenant);
        command.Parameters.AddWithValue("$created", upload.CreatedAt.ToUnixTimeMilliseconds());
        command.Parameters.AddWithValue("$expires", upload.ExpiresAt.ToUnixTimeMilliseconds());
        command.Parameters.AddWithValue("$settings", (object?)upload.Settings ?? DBNull.Value);
        command.Parameters.AddWithValue("$marksName", (object?)upload.Marks?.Name ?? DBNull.Value);
        command.Parameters.Add("$marks", SqliteType.Blob).Value = (object?)upload.Marks?.Content ?? DBNull.Value;
        command.Parameters.AddWithValue("$fixesName", (object?)upload.Fixes?.Name ?? DBNull.Value);
        command.Parameters.Add("$fixes", SqliteType.Blob).Value = (object?)upload.Fixes?.Content ?? DBNull.Value;
        await command.ExecuteNonQueryAsync(cancellationToken);
    }

    public async Task<StagedUpload?> FindAsync(string tenant, string tokenHash, CancellationToken cancellationToken)
    {
        await using var connection = await SqliteConnections.OpenAsync(connectionString, cancellationToken);
        await using var command = connection.CreateCommand();
        command.CommandText = "SELECT created_ms, expires_ms, settings, marks_name, marks, fixes_name, fixes FROM staged_uploads WHERE token_hash = $hash AND tenant = $tenant";
        command.Parameters.AddWithValue("$hash", tokenHash);
        command.Parameters.AddWithValue("$tenant", tenant);
        await using var reader = await command.ExecuteReaderAsync(cancellationToken);
        if (!await reader.ReadAsync(cancellationToken))
            return null;
        StagedFile? File(int name, int content) =>
            reader.IsDBNull(name) || reader.IsDBNull(content) ? null : new StagedFile(reader.GetString(name), (byte[])reader.GetValue(content));
        return new StagedUpload(tenant, tokenHash,
            DateTimeOffset.FromUnixTimeMilliseconds(reader.GetInt64(0)), DateTimeOffset.FromUnixTimeMilliseconds(reader.GetInt64(1)),
            reader.IsDBNull(2) ? null : reader.GetString(2), File(3, 4), File(5, 6));
    }

    public async Task DeleteAsync(string tenant, string tokenHash, CancellationToken cancellationToken)
    {
        await using var connection = await SqliteConnections.OpenAsync(connectionString, cancellationToken);
        await using var command = connection.CreateCommand();
        command.CommandText = "DELETE FROM staged_uploads WHERE token_hash = $hash AND tenant = $tenant";
        command.Parameters.AddWithValue("$hash", tokenHash);
        command.Parameters.AddWithValue("$tenant", tenant);
        await command.ExecuteNonQueryAsync(cancellationToken);
    }

    public async Task<int> DeleteExpiredAsync(DateTimeOffset now, CancellationToken cancellationToken)
    {
        await using var connection = await SqliteConnections.OpenAsync(connectionString, cancellationToken);
        await using var command = connection.CreateCommand();
        command.CommandText = "DELETE FROM staged_uploads WHERE expires_ms < $now";
        command.Parameters.AddWithValue("$now", now.ToUnixTimeMilliseconds());
        return await command.ExecuteNonQueryAsync(cancellationToken);
    }
}
