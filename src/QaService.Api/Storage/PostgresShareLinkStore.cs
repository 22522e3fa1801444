using Npgsql;

namespace QaService.Api.Storage;

/// <summary>Share links in PostgreSQL (schema in <see cref="PostgresSchema"/>).</summary>
internal sealed class PostgresShareLinkStore(NpgsqlDataSource dataSource) : IShareLinkStore
{
    public async Task<bool> CreateAsync(StoredShareLink link, CancellationToken cancellationToken)
    {
        await using var command = dataSource.CreateCommand("""
            INSERT INTO share_links (id, token_hash, tenant, report_id, created_at, expires_at)
            SELECT $1, $2, tenant, id, $5, $6 FROM reports WHERE tenant = $3 AND id = $4
            """);
        foreach (var value in new object[] { link.Id, link.TokenHash, link.Tenant, link.ReportId, link.CreatedAt.ToUniversalTime(), link.ExpiresAt.ToUniversalTime() })
            command.Parameters.Add(new NpgsqlParameter { Value = value });
        return await command.ExecuteNonQueryAsync(cancellationToken) == 1;
    }

    public async Task<bool> DeleteAsync(string tenant, string reportId, string linkId, CancellationToken cancellationToken)
    {
        await using var command = dataSource.CreateCommand("DELETE FROM share_links WHERE id = $1 AND tenant = $2 AND report_id = $3");
        foreach (var value in new object[] { linkId, tenant, reportId })
            command.Parameters.Add(new NpgsqlParameter { Value = value });
        return await command.ExecuteNonQueryAsync(cancellationToken) == 1;
    }

    public async Task<StoredShareLink?> FindAsync(string tokenHash, CancellationToken cancellationToken)
    {
        await using var command = dataSource.CreateCommand("""
            SELECT s.id, s.token_hash, s.tenant, s.report_id, s.created_at, s.expires_at
            FROM share_links s JOIN reports r ON r.tenant = s.tenant AND r.id = s.report_id
            WHERE s.token_hash = $1
            """);
        command.Parameters.Add(new NpgsqlParameter { Value = tokenHash });
        await using var reader = await command.ExecuteReaderAsync(cancellationToken);
        if (!await reader.ReadAsync(cancellationToken))
            return null;
        return new StoredShareLink(reader.GetString(0), reader.GetString(1), reader.GetString(2), reader.GetString(3),
            reader.GetFieldValue<DateTimeOffset>(4), reader.GetFieldValue<DateTimeOffset>(5));
    }

    public async Task<string> GetOrAddSecretAsync(string name, string candidate, CancellationToken cancellationToken)
    {
        await using (var insert = dataSource.CreateCommand("INSERT INTO service_secrets (name, value) VALUES ($1, $2) ON CONFLICT (name) DO NOTHING"))
        {
            insert.Parameters.Add(new NpgsqlParameter { Value = name });
            insert.Parameters.Add(new NpgsqlParameter { Value = candidate });
            await insert.ExecuteNonQueryAsync(cancellationToken);
        }
        await using var select = dataSource.CreateCommand("SELECT value FROM service_secrets WHERE name = $1");
        select.Parameters.Add(new NpgsqlParameter { Value = name });
        return (string)(await select.ExecuteScalarAsync(cancellationToken))!;
    }

    public async Task<IReadOnlyList<string>> ListSecretsAsync(string prefix, CancellationToken cancellationToken)
    {
        await using var command = dataSource.CreateCommand("SELECT value FROM service_secrets WHERE left(name, length($1)) = $1 ORDER BY name");
        command.Parameters.Add(new NpgsqlParameter { Value = prefix });
        var values = new List<string>();
        await using var reader = await command.ExecuteReaderAsync(cancellationToken);
        while (await reader.ReadAsync(cancellationToken))
            values.Add(reader.GetString(0));
        return values;
    }
}
