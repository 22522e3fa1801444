using Npgsql;
using NpgsqlTypes;
using QaService.Core.SignOff;

namespace QaService.Api.Storage;

/// <summary>Decisions in PostgreSQL (schema in <see cref="PostgresSchema"/>: UPDATE refused by a trigger, ON DELETE CASCADE from reports).</summary>
internal sealed class PostgresDecisionStore(NpgsqlDataSource dataSource) : IDecisionStore
{
    public async Task<bool> AddAsync(string tenant, string reportId, SignOffDecision decision, CancellationToken cancellationToken)
    {
        // One statement: the report's existence is checked where the row is written (and the foreign key holds it).
        await using var command = dataSource.CreateCommand("""
            INSERT INTO decisions (tenant, report_id, decision, decided_by, comment, decided_at, report_sha256)
            SELECT $1, $2, $3, $4, $5, $6, $7
            WHERE EXISTS (SELECT 1 FROM reports WHERE tenant = $1 AND id = $2)
            """);
        command.Parameters.Add(new NpgsqlParameter { Value = tenant, NpgsqlDbType = NpgsqlDbType.Text });
        command.Parameters.Add(new NpgsqlParameter { Value = reportId, NpgsqlDbType = NpgsqlDbType.Text });
        command.Parameters.Add(new NpgsqlParameter { Value = decision.Decision, NpgsqlDbType = NpgsqlDbType.Text });
        command.Parameters.Add(new NpgsqlParameter { Value = decision.By, NpgsqlDbType = NpgsqlDbType.Text });
        command.Parameters.Add(new NpgsqlParameter { Value = (object?)decision.Comment ?? DBNull.Value, NpgsqlDbType = NpgsqlDbType.Text });
        command.Parameters.Add(new NpgsqlParameter { Value = decision.At.ToUniversalTime(), NpgsqlDbType = NpgsqlDbType.TimestampTz });
        command.Parameters.Add(new NpgsqlParameter { Value = decision.ReportSha256, NpgsqlDbType = NpgsqlDbType.Text });
        try
        {
            return await command.ExecuteNonQueryAsync(cancellationToken) == 1;
        }
        catch (PostgresException exception) when (exception.SqlState == PostgresErrorCodes.ForeignKeyViolation)
        {
            return false; // the report was deleted between the check and the commit
        }
    }

    public async Task<IReadOnlyList<SignOffDecision>> ListAsync(string tenant, string reportId, CancellationToken cancellationToken)
    {
        await using var command = dataSource.CreateCommand("SELECT decision, decided_by, comment, decided_at, report_sha256 FROM decisions WHERE tenant = $1 AND report_id = $2 ORDER BY seq");
        command.Parameters.Add(new NpgsqlParameter { Value = tenant });
        command.Parameters.Add(new NpgsqlParameter { Value = reportId });
        var list = new List<SignOffDecision>();
        await using var reader = await command.ExecuteReaderAsync(cancellationToken);
        while (await reader.ReadAsync(cancellationToken))
            list.Add(ReadDecision(reader, 0));
        return list;
    }

    internal static SignOffDecision ReadDecision(NpgsqlDataReader reader, int first) => new(
        reader.GetString(first), reader.GetString(first + 1), reader.IsDBNull(first + 2) ? null : reader.GetString(first + 2),
        reader.GetFieldValue<DateTimeOffset>(first + 3), reader.GetString(first + 4));
}
