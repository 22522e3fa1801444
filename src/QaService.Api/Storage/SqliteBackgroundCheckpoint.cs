using Microsoft.Data.Sqlite;

namespace QaService.Api.Storage;

/// <summary>
/// Runs a PASSIVE WAL checkpoint off the request path (https://sqlite.org/c3ref/wal_checkpoint_v2.html): it copies
/// committed pages into the database without blocking readers or writers. Requests arriving while one runs are
/// coalesced into one more run. It runs once <see cref="ThresholdBytes"/> have been committed since the last run, so a stream of small
/// reports does not pay a checkpoint (and its fsync) per commit. Nothing is lost if it never runs: committed data is
/// in the WAL (fsynced at commit), which the next run or the last connection closing copies.
/// </summary>
internal sealed class SqliteBackgroundCheckpoint(string connectionString)
{
    /// <summary>
    /// Bytes committed that start a checkpoint. Measured under a stream of 24-point assessments (~14 kB reports, ~2,000
    /// a second, 2 shared cores): with 4 MB the requests' p99 was 60–200 ms, with 0.5, 1, 16 and 32 MB 28–38 ms; 16 MB
    /// also means few fsyncs of the database file (a run every ~8 s at that rate, each under ~0.1 s, off the request path).
    /// </summary>
    public const long ThresholdBytes = 16L * 1024 * 1024;

    private long pendingBytes;
    private int running, askedAgain;

    /// <summary>Counts a commit of about <paramref name="bytes"/>; past the threshold, starts (or queues) a checkpoint.</summary>
    public void Committed(long bytes)
    {
        if (Interlocked.Add(ref pendingBytes, bytes) < ThresholdBytes)
            return;
        Interlocked.Exchange(ref pendingBytes, 0);
        Request();
    }

    private void Request()
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
