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
        // 3: the keyset listing (GET /v1/assessments): newest first within a tenant, id breaking ties; verdict and title
        // ride along so a filtered list (q=, verdict=) is answered from the index without a row lookup per report.
        """
        CREATE INDEX reports_tenant_created ON reports (tenant, created_at DESC, id DESC, verdict, title);
        """,
        // 4: share links (only the SHA-256 of a link's token is kept) and service-wide secrets (the share-link HMAC key, the Data Protection key ring).
        """
        CREATE TABLE share_links (
            id         TEXT NOT NULL PRIMARY KEY,
            token_hash TEXT NOT NULL UNIQUE,
            tenant     TEXT NOT NULL,
            report_id  TEXT NOT NULL,
            created_at TEXT NOT NULL,
            expires_at TEXT NOT NULL
        );
        CREATE INDEX share_links_report ON share_links (tenant, report_id);
        CREATE TABLE service_secrets (
            name  TEXT NOT NULL PRIMARY KEY,
            value TEXT NOT NULL
        );
        """,
        // 5: files staged by the guided upload between preview and run (tenant-scoped, keyed by the SHA-256 of an
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
        // 6: projects (a contract's spec, kept as the JSON sent); a report may be a delivery of one.
        """
        CREATE TABLE projects (
            tenant     TEXT NOT NULL,
            id         TEXT NOT NULL,
            name       TEXT NOT NULL,
            created_at TEXT NOT NULL,
            spec       TEXT NOT NULL,
            PRIMARY KEY (tenant, id)
        );
        -- SQLite cannot add the composite key (tenant, project_id) to an existing table; the service checks it on write.
        ALTER TABLE reports ADD COLUMN project_id TEXT;
        CREATE INDEX reports_by_project ON reports (tenant, project_id, created_at) WHERE project_id IS NOT NULL;
        """,
        // 7: sign-off decisions, append-only; they go with their report (the trigger does it even with foreign_keys off).
        """
        CREATE TABLE decisions (
            seq           INTEGER PRIMARY KEY AUTOINCREMENT,
            tenant        TEXT NOT NULL,
            report_id     TEXT NOT NULL,
            decision      TEXT NOT NULL CHECK (decision IN ('accepted', 'rejected')),
            decided_by    TEXT NOT NULL,
            comment       TEXT,
            decided_at    TEXT NOT NULL,
            report_sha256 TEXT NOT NULL,
            FOREIGN KEY (tenant, report_id) REFERENCES reports (tenant, id) ON DELETE CASCADE
        );
        CREATE INDEX decisions_by_report ON decisions (tenant, report_id, seq);
        CREATE TRIGGER decisions_follow_report AFTER DELETE ON reports
        BEGIN
            DELETE FROM decisions WHERE tenant = old.tenant AND report_id = old.id;
        END;
        CREATE TRIGGER decisions_append_only BEFORE UPDATE ON decisions
        BEGIN
            SELECT RAISE(ABORT, 'decisions are append-only');
        END;
        """,
        // 8: reports above the group-commit size live as files beside the database (SqliteReportFiles); the row names its
        // file and keeps an empty json.
        """
        ALTER TABLE reports ADD COLUMN json_file TEXT;
        """,
        // 9: a project's deliveries from the index alone. With migration 6's index (no id, so ORDER BY created_at, id needed
        // a sort) the planner walked the tenant's whole listing index instead and read every report row's project_id, which
        // sits after the JSON: the overflow pages of every report of the tenant, on every project read (bench/project.sh).
        """
        DROP INDEX reports_by_project;
        CREATE INDEX reports_by_project ON reports (tenant, project_id, created_at, id, verdict, title) WHERE project_id IS NOT NULL;
        """,
        // 10: a trigram index of the titles for q= (SqliteReportStore.TitleCandidatesAsync), so a search matching few of
        // many reports does not read the tenant's whole listing index (bench/listing.sh). External content keyed by the
        // reports' rowid (https://sqlite.org/fts5.html §4.4.3 "External Content Tables", §4.3.5 trigram). New reports are
        // indexed by the next search, not by an insert trigger (that cost ~45 µs a report on the write path), up to
        // report_titles_state.indexed_through; a delete at or below that mark removes its entry, and deleting the mark's
        // own row lowers the mark to the highest row below it, so a rowid SQLite hands out again is indexed again.
        // The service never runs VACUUM, which may renumber such rowids; after a manual one, run the 'rebuild' below.
        """
        CREATE VIRTUAL TABLE report_titles USING fts5(title, content='reports', content_rowid='rowid', tokenize='trigram');
        INSERT INTO report_titles (report_titles) VALUES ('rebuild');
        CREATE TABLE report_titles_state (indexed_through INTEGER NOT NULL);
        INSERT INTO report_titles_state (indexed_through) SELECT coalesce(max(rowid), 0) FROM reports;
        CREATE TRIGGER report_titles_delete AFTER DELETE ON reports
        WHEN old.rowid <= (SELECT indexed_through FROM report_titles_state)
        BEGIN
            INSERT INTO report_titles (report_titles, rowid, title) VALUES ('delete', old.rowid, old.title);
            UPDATE report_titles_state SET indexed_through = (SELECT coalesce(max(rowid), 0) FROM reports WHERE rowid < old.rowid)
            WHERE indexed_through = old.rowid;
        END;
        CREATE TRIGGER report_titles_update AFTER UPDATE OF title ON reports
        WHEN old.rowid <= (SELECT indexed_through FROM report_titles_state)
        BEGIN
            INSERT INTO report_titles (report_titles, rowid, title) VALUES ('delete', old.rowid, old.title);
            INSERT INTO report_titles (rowid, title) VALUES (new.rowid, new.title);
        END;
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
