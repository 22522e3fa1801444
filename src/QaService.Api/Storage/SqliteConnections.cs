using Microsoft.Data.Sqlite;

namespace QaService.Api.Storage;

/// <summary>
/// Opens SQLite connections the way every store needs them. Durability: the database is in WAL mode
/// and each connection runs <c>synchronous = FULL</c>, so the WAL is fsynced at every commit and a
/// committed report survives a process kill and a power cut (SQLite "PRAGMA synchronous": in WAL mode
/// NORMAL may lose the last commits on power loss; FULL does not). No connection checkpoints on its own
/// (<c>wal_autocheckpoint = 0</c>): SQLite would do it inside whichever commit crossed the threshold, making that
/// request wait for the copy of every page written since; <see cref="SqliteBackgroundCheckpoint"/> does it after
/// commits, off the request path. After a checkpoint the WAL file is cut back to <see cref="WalSizeLimitBytes"/>.
/// </summary>
internal static class SqliteConnections
{
    /// <summary>Size the WAL file is truncated to when it restarts (https://sqlite.org/pragma.html#pragma_journal_size_limit).</summary>
    public const long WalSizeLimitBytes = 64L * 1024 * 1024;

    public static async Task<SqliteConnection> OpenAsync(string connectionString, CancellationToken cancellationToken)
    {
        var connection = new SqliteConnection(connectionString);
        await connection.OpenAsync(cancellationToken);
        await using var pragma = connection.CreateCommand();
        pragma.CommandText = $"PRAGMA synchronous = FULL; PRAGMA wal_autocheckpoint = 0; PRAGMA journal_size_limit = {WalSizeLimitBytes};";
        await pragma.ExecuteNonQueryAsync(cancellationToken);
        return connection;
    }

    /// <summary>Creates the folder of a file database, so a first run needs no set-up.</summary>
    public static void EnsureFolder(string connectionString)
    {
        var builder = new SqliteConnectionStringBuilder(connectionString);
        if (builder.Mode == SqliteOpenMode.Memory || string.IsNullOrEmpty(builder.DataSource))
            return;
        var folder = Path.GetDirectoryName(Path.GetFullPath(builder.DataSource));
        if (!string.IsNullOrEmpty(folder))
            Directory.CreateDirectory(folder);
    }
}
