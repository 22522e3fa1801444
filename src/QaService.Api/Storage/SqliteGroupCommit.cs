using System.Threading.Channels;
using Microsoft.Data.Sqlite;

namespace QaService.Api.Storage;

/// <summary>
/// Group commit for report rows (small reports, and the rows of reports kept as files): one writer takes every insert queued so far and commits them in one transaction, then
/// acknowledges each. Every report is still answered only after its COMMIT returned (synchronous = FULL: the WAL is fsynced),
/// so the durability promise is unchanged; what changes is that concurrent requests share one fsync instead of queueing
/// for one each (SQLite WAL: a commit costs an fsync, ~1 ms here, and writers are serialised anyway). One failing insert
/// (a duplicate id) is rolled back to its own savepoint and fails alone.
/// </summary>
internal sealed class SqliteGroupCommit(Func<CancellationToken, Task<SqliteConnection>> open, SemaphoreSlim writeLock, Action<long> afterCommit)
{
    /// <summary>Most inserts in one transaction (bounds the time the first of them waits).</summary>
    private const int MaximumBatch = 256;

    private readonly Channel<Pending> queue = Channel.CreateUnbounded<Pending>(new UnboundedChannelOptions { SingleReader = true });
    private int started;

    /// <summary>Queues one row: the JSON itself, or (<paramref name="jsonFile"/>) the name of its already durable file and no JSON.</summary>
    public Task SaveAsync(ReportHeader header, byte[] json, string? jsonFile = null)
    {
        if (Interlocked.Exchange(ref started, 1) == 0)
            _ = Task.Run(WriteLoopAsync);
        var pending = new Pending(header, json, jsonFile, new TaskCompletionSource(TaskCreationOptions.RunContinuationsAsynchronously));
        if (!queue.Writer.TryWrite(pending))
            throw new InvalidOperationException("the report writer has stopped");
        return pending.Done.Task;
    }

    private async Task WriteLoopAsync()
    {
        var batch = new List<Pending>(MaximumBatch);
        while (await queue.Reader.WaitToReadAsync())
        {
            while (batch.Count < MaximumBatch && queue.Reader.TryRead(out var next))
                batch.Add(next);
            await writeLock.WaitAsync();
            try
            {
                await CommitAsync(batch);
            }
            catch (Exception exception)
            {
                foreach (var pending in batch)
                    pending.Done.TrySetException(exception);
            }
            finally
            {
                writeLock.Release();
                batch.Clear();
            }
        }
    }

    private async Task CommitAsync(List<Pending> batch)
    {
        await using var connection = await open(CancellationToken.None);
        await using var transaction = connection.BeginTransaction(deferred: false);
        // One prepared statement each for the whole batch (SQLite compiles a command's text once; only the values change).
        await using var savepoint = Command(connection, transaction, "SAVEPOINT report");
        await using var release = Command(connection, transaction, "RELEASE report");
        await using var rollback = Command(connection, transaction, "ROLLBACK TO report; RELEASE report");
        await using var insert = Command(connection, transaction,
            "INSERT INTO reports (tenant, id, created_at, title, verdict, json, project_id, json_file) VALUES ($tenant, $id, $created, $title, $verdict, CAST($json AS TEXT), $project, $file)");
        var tenant = insert.Parameters.Add("$tenant", SqliteType.Text);
        var id = insert.Parameters.Add("$id", SqliteType.Text);
        var created = insert.Parameters.Add("$created", SqliteType.Text);
        var title = insert.Parameters.Add("$title", SqliteType.Text);
        var verdict = insert.Parameters.Add("$verdict", SqliteType.Text);
        var json = insert.Parameters.Add("$json", SqliteType.Blob);
        var project = insert.Parameters.Add("$project", SqliteType.Text);
        var file = insert.Parameters.Add("$file", SqliteType.Text);
        var failed = new Exception?[batch.Count];
        for (var i = 0; i < batch.Count; i++)
        {
            await savepoint.ExecuteNonQueryAsync();
            try
            {
                var header = batch[i].Header;
                tenant.Value = header.Tenant;
                id.Value = header.Id;
                created.Value = header.CreatedAt.UtcDateTime.ToString("O");
                title.Value = (object?)header.Title ?? DBNull.Value;
                verdict.Value = header.Verdict;
                json.Value = batch[i].Json;
                project.Value = (object?)header.ProjectId ?? DBNull.Value;
                file.Value = (object?)batch[i].JsonFile ?? DBNull.Value;
                await insert.ExecuteNonQueryAsync();
                await release.ExecuteNonQueryAsync();
            }
            catch (SqliteException exception)
            {
                failed[i] = exception;
                await rollback.ExecuteNonQueryAsync();
            }
        }
        await transaction.CommitAsync();
        afterCommit(batch.Sum(pending => (long)pending.Json.Length));
        for (var i = 0; i < batch.Count; i++)
        {
            if (failed[i] is { } exception)
                batch[i].Done.TrySetException(exception);
            else
                batch[i].Done.TrySetResult();
        }
    }

    private static SqliteCommand Command(SqliteConnection connection, SqliteTransaction transaction, string sql)
    {
        var command = connection.CreateCommand();
        command.Transaction = transaction;
        command.CommandText = sql;
        return command;
    }

    private sealed record Pending(ReportHeader Header, byte[] Json, string? JsonFile, TaskCompletionSource Done);
}
