using System.Data;
using Npgsql;
using NpgsqlTypes;

namespace QaService.Api.Storage;

/// <summary>
/// Reports in PostgreSQL, for several stateless instances behind a load balancer. Durability: an
/// INSERT returns only after COMMIT, and with PostgreSQL's default <c>synchronous_commit = on</c> the
/// commit has been flushed to the WAL on disk (PostgreSQL 15 manual, §20.5.1 and §30.4), so a 201
/// follows a durable write. Do not turn synchronous_commit off for this database.
/// </summary>
internal sealed class PostgresReportStore(NpgsqlDataSource dataSource) : IReportStore
{
    public Task InitializeAsync(CancellationToken cancellationToken) => PostgresSchema.MigrateAsync(dataSource, cancellationToken);

    public Task SaveAsync(StoredReport report, CancellationToken cancellationToken) =>
        InsertAsync(new ReportHeader(report.Tenant, report.Id, report.CreatedAt, report.Title, report.Verdict, report.ProjectId), report.Json, cancellationToken);

    /// <summary>
    /// Streams the JSON into the text column: Npgsql writes a seekable stream's bytes as the parameter (its length is
    /// known), so a large report is never one string here. The bytes are UTF-8, the database encoding of the schema.
    /// </summary>
    public Task SaveAsync(ReportHeader header, Stream json, CancellationToken cancellationToken) => InsertAsync(header, json, cancellationToken);

    /// <summary>One INSERT for both forms of the JSON: a string, or a stream of its UTF-8 bytes.</summary>
    private async Task InsertAsync(ReportHeader header, object json, CancellationToken cancellationToken)
    {
        await using var command = InsertCommand(header, json, "");
        await command.ExecuteNonQueryAsync(cancellationToken);
    }

    private NpgsqlCommand InsertCommand(ReportHeader header, object json, string onConflict)
    {
        var command = dataSource.CreateCommand(
            "INSERT INTO reports (tenant, id, created_at, title, verdict, json, project_id) VALUES ($1, $2, $3, $4, $5, $6, $7)" + onConflict);
        command.Parameters.Add(new NpgsqlParameter { Value = header.Tenant });
        command.Parameters.Add(new NpgsqlParameter { Value = header.Id });
        command.Parameters.Add(new NpgsqlParameter { Value = header.CreatedAt.ToUniversalTime() });
        command.Parameters.Add(new NpgsqlParameter { Value = (object?)header.Title ?? DBNull.Value, NpgsqlDbType = NpgsqlDbType.Text });
        command.Parameters.Add(new NpgsqlParameter { Value = header.Verdict });
        command.Parameters.Add(new NpgsqlParameter { Value = json, NpgsqlDbType = NpgsqlDbType.Text });
        command.Parameters.Add(new NpgsqlParameter { Value = (object?)header.ProjectId ?? DBNull.Value, NpgsqlDbType = NpgsqlDbType.Text });
        return command;
    }

    /// <summary>
    /// Reads the JSON as a stream of its UTF-8 bytes (sequential access: the row is not buffered), with its length from
    /// <c>octet_length</c>; the stream owns the reader, the command and the connection.
    /// </summary>
    public async Task<Stream?> OpenJsonAsync(string tenant, string id, CancellationToken cancellationToken)
    {
        var connection = await dataSource.OpenConnectionAsync(cancellationToken);
        var owner = new DisposeAll(connection);
        try
        {
            var command = new NpgsqlCommand("SELECT octet_length(json), json FROM reports WHERE tenant = $1 AND id = $2", connection);
            owner.Add(command);
            command.Parameters.Add(new NpgsqlParameter { Value = tenant });
            command.Parameters.Add(new NpgsqlParameter { Value = id });
            var reader = await command.ExecuteReaderAsync(CommandBehavior.SequentialAccess | CommandBehavior.SingleRow, cancellationToken);
            owner.Add(reader);
            if (!await reader.ReadAsync(cancellationToken))
            {
                await owner.DisposeAsync();
                return null;
            }
            var length = reader.GetInt32(0);
            var stream = await reader.GetStreamAsync(1, cancellationToken);
            return new OwningStream(new KnownLengthStream(stream, length), owner);
        }
        catch
        {
            await owner.DisposeAsync();
            throw;
        }
    }

    public async Task<string?> FindJsonAsync(string tenant, string id, CancellationToken cancellationToken)
    {
        await using var command = dataSource.CreateCommand("SELECT json FROM reports WHERE tenant = $1 AND id = $2");
        command.Parameters.Add(new NpgsqlParameter { Value = tenant });
        command.Parameters.Add(new NpgsqlParameter { Value = id });
        return await command.ExecuteScalarAsync(cancellationToken) as string;
    }

