using Microsoft.Data.Sqlite;
using Microsoft.Extensions.Options;

namespace QaService.Api.Storage;

/// <summary>Reports in one SQLite file (the embedded default). WAL mode lets readers run beside a writer.</summary>
internal sealed class SqliteReportStore(IOptions<StorageOptions> options) : IReportStore
{
    private const int CopyBufferBytes = 81_920;

    /// <summary>Reports up to this size go through the group commit; larger ones stream in their own transaction.</summary>
    private const int GroupCommitMaximumBytes = 1_048_576;

    private readonly string connectionString = options.Value.EffectiveConnectionString;

    /// <summary>One writer at a time in this process: waiting here is cheaper than SQLite's busy-retry sleeps.</summary>
    private readonly SemaphoreSlim writeLock = new(1, 1);

    private SqliteGroupCommit? groupCommit;

    private readonly SqliteBackgroundCheckpoint checkpoints = new(options.Value.EffectiveConnectionString);

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
        command.CommandText = "INSERT INTO reports (tenant, id, created_at, title, verdict, json, project_id) VALUES ($tenant, $id, $created, $title, $verdict, $json, $project)";
        command.Parameters.AddWithValue("$tenant", report.Tenant);
        command.Parameters.AddWithValue("$id", report.Id);
        command.Parameters.AddWithValue("$created", report.CreatedAt.UtcDateTime.ToString("O"));
        command.Parameters.AddWithValue("$title", (object?)report.Title ?? DBNull.Value);
        command.Parameters.AddWithValue("$verdict", report.Verdict);
        command.Parameters.AddWithValue("$json", report.Json);
        command.Parameters.AddWithValue("$project", (object?)report.ProjectId ?? DBNull.Value);
        await command.ExecuteNonQueryAsync(cancellationToken);
    }

    /// <summary>
    /// Streams the JSON into the row: the INSERT reserves <c>zeroblob(length)</c> and the bytes are copied in through
    /// SQLite's incremental BLOB I/O (sqlite3_blob_open), one transaction, so the report is never one string in memory.
    /// The column keeps TEXT affinity; such rows hold a BLOB of UTF-8 text, which every reader here accepts.
    /// </summary>
    public async Task SaveAsync(ReportHeader header, Stream json, CancellationToken cancellationToken)
    {
        var length = json.Length - json.Position;
        if (length <= GroupCommitMaximumBytes)
        {
            var bytes = new byte[length];
            await json.ReadExactlyAsync(bytes, cancellationToken);
            await LazyInitializer.EnsureInitialized(ref groupCommit, () => new SqliteGroupCommit(OpenAsync, writeLock, checkpoints.Committed)).SaveAsync(header, bytes);
            return;
        }
        await writeLock.WaitAsync(cancellationToken);
        try
        {
            await SaveStreamedAsync(header, json, length, cancellationToken);
        }
        finally
        {
            writeLock.Release();
        }
    }

    /// <summary>
    /// One transaction; the commit does not checkpoint (that would copy the whole report from the WAL into the database
    /// inside this request, about a third of the store time): the checkpoint runs after, in the background.
    /// </summary>
    private async Task SaveStreamedAsync(ReportHeader header, Stream json, long length, CancellationToken cancellationToken)
    {
        await using var connection = await OpenAsync(cancellationToken);
        await using var transaction = connection.BeginTransaction(deferred: false);
        long rowId;
        await using (var command = connection.CreateCommand())
        {
            command.Transaction = transaction;
            command.CommandText = "INSERT INTO reports (tenant, id, created_at, title, verdict, json, project_id) VALUES ($tenant, $id, $created, $title, $verdict, zeroblob($length), $project) RETURNING rowid";
            command.Parameters.AddWithValue("$tenant", header.Tenant);
            command.Parameters.AddWithValue("$id", header.Id);
            command.Parameters.AddWithValue("$created", header.CreatedAt.UtcDateTime.ToString("O"));
            command.Parameters.AddWithValue("$title", (object?)header.Title ?? DBNull.Value);
            command.Parameters.AddWithValue("$verdict", header.Verdict);
            command.Parameters.AddWithValue("$length", length);
            command.Parameters.AddWithValue("$project", (object?)header.ProjectId ?? DBNull.Value);
            rowId = Convert.ToInt64(await command.ExecuteScalarAsync(cancellationToken), System.Globalization.CultureInfo.InvariantCulture);
        }
        await using (var blob = new SqliteBlob(connection, "reports", "json", rowId))
            await json.CopyToAsync(blob, CopyBufferBytes, cancellationToken);
        await transaction.CommitAsync(cancellationToken);
        checkpoints.Committed(length);
    }

    public async Task<string?> FindJsonAsync(string tenant, string id, CancellationToken cancellationToken)
    {
        await using var connection = await OpenAsync(cancellationToken);
        await using var command = connection.CreateCommand();
        command.CommandText = "SELECT json FROM reports WHERE tenant = $tenant AND id = $id";
        command.Parameters.AddWithValue("$tenant", tenant);
        command.Parameters.AddWithValue("$id", id);
        await using var reader = await command.ExecuteReaderAsync(cancellationToken);
        // GetString reads TEXT and BLOB-of-UTF-8 rows alike (sqlite3_column_text).
        return await reader.ReadAsync(cancellationToken) ? reader.GetString(0) : null;
    }

    /// <summary>Reads the JSON through incremental BLOB I/O; the stream owns its connection.</summary>
    public async Task<Stream?> OpenJsonAsync(string tenant, string id, CancellationToken cancellationToken)
    {
        var connection = await OpenAsync(cancellationToken);
        try
        {
            await using var command = connection.CreateCommand();
            command.CommandText = "SELECT rowid FROM reports WHERE tenant = $tenant AND id = $id";
            command.Parameters.AddWithValue("$tenant", tenant);
            command.Parameters.AddWithValue("$id", id);
            if (await command.ExecuteScalarAsync(cancellationToken) is not long rowId)
            {
                await connection.DisposeAsync();
                return null;
            }
            return new OwningStream(new SqliteBlob(connection, "reports", "json", rowId, readOnly: true), connection);
        }
        catch
        {
            await connection.DisposeAsync();
            throw;
        }
    }

    /// <summary>
    /// Keyset page on the index (tenant, created_at DESC, id DESC). created_at is ISO 8601 text written by one format
    /// ("O", UTC, 7 fraction digits), so text order is time order and bounds compare as text. <c>q</c> uses SQLite's LIKE,
    /// which folds case for ASCII letters only (https://sqlite.org/lang_expr.html#like).
    /// </summary>
    public async Task<ReportSummaryPage> ListAsync(ReportListQuery query, CancellationToken cancellationToken)
    {
        await using var connection = await OpenAsync(cancellationToken);
        await using var command = connection.CreateCommand();
        var sql = new System.Text.StringBuilder("SELECT id, created_at, title, verdict FROM reports WHERE tenant = $tenant");
        command.Parameters.AddWithValue("$tenant", query.Tenant);
        if (query.After is { } after)
        {
            sql.Append(" AND (created_at, id) < ($afterCreated, $afterId)");
            command.Parameters.AddWithValue("$afterCreated", TimeText(after.CreatedAt));
            command.Parameters.AddWithValue("$afterId", after.Id);
        }
        if (query.Verdict is not null)
        {
            sql.Append(" AND verdict = $verdict");
            command.Parameters.AddWithValue("$verdict", query.Verdict);
        }
        if (query.TitleContains is not null)
        {
            sql.Append(" AND title LIKE $title ESCAPE '\\'");
            command.Parameters.AddWithValue("$title", LikePattern.Containing(query.TitleContains));
        }
        if (query.From is { } from)
        {
            sql.Append(" AND created_at >= $from");
            command.Parameters.AddWithValue("$from", TimeText(from));
        }
        if (query.To is { } to)
        {
            sql.Append(" AND created_at < $to");
            command.Parameters.AddWithValue("$to", TimeText(to));
        }
        sql.Append(" ORDER BY created_at DESC, id DESC LIMIT $limit");
        command.Parameters.AddWithValue("$limit", query.Limit + 1);
        command.CommandText = sql.ToString();

        var rows = new List<ReportSummary>(query.Limit + 1);
        await using var reader = await command.ExecuteReaderAsync(cancellationToken);
        while (await reader.ReadAsync(cancellationToken))
        {
            var created = DateTimeOffset.Parse(reader.GetString(1), System.Globalization.CultureInfo.InvariantCulture, System.Globalization.DateTimeStyles.AssumeUniversal);
            rows.Add(new ReportSummary(reader.GetString(0), created, reader.IsDBNull(2) ? null : reader.GetString(2), reader.GetString(3)));
        }
        return ReportSummaryPage.FromRows(rows, query.Limit);
    }

    /// <summary>Through the group commit's write lock, so a delete never waits in SQLite's busy-retry sleeps.</summary>
    public async Task<bool> DeleteAsync(string tenant, string id, CancellationToken cancellationToken)
    {
        await writeLock.WaitAsync(cancellationToken);
        try
        {
            await using var connection = await OpenAsync(cancellationToken);
            await using var command = connection.CreateCommand();
            command.CommandText = "DELETE FROM reports WHERE tenant = $tenant AND id = $id";
            command.Parameters.AddWithValue("$tenant", tenant);
            command.Parameters.AddWithValue("$id", id);
            return await command.ExecuteNonQueryAsync(cancellationToken) > 0;
        }
        finally
        {
            writeLock.Release();
        }
    }

    public async Task<int> DeleteCreatedBeforeAsync(DateTimeOffset cutoff, int batchSize, CancellationToken cancellationToken)
    {
        await writeLock.WaitAsync(cancellationToken);
        try
        {
            await using var connection = await OpenAsync(cancellationToken);
            await using var command = connection.CreateCommand();
            command.CommandText = "DELETE FROM reports WHERE rowid IN (SELECT rowid FROM reports WHERE created_at < $cutoff LIMIT $batch)";
            command.Parameters.AddWithValue("$cutoff", TimeText(cutoff));
            command.Parameters.AddWithValue("$batch", batchSize);
            var deleted = await command.ExecuteNonQueryAsync(cancellationToken);
            // Freed pages go through the WAL too; let the background checkpoint count them (a page per row, roughly).
            checkpoints.Committed(deleted * 4096L);
            return deleted;
        }
        finally
        {
            writeLock.Release();
        }
    }

    /// <summary>INSERT ... ON CONFLICT DO NOTHING (SQLite upsert, https://sqlite.org/lang_upsert.html): one statement, no race.</summary>
    public async Task<bool> SaveIfAbsentAsync(ReportHeader header, Stream json, CancellationToken cancellationToken)
    {
        using var text = new StreamReader(json, System.Text.Encoding.UTF8, detectEncodingFromByteOrderMarks: false, leaveOpen: true);
        var body = await text.ReadToEndAsync(cancellationToken);
        await writeLock.WaitAsync(cancellationToken);
        try
        {
            await using var connection = await OpenAsync(cancellationToken);
            await using var command = connection.CreateCommand();
            command.CommandText = "INSERT INTO reports (tenant, id, created_at, title, verdict, json) VALUES ($tenant, $id, $created, $title, $verdict, $json) ON CONFLICT (tenant, id) DO NOTHING";
            command.Parameters.AddWithValue("$tenant", header.Tenant);
            command.Parameters.AddWithValue("$id", header.Id);
            command.Parameters.AddWithValue("$created", TimeText(header.CreatedAt));
            command.Parameters.AddWithValue("$title", (object?)header.Title ?? DBNull.Value);
            command.Parameters.AddWithValue("$verdict", header.Verdict);
            command.Parameters.AddWithValue("$json", body);
            return await command.ExecuteNonQueryAsync(cancellationToken) == 1;
        }
        finally
        {
            writeLock.Release();
        }
    }

    /// <summary>created_at as stored: ISO 8601 UTC with 7 fraction digits, so text order is time order.</summary>
    private static string TimeText(DateTimeOffset time) => time.UtcDateTime.ToString("O", System.Globalization.CultureInfo.InvariantCulture);

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
