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
        var failed = new Exception?[batch.Count];
        for (var i = 0; i < batch.Count; i++)
        {
            await Execute(connection, transaction, "SAVEPOINT report");
            try
            {
                await using var command = connection.CreateCommand();
                command.Transaction = transaction;
                command.CommandText = "INSERT INTO reports (tenant, id, created_at, title, verdict, json, project_id, json_file) VALUES ($tenant, $id, $created, $title, $verdict, CAST($json AS TEXT), $project, $file)";
                var header = batch[i].Header;
                command.Parameters.AddWithValue("$tenant", header.Tenant);
                command.Parameters.AddWithValue("$id", header.Id);
                command.Parameters.AddWithValue("$created", header.CreatedAt.UtcDateTime.ToString("O"));
                command.Parameters.AddWithValue("$title", (object?)header.Title ?? DBNull.Value);
                command.Parameters.AddWithValue("$verdict", header.Verdict);
                command.Parameters.AddWithValue("$json", batch[i].Json);
                command.Parameters.AddWithValue("$project", (object?)header.ProjectId ?? DBNull.Value);
                command.Parameters.AddWithValue("$file", (object?)batch[i].JsonFile ?? DBNull.Value);
                await command.ExecuteNonQueryAsync();
                await Execute(connection, transaction, "RELEASE report");
            }
            catch (SqliteException exception)
            {
                failed[i] = exception;
                await Execute(connection, transaction, "ROLLBACK TO report; RELEASE report");
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

    private static async Task Execute(SqliteConnection connection, SqliteTransaction transaction, string sql)
    {
        await using var command = connection.CreateCommand();
        command.Transaction = transaction;
        command.CommandText = sql;
        await command.ExecuteNonQueryAsync();
    }

    private sealed record Pending(ReportHeader Header, byte[] Json, string? JsonFile, TaskCompletionSource Done);
}
