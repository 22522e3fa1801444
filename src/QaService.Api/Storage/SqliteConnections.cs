using Microsoft.Data.Sqlite;

namespace QaService.Api.Storage;

/// <summary>
/// Opens SQLite connections the way every store needs them. Durability: the database is in WAL mode
/// and each connection runs <c>synchronous = FULL</c>, so the WAL is fsynced at every commit and a
/// committed report survives a process kill and a power cut (SQLite "PRAGMA synchronous": in WAL mode
/// NORMAL may lose the last commits on power loss; FULL does not).
/// </summary>
internal static class SqliteConnections
{
    public static async Task<SqliteConnection> OpenAsync(string connectionString, CancellationToken cancellationToken)
    {
        var connection = new SqliteConnection(connectionString);
        await connection.OpenAsync(cancellationToken);
        await using var pragma = connection.CreateCommand();
        pragma.CommandText = "PRAGMA synchronous = FULL;";
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
