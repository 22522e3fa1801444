using System.Globalization;
using Microsoft.Extensions.Options;

namespace QaService.Api.Storage;

/// <summary>Share links in the same SQLite file as the reports (schema in <see cref="SqliteSchema"/>).</summary>
internal sealed class SqliteShareLinkStore(IOptions<StorageOptions> options) : IShareLinkStore
{
    private readonly string connectionString = options.Value.EffectiveConnectionString;

    public async Task<bool> CreateAsync(StoredShareLink link, CancellationToken cancellationToken)
    {
        await using var connection = await SqliteConnections.OpenAsync(connectionString, cancellationToken);
        await using var command = connection.CreateCommand();
        command.CommandText = """
            INSERT INTO share_links (id, token_hash, tenant, report_id, created_at, expires_at)
            SELECT $id, $hash, tenant, id, $created, $expires FROM reports WHERE tenant = $tenant AND id = $report
            """;
        command.Parameters.AddWithValue("$id", link.Id);
        command.Parameters.AddWithValue("$hash", link.TokenHash);
        command.Parameters.AddWithValue("$tenant", link.Tenant);
        command.Parameters.AddWithValue("$report", link.ReportId);
        command.Parameters.AddWithValue("$created", Text(link.CreatedAt));
        command.Parameters.AddWithValue("$expires", Text(link.ExpiresAt));
        return await command.ExecuteNonQueryAsync(cancellationToken) == 1;
    }

    public async Task<bool> DeleteAsync(string tenant, string reportId, string linkId, CancellationToken cancellationToken)
    {
        await using var connection = await SqliteConnections.OpenAsync(connectionString, cancellationToken);
        await using var command = connection.CreateCommand();
        command.CommandText = "DELETE FROM share_links WHERE id = $id AND tenant = $tenant AND report_id = $report";
        command.Parameters.AddWithValue("$id", linkId);
        command.Parameters.AddWithValue("$tenant", tenant);
        command.Parameters.AddWithValue("$report", reportId);
        return await command.ExecuteNonQueryAsync(cancellationToken) == 1;
    }

    public async Task<StoredShareLink?> FindAsync(string tokenHash, CancellationToken cancellationToken)
    {
        await using var connection = await SqliteConnections.OpenAsync(connectionString, cancellationToken);
        await using var command = connection.CreateCommand();
        command.CommandText = """
            SELECT s.id, s.token_hash, s.tenant, s.report_id, s.created_at, s.expires_at
            FROM share_links s JOIN reports r ON r.tenant = s.tenant AND r.id = s.report_id
            WHERE s.token_hash = $hash
            """;
        command.Parameters.AddWithValue("$hash", tokenHash);
        await using var reader = await command.ExecuteReaderAsync(cancellationToken);
        if (!await reader.ReadAsync(cancellationToken))
            return null;
        return new StoredShareLink(reader.GetString(0), reader.GetString(1), reader.GetString(2), reader.GetString(3),
            Time(reader.GetString(4)), Time(reader.GetString(5)));
    }

    public async Task<string> GetOrAddSecretAsync(string name, string candidate, CancellationToken cancellationToken)
    {
        await using var connection = await SqliteConnections.OpenAsync(connectionString, cancellationToken);
        await using var command = connection.CreateCommand();
        command.CommandText = "INSERT INTO service_secrets (name, value) VALUES ($name, $value) ON CONFLICT (name) DO NOTHING; SELECT value FROM service_secrets WHERE name = $name";
        command.Parameters.AddWithValue("$name", name);
        command.Parameters.AddWithValue("$value", candidate);
        return (string)(await command.ExecuteScalarAsync(cancellationToken))!;
    }

    public async Task<IReadOnlyList<string>> ListSecretsAsync(string prefix, CancellationToken cancellationToken)
    {
        await using var connection = await SqliteConnections.OpenAsync(connectionString, cancellationToken);
        await using var command = connection.CreateCommand();
        command.CommandText = "SELECT value FROM service_secrets WHERE substr(name, 1, length($prefix)) = $prefix ORDER BY name";
        command.Parameters.AddWithValue("$prefix", prefix);
        var values = new List<string>();
        await using var reader = await command.ExecuteReaderAsync(cancellationToken);
        while (await reader.ReadAsync(cancellationToken))
            values.Add(reader.GetString(0));
        return values;
    }

    private static string Text(DateTimeOffset time) => time.UtcDateTime.ToString("O", CultureInfo.InvariantCulture);

    private static DateTimeOffset Time(string text) => DateTimeOffset.Parse(text, CultureInfo.InvariantCulture, DateTimeStyles.AssumeUniversal);
}
