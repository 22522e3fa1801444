using Microsoft.Data.Sqlite;

namespace QaService.Api.Storage;

/// <summary>
/// The SQLite schema as numbered migrations; the applied number is kept in <c>PRAGMA user_version</c>.
/// A migration is never edited once released: add the next one.
/// </summary>
internal static class SqliteSchema
{
    private static readonly string[] Migrations =
    [
        // 1: reports, keyed by tenant and id (IF NOT EXISTS: files made before versioning already have it).
        """
        CREATE TABLE IF NOT EXISTS reports (
            tenant     TEXT NOT NULL,
            id         TEXT NOT NULL,
            created_at TEXT NOT NULL,
            title      TEXT,
            verdict    TEXT NOT NULL,
            json       TEXT NOT NULL,
            PRIMARY KEY (tenant, id)
        );
        """,
        // 2: tenants and the SHA-256 of their keys.
        """
        CREATE TABLE tenants (
            id         TEXT NOT NULL PRIMARY KEY,
            name       TEXT NOT NULL UNIQUE,
            key_hash   TEXT NOT NULL UNIQUE,
            created_at TEXT NOT NULL
        );
        """,
        // 3: files staged by the guided upload between preview and run (tenant-scoped, keyed by the SHA-256 of an
        // unguessable token, removed when run or expired; times are Unix milliseconds, UTC).
        """
        CREATE TABLE staged_uploads (
            token_hash    TEXT    NOT NULL PRIMARY KEY,
            tenant        TEXT    NOT NULL,
            created_ms    INTEGER NOT NULL,
            expires_ms    INTEGER NOT NULL,
            settings      TEXT,
            marks_name    TEXT,
            marks         BLOB,
            fixes_name    TEXT,
            fixes         BLOB
        );
        CREATE INDEX staged_uploads_expiry ON staged_uploads (expires_ms);
        """,
    ];

    public static async Task MigrateAsync(SqliteConnection connection, CancellationToken cancellationToken)
    {
        await using (var wal = connection.CreateCommand())
        {
            wal.CommandText = "PRAGMA journal_mode = WAL;";
            await wal.ExecuteNonQueryAsync(cancellationToken);
        }
        // BEGIN IMMEDIATE takes the write lock first, so two processes starting together migrate one after the other.
        await using var transaction = connection.BeginTransaction(deferred: false);
        await using var version = connection.CreateCommand();
        version.Transaction = transaction;
        version.CommandText = "PRAGMA user_version;";
        var applied = Convert.ToInt32(await version.ExecuteScalarAsync(cancellationToken), System.Globalization.CultureInfo.InvariantCulture);
        for (var next = applied; next < Migrations.Length; next++)
        {
            await using var step = connection.CreateCommand();
            step.Transaction = transaction;
            step.CommandText = Migrations[next] + $"PRAGMA user_version = {next + 1};";
            await step.ExecuteNonQueryAsync(cancellationToken);
        }
        await transaction.CommitAsync(cancellationToken);
    }
}
