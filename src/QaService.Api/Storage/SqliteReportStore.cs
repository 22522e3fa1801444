using Microsoft.Data.Sqlite;
using Microsoft.Extensions.Options;

namespace QaService.Api.Storage;

/// <summary>
/// Reports in one SQLite file (the embedded default). WAL mode lets readers run beside a writer. Reports above the
/// group-commit size are files in a folder beside the database (<see cref="SqliteReportFiles"/>), their rows name them.
/// </summary>
internal sealed class SqliteReportStore(IOptions<StorageOptions> options) : IReportStore
{
    /// <summary>Reports up to this size are kept in their row (through the group commit); larger ones as files.</summary>
    private const int GroupCommitMaximumBytes = 1_048_576;

    private readonly string connectionString = options.Value.EffectiveConnectionString;

    /// <summary>One writer at a time in this process: waiting here is cheaper than SQLite's busy-retry sleeps.</summary>
    private readonly SemaphoreSlim writeLock = new(1, 1);

    private readonly SqliteReportFiles files = new(options.Value.EffectiveConnectionString);

    private SqliteGroupCommit? groupCommit;

    private readonly SqliteBackgroundCheckpoint checkpoints = new(options.Value.EffectiveConnectionString);

    /// <summary>Migrates, then removes report files no row names (a crash between a file and its row; see <see cref="SqliteReportFiles"/>).</summary>
    public async Task InitializeAsync(CancellationToken cancellationToken)
    {
        SqliteConnections.EnsureFolder(connectionString);
        await using var connection = await OpenAsync(cancellationToken);
        await SqliteSchema.MigrateAsync(connection, cancellationToken);
        await using var command = connection.CreateCommand();
        command.CommandText = "SELECT json_file FROM reports WHERE json_file IS NOT NULL";
        var named = new HashSet<string>(StringComparer.Ordinal);
        await using (var reader = await command.ExecuteReaderAsync(cancellationToken))
            while (await reader.ReadAsync(cancellationToken))
                named.Add(reader.GetString(0));
        files.RemoveOrphans(named);
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

    /// <summary>A staging file in the report folder: a large report is serialised where it will be kept, never copied.</summary>
    public Stream CreateJsonSpool() => files.CreateStaged();

    /// <summary>
    /// Small reports go into their row through the group commit. A larger one is kept as a file: the spool from
    /// <see cref="CreateJsonSpool"/> is published as it is (any other stream is copied into a staging file first), made
    /// durable (file and folder fsynced), and only then its row is inserted, so a report is answered only once durable.
    /// A failed insert (a duplicate id) removes the new file; the stored report keeps its own.
    /// </summary>
    public async Task SaveAsync(ReportHeader header, Stream json, CancellationToken cancellationToken)
    {
        var length = json.Length - json.Position;
        if (length <= GroupCommitMaximumBytes)
        {
            var bytes = Assessments.ReportSerialisation.WholeArrayOf(json);
            if (bytes is null)
            {
                bytes = new byte[length];
                await json.ReadExactlyAsync(bytes, cancellationToken);
            }
            await GroupCommit.SaveAsync(header, bytes);
            return;
        }
        var own = json is StagedReportFile staged && staged.Folder == files && json.Position == 0 ? staged : null;
        await using var copy = own is null ? await CopyToStagingAsync(json, cancellationToken) : null;
        var file = own ?? copy!;
        try
        {
            file.Publish();
            await GroupCommit.SaveAsync(header, [], file.FileName);
        }
        catch
        {
            files.Delete(file.FileName);
            throw;
        }
    }

    private SqliteGroupCommit GroupCommit => LazyInitializer.EnsureInitialized(ref groupCommit, () => new SqliteGroupCommit(OpenAsync, writeLock, checkpoints.Committed));

    private async Task<StagedReportFile> CopyToStagingAsync(Stream json, CancellationToken cancellationToken)
    {
        var staged = files.CreateStaged();
        try
        {
            await json.CopyToAsync(staged, TemporaryJsonSpool.FileBufferBytes, cancellationToken);
            return staged;
        }
        catch
        {
            await staged.DisposeAsync();
            throw;
        }
    }

    public async Task<string?> FindJsonAsync(string tenant, string id, CancellationToken cancellationToken)
    {
        await using var connection = await OpenAsync(cancellationToken);
        await using var command = connection.CreateCommand();
        command.CommandText = "SELECT json, json_file FROM reports WHERE tenant = $tenant AND id = $id";
        command.Parameters.AddWithValue("$tenant", tenant);
        command.Parameters.AddWithValue("$id", id);
        await using var reader = await command.ExecuteReaderAsync(cancellationToken);
        if (!await reader.ReadAsync(cancellationToken))
            return null;
        // GetString reads TEXT and BLOB-of-UTF-8 rows alike (sqlite3_column_text).
        if (reader.IsDBNull(1))
            return reader.GetString(0);
        await using var file = OpenFile(reader.GetString(1));
        if (file is null)
            return null;
        using var text = new StreamReader(file, System.Text.Encoding.UTF8, detectEncodingFromByteOrderMarks: false);
        return await text.ReadToEndAsync(cancellationToken);
    }

    /// <summary>
    /// A file row: the file, opened for shared read. An older in-row report: incremental BLOB I/O, the stream owning its
    /// connection. A file deleted between the lookup and the open is a report deleted meanwhile: null.
    /// </summary>
    public async Task<Stream?> OpenJsonAsync(string tenant, string id, CancellationToken cancellationToken)
    {
        var connection = await OpenAsync(cancellationToken);
        try
        {
            await using var command = connection.CreateCommand();
            command.CommandText = "SELECT rowid, json_file FROM reports WHERE tenant = $tenant AND id = $id";
            command.Parameters.AddWithValue("$tenant", tenant);
            command.Parameters.AddWithValue("$id", id);
            long rowId;
            string? fileName;
            await using (var reader = await command.ExecuteReaderAsync(cancellationToken))
            {
                if (!await reader.ReadAsync(cancellationToken))
                {
                    await connection.DisposeAsync();
                    return null;
                }
                (rowId, fileName) = (reader.GetInt64(0), reader.IsDBNull(1) ? null : reader.GetString(1));
            }
            if (fileName is null)
                return new OwningStream(new SqliteBlob(connection, "reports", "json", rowId, readOnly: true), connection);
            await connection.DisposeAsync();
            return OpenFile(fileName);
        }
        catch
        {
            await connection.DisposeAsync();
            throw;
        }
    }

    private FileStream? OpenFile(string fileName)
    {
        try
        {
            // ReadWrite share: the POST that created the report may still hold its (published) staging handle.
            return new FileStream(files.PathOf(fileName), FileMode.Open, FileAccess.Read, FileShare.ReadWrite | FileShare.Delete,
                TemporaryJsonSpool.FileBufferBytes, FileOptions.Asynchronous | FileOptions.SequentialScan);
        }
        catch (FileNotFoundException)
        {
            return null;
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
            if (await TitleCandidatesAsync(connection, query.TitleContains, cancellationToken) is { } candidates)
            {
                sql.Append(" AND rowid IN (SELECT value FROM json_each($candidates))");
                command.Parameters.AddWithValue("$candidates", candidates);
            }
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

    /// <summary>Most title matches (all tenants) for which q= goes by the trigram index instead of the listing index.</summary>
    internal const int TitleCandidatesLimit = 2_000;

    /// <summary>The trigram index matches whole trigrams, so a shorter search text cannot use it.</summary>
    private const int TrigramLength = 3;

    /// <summary>
    /// The rowids of the reports whose title may contain <paramref name="text"/>, as a JSON array made in SQLite (one row
    /// back): the trigram index folds case at least as widely as LIKE, so it never misses a LIKE match, and LIKE still
    /// decides. Null when the text is shorter than a trigram or matches more than <see cref="TitleCandidatesLimit"/>
    /// titles: then the listing index is walked as before, and with that many matches it meets a page of them soon.
    /// </summary>
    private async Task<string?> TitleCandidatesAsync(SqliteConnection connection, string text, CancellationToken cancellationToken)
    {
        if (text.EnumerateRunes().Count() < TrigramLength)
            return null;
        await CatchUpTitleIndexAsync(connection, cancellationToken);
        await using var command = connection.CreateCommand();
        command.CommandText = "SELECT count(*), json_group_array(rowid) FROM (SELECT rowid FROM report_titles WHERE report_titles MATCH $phrase LIMIT $limit)";
        command.Parameters.AddWithValue("$phrase", "\"" + text.Replace("\"", "\"\"", StringComparison.Ordinal) + "\"");
        command.Parameters.AddWithValue("$limit", TitleCandidatesLimit + 1);
        await using var reader = await command.ExecuteReaderAsync(cancellationToken);
        await reader.ReadAsync(cancellationToken);
        return reader.GetInt64(0) <= TitleCandidatesLimit ? reader.GetString(1) : null;
    }

    /// <summary>
    /// Adds the reports stored since the last search to the title index (migration 10), in one transaction under the write
    /// lock; a look at two index ends decides whether there are any, so a search with none to add writes nothing.
    /// </summary>
    private async Task CatchUpTitleIndexAsync(SqliteConnection connection, CancellationToken cancellationToken)
    {
        await using (var check = connection.CreateCommand())
        {
            check.CommandText = "SELECT (SELECT indexed_through FROM report_titles_state) < coalesce((SELECT max(rowid) FROM reports), 0)";
            if (Convert.ToInt64(await check.ExecuteScalarAsync(cancellationToken), System.Globalization.CultureInfo.InvariantCulture) == 0)
                return;
        }
        await writeLock.WaitAsync(cancellationToken);
        try
        {
            await using var transaction = connection.BeginTransaction(deferred: false);
            await using var command = connection.CreateCommand();
            command.Transaction = transaction;
            command.CommandText = """
                INSERT INTO report_titles (rowid, title)
                SELECT rowid, title FROM reports WHERE rowid > (SELECT indexed_through FROM report_titles_state);
                UPDATE report_titles_state SET indexed_through = (SELECT coalesce(max(rowid), 0) FROM reports);
                """;
            await command.ExecuteNonQueryAsync(cancellationToken);
            await transaction.CommitAsync(cancellationToken);
        }
        finally
        {
            writeLock.Release();
        }
    }

    public async Task<bool> DeleteAsync(string tenant, string id, CancellationToken cancellationToken) =>
        await DeleteRowsAsync("DELETE FROM reports WHERE tenant = $tenant AND id = $id RETURNING json_file", [("$tenant", tenant), ("$id", id)], cancellationToken) > 0;

    public async Task<int> DeleteCreatedBeforeAsync(DateTimeOffset cutoff, int batchSize, CancellationToken cancellationToken)
    {
        var deleted = await DeleteRowsAsync("DELETE FROM reports WHERE rowid IN (SELECT rowid FROM reports WHERE created_at < $cutoff LIMIT $batch) RETURNING json_file",
            [("$cutoff", TimeText(cutoff)), ("$batch", batchSize)], cancellationToken);
        // Freed pages go through the WAL too; let the background checkpoint count them (a page per row, roughly).
        checkpoints.Committed(deleted * 4096L);
        return deleted;
    }

    /// <summary>
    /// One DELETE ... RETURNING json_file (its own transaction, under the group commit's write lock so it never waits in
    /// SQLite's busy-retry sleeps), then the deleted rows' files: a file goes only after no committed row names it.
    /// SQLite makes every change at the first step (https://sqlite.org/lang_returning.html), so the names are read to the
    /// end whatever the token says; a crash before the files go leaves orphans for the next start.
    /// </summary>
    private async Task<int> DeleteRowsAsync(string sql, (string Name, object Value)[] parameters, CancellationToken cancellationToken)
    {
        var (deleted, fileNames) = (0, new List<string>());
        await writeLock.WaitAsync(cancellationToken);
        try
        {
            await using var connection = await OpenAsync(cancellationToken);
            await using var command = connection.CreateCommand();
            command.CommandText = sql;
            foreach (var (name, value) in parameters)
                command.Parameters.AddWithValue(name, value);
            await using var reader = await command.ExecuteReaderAsync(cancellationToken);
            while (await reader.ReadAsync(CancellationToken.None))
            {
                deleted++;
                if (!reader.IsDBNull(0))
                    fileNames.Add(reader.GetString(0));
            }
        }
        finally
        {
            writeLock.Release();
        }
        foreach (var fileName in fileNames)
            files.Delete(fileName);
        return deleted;
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
