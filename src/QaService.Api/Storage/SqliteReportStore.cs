using Microsoft.Data.Sqlite;
using Microsoft.Extensions.Options;

namespace QaService.Api.Storage;

/// <summary>Reports in one SQLite file (the embedded default). WAL mode lets readers run beside a writer.</summary>
internal sealed class SqliteReportStore(IOptions<StorageOptions> options) : IReportStore
{
    private readonly string connectionString = options.Value.EffectiveConnectionString;

    public async Task InitializeAsync(CancellationToken cancellationToken)
    {
        SqliteConnections.EnsureFolder(connectionString);
        await using var connection = await OpenAsync(cancellationToken);
        await SqliteSchema.MigrateAsync(connection, cancellationToken);
    }

    public async Task SaveAsync(StoredReport report, CancellationToken cancellationToken)
    {
        await using var connection = await OpenAsync(cancellationToken);
        await using var command = connection.CreateCommand();
        command.CommandText = "INSERT INTO reports (tenant, id, created_at, title, verdict, json) VALUES ($tenant, $id, $created, $title, $verdict, $json)";
        command.Parameters.AddWithValue("$tenant", report.Tenant);
        command.Parameters.AddWithValue("$id", report.Id);
        command.Parameters.AddWithValue("$created", report.CreatedAt.UtcDateTime.ToString("O"));
        command.Parameters.AddWithValue("$title", (object?)report.Title ?? DBNull.Value);
        command.Parameters.AddWithValue("$verdict", report.Verdict);
        command.Parameters.AddWithValue("$json", report.Json);
        await command.ExecuteNonQueryAsync(cancellationToken);
    }

    public async Task<string?> FindJsonAsync(string tenant, string id, CancellationToken cancellationToken)
    {
        await using var connection = await OpenAsync(cancellationToken);
        await using var command = connection.CreateCommand();
        command.CommandText = "SELECT json FROM reports WHERE tenant = $tenant AND id = $id";
        command.Parameters.AddWithValue("$tenant", tenant);
        command.Parameters.AddWithValue("$id", id);
        return await command.ExecuteScalarAsync(cancellationToken) as string;
    }

    public async Task<IReadOnlyList<ReportSummary>> ListRecentAsync(string tenant, int limit, CancellationToken cancellationToken)
    {
        await using var connection = await OpenAsync(cancellationToken);
        await using var command = connection.CreateCommand();
        command.CommandText = "SELECT id, created_at, title, verdict FROM reports WHERE tenant = $tenant ORDER BY created_at DESC, id LIMIT $limit";
        command.Parameters.AddWithValue("$tenant", tenant);
        command.Parameters.AddWithValue("$limit", limit);
        var list = new List<ReportSummary>();
        await using var reader = await command.ExecuteReaderAsync(cancellationToken);
        while (await reader.ReadAsync(cancellationToken))
        {
            var created = DateTimeOffset.Parse(reader.GetString(1), System.Globalization.CultureInfo.InvariantCulture, System.Globalization.DateTimeStyles.AssumeUniversal);
            list.Add(new ReportSummary(reader.GetString(0), created, reader.IsDBNull(2) ? null : reader.GetString(2), reader.GetString(3)));
        }

        return list;
    }

    public async Task<bool> IsReachableAsync(CancellationToken cancellationToken)
    {
        try
        {
            await using var connection = await OpenAsync(cancellationToken);
            await using var command = connection.CreateCommand();
            command.CommandText = "SELECT COUNT(*) FROM reports WHERE 0";
            await command.ExecuteScalarAsync(cancellationToken);
            return true;
        }
        catch (SqliteException)
        {
            return false;
        }
    }

    private Task<SqliteConnection> OpenAsync(CancellationToken cancellationToken) => SqliteConnections.OpenAsync(connectionString, cancellationToken);
}