    /// <summary>
    /// Keyset page on the index (tenant, created_at DESC, id DESC): the row comparison (created_at, id) &lt; (…) is an
    /// index range condition (PostgreSQL 15 manual §9.24.5, §11.3). <c>q</c> is ILIKE (case folding by the database's
    /// locale, so non-ASCII letters too).
    /// </summary>
    public async Task<ReportSummaryPage> ListAsync(ReportListQuery query, CancellationToken cancellationToken)
    {
        await using var command = dataSource.CreateCommand();
        var sql = new System.Text.StringBuilder("SELECT id, created_at, title, verdict FROM reports WHERE tenant = $1");
        command.Parameters.Add(new NpgsqlParameter { Value = query.Tenant });
        string Next(object value, NpgsqlDbType type)
        {
            command.Parameters.Add(new NpgsqlParameter { Value = value, NpgsqlDbType = type });
            return "$" + command.Parameters.Count.ToString(System.Globalization.CultureInfo.InvariantCulture);
        }
        if (query.After is { } after)
            sql.Append($" AND (created_at, id) < ({Next(after.CreatedAt.ToUniversalTime(), NpgsqlDbType.TimestampTz)}, {Next(after.Id, NpgsqlDbType.Text)})");
        if (query.Verdict is not null)
            sql.Append($" AND verdict = {Next(query.Verdict, NpgsqlDbType.Text)}");
        if (query.TitleContains is not null)
            sql.Append($" AND title ILIKE {Next(LikePattern.Containing(query.TitleContains), NpgsqlDbType.Text)}");
        if (query.From is { } from)
            sql.Append($" AND created_at >= {Next(from.ToUniversalTime(), NpgsqlDbType.TimestampTz)}");
        if (query.To is { } to)
            sql.Append($" AND created_at < {Next(to.ToUniversalTime(), NpgsqlDbType.TimestampTz)}");
        sql.Append($" ORDER BY created_at DESC, id DESC LIMIT {Next(query.Limit + 1, NpgsqlDbType.Integer)}");
        command.CommandText = sql.ToString();

        var rows = new List<ReportSummary>(query.Limit + 1);
        await using var reader = await command.ExecuteReaderAsync(cancellationToken);
        while (await reader.ReadAsync(cancellationToken))
            rows.Add(new ReportSummary(reader.GetString(0), reader.GetFieldValue<DateTimeOffset>(1), reader.IsDBNull(2) ? null : reader.GetString(2), reader.GetString(3)));
        return ReportSummaryPage.FromRows(rows, query.Limit);
    }

    public async Task<bool> DeleteAsync(string tenant, string id, CancellationToken cancellationToken)
    {
        await using var command = dataSource.CreateCommand("DELETE FROM reports WHERE tenant = $1 AND id = $2");
        command.Parameters.Add(new NpgsqlParameter { Value = tenant });
        command.Parameters.Add(new NpgsqlParameter { Value = id });
        return await command.ExecuteNonQueryAsync(cancellationToken) > 0;
    }

    /// <summary>One batch in its own statement (autocommit), so locks are held only for that batch's rows.</summary>
    public async Task<int> DeleteCreatedBeforeAsync(DateTimeOffset cutoff, int batchSize, CancellationToken cancellationToken)
    {
        await using var command = dataSource.CreateCommand(
            "DELETE FROM reports WHERE (tenant, id) IN (SELECT tenant, id FROM reports WHERE created_at < $1 LIMIT $2 FOR UPDATE SKIP LOCKED)");
        command.Parameters.Add(new NpgsqlParameter { Value = cutoff.ToUniversalTime() });
        command.Parameters.Add(new NpgsqlParameter { Value = batchSize });
        return await command.ExecuteNonQueryAsync(cancellationToken);
    }

    /// <summary>INSERT ... ON CONFLICT DO NOTHING: instances starting together both succeed, one of them stores.</summary>
    public async Task<bool> SaveIfAbsentAsync(ReportHeader header, Stream json, CancellationToken cancellationToken)
    {
        await using var command = InsertCommand(header, json, " ON CONFLICT (tenant, id) DO NOTHING");
        return await command.ExecuteNonQueryAsync(cancellationToken) == 1;
    }

    public async Task<bool> IsReachableAsync(CancellationToken cancellationToken)
    {
        try
        {
            await using var command = dataSource.CreateCommand("SELECT COUNT(*) FROM reports WHERE false");
            await command.ExecuteScalarAsync(cancellationToken);
            return true;
        }
        catch (Exception exception) when (exception is NpgsqlException or TimeoutException or InvalidOperationException)
        {
            return false;
        }
    }
}
