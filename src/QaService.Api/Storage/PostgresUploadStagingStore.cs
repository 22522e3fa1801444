using Npgsql;
using NpgsqlTypes;

namespace QaService.Api.Storage;

/// <summary>Staged uploads in PostgreSQL (table from <see cref="PostgresSchema"/> migration 3), shared by every instance.</summary>
internal sealed class PostgresUploadStagingStore(NpgsqlDataSource dataSource) : IUploadStagingStore
{
    public async Task SaveAsync(StagedUpload upload, CancellationToken cancellationToken)
    {
        await using var command = dataSource.CreateCommand("""
            INSERT INTO staged_uploads (token_hash, tenant, created_at, expires_at, settings, marks_name, marks, fixes_name, fixes)
            VALUES ($1, $2, $3, $4, $5, $6, $7, $8, $9)
            ON CONFLICT (token_hash) DO UPDATE SET expires_at = excluded.expires_at, settings = excluded.settings,
                marks_name = excluded.marks_name, marks = excluded.marks, fixes_name = excluded.fixes_name, fixes = excluded.fixes
            WHERE staged_uploads.tenant = excluded.tenant
            """);
        command.Parameters.Add(new NpgsqlParameter { Value = upload.TokenHash });
        command.Parameters.Add(new NpgsqlParameter { Value = upload.Tenant });
        command.Parameters.Add(new NpgsqlParameter { Value = upload.CreatedAt.ToUniversalTime() });
        command.Parameters.Add(new NpgsqlParameter { Value = upload.ExpiresAt.ToUniversalTime() });
        command.Parameters.Add(new NpgsqlParameter { Value = (object?)upload.Settings ?? DBNull.Value, NpgsqlDbType = NpgsqlDbType.Text });
        command.Parameters.Add(new NpgsqlParameter { Value = (object?)upload.Marks?.Name ?? DBNull.Value, NpgsqlDbType = NpgsqlDbType.Text });
        command.Parameters.Add(new NpgsqlParameter { Value = (object?)upload.Marks?.Content ?? DBNull.Value, NpgsqlDbType = NpgsqlDbType.Bytea });
        command.Parameters.Add(new NpgsqlParameter { Value = (object?)upload.Fixes?.Name ?? DBNull.Value, NpgsqlDbType = NpgsqlDbType.Text });
        command.Parameters.Add(new NpgsqlParameter { Value = (object?)upload.Fixes?.Content ?? DBNull.Value, NpgsqlDbType = NpgsqlDbType.Bytea });
        await command.ExecuteNonQueryAsync(cancellationToken);
    }

    public async Task<StagedUpload?> FindAsync(string tenant, string tokenHash, CancellationToken cancellationToken)
    {
        await using var command = dataSource.CreateCommand(
            "SELECT created_at, expires_at, settings, marks_name, marks, fixes_name, fixes FROM staged_uploads WHERE token_hash = $1 AND tenant = $2");
        command.Parameters.Add(new NpgsqlParameter { Value = tokenHash });
        command.Parameters.Add(new NpgsqlParameter { Value = tenant });
        await using var reader = await command.ExecuteReaderAsync(cancellationToken);
        if (!await reader.ReadAsync(cancellationToken))
            return null;
        StagedFile? File(int name, int content) =>
            reader.IsDBNull(name) || reader.IsDBNull(content) ? null : new StagedFile(reader.GetString(name), reader.GetFieldValue<byte[]>(content));
        return new StagedUpload(tenant, tokenHash, reader.GetFieldValue<DateTimeOffset>(0), reader.GetFieldValue<DateTimeOffset>(1),
            reader.IsDBNull(2) ? null : reader.GetString(2), File(3, 4), File(5, 6));
    }

    public async Task DeleteAsync(string tenant, string tokenHash, CancellationToken cancellationToken)
    {
        await using var command = dataSource.CreateCommand("DELETE FROM staged_uploads WHERE token_hash = $1 AND tenant = $2");
        command.Parameters.Add(new NpgsqlParameter { Value = tokenHash });
        command.Parameters.Add(new NpgsqlParameter { Value = tenant });
        await command.ExecuteNonQueryAsync(cancellationToken);
    }

    public async Task<int> DeleteExpiredAsync(DateTimeOffset now, CancellationToken cancellationToken)
    {
        await using var command = dataSource.CreateCommand("DELETE FROM staged_uploads WHERE expires_at < $1");
        command.Parameters.Add(new NpgsqlParameter { Value = now.ToUniversalTime() });
        return await command.ExecuteNonQueryAsync(cancellationToken);
    }
}
