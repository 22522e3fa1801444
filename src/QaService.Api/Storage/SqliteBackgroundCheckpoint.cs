using Microsoft.Data.Sqlite;

namespace QaService.Api.Storage;

/// <summary>
/// Runs a PASSIVE WAL checkpoint off the request path (https://sqlite.org/c3ref/wal_checkpoint_v2.html): it copies
/// committed pages into the database without blocking readers or writers. Requests arriving while one runs are
/// coalesced into one more run. Nothing is lost if it never runs: committed data is in the WAL, which SQLite
/// checkpoints on its own later (the next automatic checkpoint, or the last connection closing).
/// </summary>
internal sealed class SqliteBackgroundCheckpoint(string connectionString)
{
    private int running, askedAgain;

    public void Request()
    {
        Volatile.Write(ref askedAgain, 1);
        if (Interlocked.CompareExchange(ref running, 1, 0) == 0)
            _ = Task.Run(RunAsync);
    }

    private async Task RunAsync()
    {
        do
        {
            Volatile.Write(ref askedAgain, 0);
            await CheckpointAsync();
            Volatile.Write(ref running, 0);
        }
        // Asked again during the run, and no other run started since (exactly one of us wins the exchange): once more.
        while (Volatile.Read(ref askedAgain) == 1 && Interlocked.CompareExchange(ref running, 1, 0) == 0);
    }

    private async Task CheckpointAsync()
    {
        try
        {
            await using var connection = await SqliteConnections.OpenAsync(connectionString, CancellationToken.None);
            await using var command = connection.CreateCommand();
            command.CommandText = "PRAGMA wal_checkpoint(PASSIVE);";
            await command.ExecuteNonQueryAsync();
        }
        catch (SqliteException)
        {
            // A busy or vanished file: the WAL keeps the data and a later checkpoint copies it.
        }
    }
}
