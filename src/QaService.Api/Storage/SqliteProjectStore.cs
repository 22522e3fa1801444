using System.Globalization;
using Microsoft.Data.Sqlite;
using Microsoft.Extensions.Options;

namespace QaService.Api.Storage;

/// <summary>Projects in the same SQLite file as the reports (schema in <see cref="SqliteSchema"/>).</summary>
internal sealed class SqliteProjectStore(IOptions<StorageOptions> options) : IProjectStore
{
    private readonly string connectionString = options.Value.EffectiveConnectionString;

    public async Task CreateAsync(StoredProject project, CancellationToken cancellationToken)
    {
        await using var connection = await SqliteConnections.OpenAsync(connectionString, cancellationToken);
        await using var command = connection.CreateCommand();
        command.CommandText = "INSERT INTO projects (tenant, id, name, created_at, spec) VALUES ($tenant, $id, $name, $created, $spec)";
        command.Parameters.AddWithValue("$tenant", project.Tenant);
        command.Parameters.AddWithValue("$id", project.Id);
        command.Parameters.AddWithValue("$name", project.Name);
        command.Parameters.AddWithValue("$created", project.CreatedAt.UtcDateTime.ToString("O"));
        command.Parameters.AddWithValue("$spec", project.SpecJson);
        await command.ExecuteNonQueryAsync(cancellationToken);
    }

    public async Task<StoredProject?> FindAsync(string tenant, string id, CancellationToken cancellationToken)
    {
        var found = await QueryAsync("SELECT tenant, id, name, created_at, spec FROM projects WHERE tenant = $tenant AND id = $id",
            command => command.Parameters.AddWithValue("$id", id), tenant, cancellationToken);
        return found.Count == 0 ? null : found[0];
    }

    public Task<IReadOnlyList<StoredProject>> ListAsync(string tenant, int limit, CancellationToken cancellationToken) =>
        QueryAsync("SELECT tenant, id, name, created_at, spec FROM projects WHERE tenant = $tenant ORDER BY created_at DESC, id LIMIT $limit",
            command => command.Parameters.AddWithValue("$limit", limit), tenant, cancellationToken);

    public async Task<IReadOnlyList<DeliveryRow>> ListDeliveriesAsync(string tenant, string projectId, CancellationToken cancellationToken)
    {
        await using var connection = await SqliteConnections.OpenAsync(connectionString, cancellationToken);
        await using var command = connection.CreateCommand();
        command.CommandText = SqlText.Deliveries.Replace("@tenant", "$tenant").Replace("@project", "$project");
        command.Parameters.AddWithValue("$tenant", tenant);
        command.Parameters.AddWithValue("$project", projectId);
        var rows = new List<DeliveryRow>();
        await using var reader = await command.ExecuteReaderAsync(cancellationToken);
        while (await reader.ReadAsync(cancellationToken))
        {
            var report = new ReportSummary(reader.GetString(0), Time(reader.GetString(1)), reader.IsDBNull(2) ? null : reader.GetString(2), reader.GetString(3));
            var latest = reader.IsDBNull(4) ? null : SqliteDecisionStore.ReadDecision(reader, 4);
            rows.Add(new DeliveryRow(report, latest));
        }

        return rows;
    }

    private async Task<IReadOnlyList<StoredProject>> QueryAsync(string sql, Action<SqliteCommand> bind, string tenant, CancellationToken cancellationToken)
    {
        await using var connection = await SqliteConnections.OpenAsync(connectionString, cancellationToken);
        await using var command = connection.CreateCommand();
        command.CommandText = sql;
        command.Parameters.AddWithValue("$tenant", tenant);
        bind(command);
        var list = new List<StoredProject>();
        await using var reader = await command.ExecuteReaderAsync(cancellationToken);
        while (await reader.ReadAsync(cancellationToken))
            list.Add(new StoredProject(reader.GetString(0), reader.GetString(1), reader.GetString(2), Time(reader.GetString(3)), reader.GetString(4)));
        return list;
    }

    internal static DateTimeOffset Time(string text) => DateTimeOffset.Parse(text, CultureInfo.InvariantCulture, DateTimeStyles.AssumeUniversal);
}

/// <summary>SQL both providers share (parameters written <c>@name</c>; each store binds them its own way).</summary>
internal static class SqlText
{
    /// <summary>A project's reports, oldest first, with the columns of their latest decision (null when none).</summary>
    public const string Deliveries = """
        SELECT r.id, r.created_at, r.title, r.verdict, d.decision, d.decided_by, d.comment, d.decided_at, d.report_sha256
        FROM reports r
        LEFT JOIN decisions d ON d.seq = (SELECT MAX(seq) FROM decisions WHERE tenant = r.tenant AND report_id = r.id)
        WHERE r.tenant = @tenant AND r.project_id = @project
        ORDER BY r.created_at, r.id
        """;
}
