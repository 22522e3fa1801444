using System.Data.Common;
using Microsoft.Extensions.Options;
using QaService.Core.SignOff;

namespace QaService.Api.Storage;

/// <summary>Decisions in the same SQLite file as the reports (schema in <see cref="SqliteSchema"/>; UPDATE is refused by a trigger).</summary>
internal sealed class SqliteDecisionStore(IOptions<StorageOptions> options) : IDecisionStore
{
    private readonly string connectionString = options.Value.EffectiveConnectionString;

    public async Task<bool> AddAsync(string tenant, string reportId, SignOffDecision decision, CancellationToken cancellationToken)
    {
        await using var connection = await SqliteConnections.OpenAsync(connectionString, cancellationToken);
        await using var command = connection.CreateCommand();
        // One statement: the report's existence is checked where the row is written, so a report deleted meanwhile gets none.
        command.CommandText = """
            INSERT INTO decisions (tenant, report_id, decision, decided_by, comment, decided_at, report_sha256)
            SELECT $tenant, $report, $decision, $by, $comment, $at, $sha
            WHERE EXISTS (SELECT 1 FROM reports WHERE tenant = $tenant AND id = $report)
            """;
        command.Parameters.AddWithValue("$tenant", tenant);
        command.Parameters.AddWithValue("$report", reportId);
        command.Parameters.AddWithValue("$decision", decision.Decision);
        command.Parameters.AddWithValue("$by", decision.By);
        command.Parameters.AddWithValue("$comment", (object?)decision.Comment ?? DBNull.Value);
        command.Parameters.AddWithValue("$at", decision.At.UtcDateTime.ToString("O"));
        command.Parameters.AddWithValue("$sha", decision.ReportSha256);
        return await command.ExecuteNonQueryAsync(cancellationToken) == 1;
    }

    public async Task<IReadOnlyList<SignOffDecision>> ListAsync(string tenant, string reportId, CancellationToken cancellationToken)
    {
        await using var connection = await SqliteConnections.OpenAsync(connectionString, cancellationToken);
        await using var command = connection.CreateCommand();
        command.CommandText = "SELECT decision, decided_by, comment, decided_at, report_sha256 FROM decisions WHERE tenant = $tenant AND report_id = $report ORDER BY seq";
        command.Parameters.AddWithValue("$tenant", tenant);
        command.Parameters.AddWithValue("$report", reportId);
        var list = new List<SignOffDecision>();
        await using var reader = await command.ExecuteReaderAsync(cancellationToken);
        while (await reader.ReadAsync(cancellationToken))
            list.Add(ReadDecision(reader, 0));
        return list;
    }

    /// <summary>A decision from five columns starting at <paramref name="first"/>: decision, by, comment, at, sha256.</summary>
    internal static SignOffDecision ReadDecision(DbDataReader reader, int first) => new(
        reader.GetString(first), reader.GetString(first + 1), reader.IsDBNull(first + 2) ? null : reader.GetString(first + 2),
        SqliteProjectStore.Time(reader.GetString(first + 3)), reader.GetString(first + 4));
}
