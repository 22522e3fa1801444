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
