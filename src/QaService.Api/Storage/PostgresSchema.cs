using Npgsql;

namespace QaService.Api.Storage;

/// <summary>
/// The PostgreSQL schema as numbered migrations, recorded in <c>qaservice_schema</c>. Instances that
/// start together serialise on a transaction-scoped advisory lock, so each migration runs exactly once.
/// A migration is never edited once released: add the next one.
/// </summary>
internal static class PostgresSchema
{
    /// <summary>Advisory lock key for migrations: any fixed 64-bit number unique to this service ("QaSv" in ASCII).</summary>
    private const long MigrationLockKey = 0x5161_5376;

    private static readonly string[] Migrations =
    [
        // 1: reports, stored as the exact JSON returned (text, not jsonb, so the bytes are kept).
        """
        CREATE TABLE reports (
            tenant     text        NOT NULL,
            id         text        NOT NULL,
            created_at timestamptz NOT NULL,
            title      text,
            verdict    text        NOT NULL,
            json       text        NOT NULL,
            PRIMARY KEY (tenant, id)
        );
        """,
        // 2: tenants and the SHA-256 of their keys.
        """
        CREATE TABLE tenants (
            id         text        NOT NULL PRIMARY KEY,
            name       text        NOT NULL UNIQUE,
            key_hash   text        NOT NULL UNIQUE,
            created_at timestamptz NOT NULL
        );
        """,
        // 3: files staged by the guided upload between preview and run (tenant-scoped, keyed by the SHA-256 of an
        // unguessable token, removed when run or expired), so any instance can serve the next step.
        """
        CREATE TABLE staged_uploads (
            token_hash text        NOT NULL PRIMARY KEY,
            tenant     text        NOT NULL,
            created_at timestamptz NOT NULL,
            expires_at timestamptz NOT NULL,
            settings   text,
            marks_name text,
            marks      bytea,
            fixes_name text,
            fixes      bytea
        );
        CREATE INDEX staged_uploads_expiry ON staged_uploads (expires_at);
        """,
    ];

    /// <summary>How many migrations this build knows (the latest version).</summary>
    internal static int Count => Migrations.Length;

    public static async Task MigrateAsync(NpgsqlDataSource dataSource, CancellationToken cancellationToken)
    {
        await using var connection = await dataSource.OpenConnectionAsync(cancellationToken);
        await using var transaction = await connection.BeginTransactionAsync(cancellationToken);
        await ExecuteAsync(connection, transaction, $"SELECT pg_advisory_xact_lock({MigrationLockKey});", cancellationToken);
        await ExecuteAsync(connection, transaction, "CREATE TABLE IF NOT EXISTS qaservice_schema (version integer PRIMARY KEY, applied_at timestamptz NOT NULL DEFAULT now());", cancellationToken);

        await using var read = new NpgsqlCommand("SELECT COALESCE(MAX(version), 0) FROM qaservice_schema;", connection, transaction);
        var applied = (int)(await read.ExecuteScalarAsync(cancellationToken))!;
        for (var next = applied; next < Migrations.Length; next++)
        {
            await ExecuteAsync(connection, transaction, Migrations[next], cancellationToken);
            await ExecuteAsync(connection, transaction, $"INSERT INTO qaservice_schema (version) VALUES ({next + 1});", cancellationToken);
        }
        await transaction.CommitAsync(cancellationToken);
    }

    private static async Task ExecuteAsync(NpgsqlConnection connection, NpgsqlTransaction transaction, string sql, CancellationToken cancellationToken)
    {
        await using var command = new NpgsqlCommand(sql, connection, transaction);
        await command.ExecuteNonQueryAsync(cancellationToken);
    }
}
