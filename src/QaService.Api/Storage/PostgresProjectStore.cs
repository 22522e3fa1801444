using Npgsql;

namespace QaService.Api.Storage;

/// <summary>Projects in PostgreSQL (schema in <see cref="PostgresSchema"/>).</summary>
internal sealed class PostgresProjectStore(NpgsqlDataSource dataSource) : IProjectStore
{
    public async Task CreateAsync(StoredProject project, CancellationToken cancellationToken)
    {
        await using var command = dataSource.CreateCommand("INSERT INTO projects (tenant, id, name, created_at, spec) VALUES ($1, $2, $3, $4, $5)");
        command.Parameters.Add(new NpgsqlParameter { Value = project.Tenant });
        command.Parameters.Add(new NpgsqlParameter { Value = project.Id });
        command.Parameters.Add(new NpgsqlParameter { Value = project.Name });
        command.Parameters.Add(new NpgsqlParameter { Value = project.CreatedAt.ToUniversalTime() });
        command.Parameters.Add(new NpgsqlParameter { Value = project.SpecJson });
        await command.ExecuteNonQueryAsync(cancellationToken);
    }

    public async Task<StoredProject?> FindAsync(string tenant, string id, CancellationToken cancellationToken)
    {
        var found = await QueryAsync("SELECT tenant, id, name, created_at, spec FROM projects WHERE tenant = $1 AND id = $2", [tenant, id], cancellationToken);
        return found.Count == 0 ? null : found[0];
    }

    public Task<IReadOnlyList<StoredProject>> ListAsync(string tenant, int limit, CancellationToken cancellationToken) =>
        QueryAsync("SELECT tenant, id, name, created_at, spec FROM projects WHERE tenant = $1 ORDER BY created_at DESC, id LIMIT $2", [tenant, limit], cancellationToken);

    public async Task<IReadOnlyList<DeliveryRow>> ListDeliveriesAsync(string tenant, string projectId, CancellationToken cancellationToken)
    {
        await using var command = dataSource.CreateCommand(SqlText.Deliveries.Replace("@tenant", "$1").Replace("@project", "$2"));
        command.Parameters.Add(new NpgsqlParameter { Value = tenant });
        command.Parameters.Add(new NpgsqlParameter { Value = projectId });
        var rows = new List<DeliveryRow>();
        await using var reader = await command.ExecuteReaderAsync(cancellationToken);
        while (await reader.ReadAsync(cancellationToken))
        {
            var report = new ReportSummary(reader.GetString(0), reader.GetFieldValue<DateTimeOffset>(1), reader.IsDBNull(2) ? null : reader.GetString(2), reader.GetString(3));
            rows.Add(new DeliveryRow(report, reader.IsDBNull(4) ? null : PostgresDecisionStore.ReadDecision(reader, 4)));
        }

        return rows;
    }

    private async Task<IReadOnlyList<StoredProject>> QueryAsync(string sql, object[] values, CancellationToken cancellationToken)
    {
        await using var command = dataSource.CreateCommand(sql);
        foreach (var value in values)
            command.Parameters.Add(new NpgsqlParameter { Value = value });
        var list = new List<StoredProject>();
        await using var reader = await command.ExecuteReaderAsync(cancellationToken);
        while (await reader.ReadAsync(cancellationToken))
            list.Add(new StoredProject(reader.GetString(0), reader.GetString(1), reader.GetString(2), reader.GetFieldValue<DateTimeOffset>(3), reader.GetString(4)));
        return list;
    }
}
