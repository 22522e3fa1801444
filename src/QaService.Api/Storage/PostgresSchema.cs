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
        // 3: the keyset listing (GET /v1/assessments): newest first within a tenant, id breaking ties; verdict and title
        // included so a filtered list can be an index-only scan.
        """
        CREATE INDEX reports_tenant_created ON reports (tenant, created_at DESC, id DESC) INCLUDE (verdict, title);
        """,
        // 4: a trigram index for q= (title ILIKE '%text%'), so a search matching few of many reports does not scan the
        // tenant (pg_trgm, PostgreSQL 15 manual F.35; a trusted extension: a database owner may create it). Where the
        // extension is not installed and may not be created, the search still works, by scanning.
        """
        DO $$
        DECLARE trgm_schema name;
        BEGIN
            IF NOT EXISTS (SELECT 1 FROM pg_extension WHERE extname = 'pg_trgm')
               AND EXISTS (SELECT 1 FROM pg_available_extensions WHERE name = 'pg_trgm') THEN
                BEGIN
                    CREATE EXTENSION pg_trgm;
                EXCEPTION WHEN insufficient_privilege THEN
                    RAISE NOTICE 'pg_trgm could not be created; title searches will scan';
                END;
            END IF;
            SELECT n.nspname INTO trgm_schema FROM pg_extension e JOIN pg_namespace n ON n.oid = e.extnamespace WHERE e.extname = 'pg_trgm';
            IF trgm_schema IS NOT NULL THEN
                EXECUTE format('CREATE INDEX reports_title_trigram ON reports USING gin (title %I.gin_trgm_ops)', trgm_schema);
            END IF;
        END
        $$;
        """,
        // 5: share links (only the SHA-256 of a link's token is kept) and service-wide secrets (the share-link HMAC key, the Data Protection key ring).
        """
        CREATE TABLE share_links (
            id         text        NOT NULL PRIMARY KEY,
            token_hash text        NOT NULL UNIQUE,
            tenant     text        NOT NULL,
            report_id  text        NOT NULL,
            created_at timestamptz NOT NULL,
            expires_at timestamptz NOT NULL
        );
        CREATE INDEX share_links_report ON share_links (tenant, report_id);
        CREATE TABLE service_secrets (
            name  text NOT NULL PRIMARY KEY,
            value text NOT NULL
        );
        """,
        // 6: files staged by the guided upload between preview and run (tenant-scoped, keyed by the SHA-256 of an
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
        // 7: projects (a contract's spec, kept as the JSON sent); a report may be a delivery of one.
        """
        CREATE TABLE projects (
            tenant     text        NOT NULL,
            id         text        NOT NULL,
            name       text        NOT NULL,
            created_at timestamptz NOT NULL,
            spec       text        NOT NULL,
            PRIMARY KEY (tenant, id)
        );
        ALTER TABLE reports ADD COLUMN project_id text,
            ADD CONSTRAINT reports_project_fk FOREIGN KEY (tenant, project_id) REFERENCES projects (tenant, id);
        CREATE INDEX reports_by_project ON reports (tenant, project_id, created_at) WHERE project_id IS NOT NULL;
        """,
        // 8: sign-off decisions, append-only (no UPDATE); they go with their report (ON DELETE CASCADE).
        """
        CREATE TABLE decisions (
            seq           bigint GENERATED ALWAYS AS IDENTITY PRIMARY KEY,
            tenant        text        NOT NULL,
            report_id     text        NOT NULL,
            decision      text        NOT NULL CHECK (decision IN ('accepted', 'rejected')),
            decided_by    text        NOT NULL,
            comment       text,
            decided_at    timestamptz NOT NULL,
            report_sha256 text        NOT NULL,
            FOREIGN KEY (tenant, report_id) REFERENCES reports (tenant, id) ON DELETE CASCADE
        );
        CREATE INDEX decisions_by_report ON decisions (tenant, report_id, seq);
        CREATE FUNCTION decisions_append_only() RETURNS trigger LANGUAGE plpgsql AS $$
        BEGIN
            RAISE EXCEPTION 'decisions are append-only';
        END;
        $$;
        CREATE TRIGGER decisions_no_update BEFORE UPDATE ON decisions FOR EACH ROW EXECUTE FUNCTION decisions_append_only();
        """,
    ];

    /// <summary>The schema version this build migrates to (the number of migrations).</summary>
    public static int Version => Migrations.Length;

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
