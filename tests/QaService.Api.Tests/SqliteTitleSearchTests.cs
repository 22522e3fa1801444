using Microsoft.Data.Sqlite;
using QaService.Api.Security;
using QaService.Api.Storage;
using QaService.Api.Tests.Support;

namespace QaService.Api.Tests;

/// <summary>
/// q= on SQLite goes by the trigram index when the text matches few titles and walks the listing index otherwise; both
/// must list exactly what LIKE lists (SQLite's LIKE folds ASCII case only: https://sqlite.org/lang_expr.html#like).
/// </summary>
public sealed class SqliteTitleSearchTests
{
    private static readonly DateTimeOffset T0 = new(2026, 4, 1, 8, 0, 0, TimeSpan.Zero);

    /// <summary>Rows straight into the table in one transaction (the triggers index them as any insert).</summary>
    private static void Insert(QaServiceFactory factory, IEnumerable<(string Tenant, string Id, int Minute, string? Title)> rows)
    {
        using var connection = new SqliteConnection($"Data Source={factory.DatabasePath};Pooling=False");
        connection.Open();
        using var transaction = connection.BeginTransaction();
        using var command = connection.CreateCommand();
        command.CommandText = "INSERT INTO reports (tenant, id, created_at, title, verdict, json) VALUES ($t, $id, $at, $title, 'pass', '{}')";
        var (t, id, at, title) = (command.Parameters.Add("$t", SqliteType.Text), command.Parameters.Add("$id", SqliteType.Text),
            command.Parameters.Add("$at", SqliteType.Text), command.Parameters.Add("$title", SqliteType.Text));
        foreach (var row in rows)
        {
            (t.Value, id.Value, at.Value, title.Value) = (row.Tenant, row.Id, T0.AddMinutes(row.Minute).UtcDateTime.ToString("O"), (object?)row.Title ?? DBNull.Value);
            command.ExecuteNonQuery();
        }
        transaction.Commit();
    }

    private static async Task<List<string>> AllIdsAsync(HttpClient client, string q)
    {
        var ids = new List<string>();
        string? cursor = null;
        do
        {
            var (items, next) = await ListingScenarios.PageAsync(client, $"/v1/assessments?limit=100&q={Uri.EscapeDataString(q)}" + (cursor is null ? "" : $"&cursor={Uri.EscapeDataString(cursor)}"));
            ids.AddRange(items);
            cursor = next;
        }
        while (cursor is not null);
        return ids;
    }

    [Fact]
    public async Task Both_paths_list_exactly_the_LIKE_matches_of_the_tenant_newest_first()
    {
        using var factory = new QaServiceFactory();
        var client = factory.CreateClient();
        Assert.Empty(await AllIdsAsync(client, "warm")); // starts the service, so the schema exists

        // More titles with "pump" than the candidate limit (the walk), a few with rarer text (the index), quotes,
        // non-ASCII letters in both cases, a title-less report, and the same titles in another tenant.
        var rows = new List<(string, string, int, string?)>();
        for (var i = 0; i < SqliteReportStore.TitleCandidatesLimit + 150; i++)
            rows.Add((Tenants.Local, $"p{i:D5}", i, $"Pump station {i} check"));
        rows.Add((Tenants.Local, "q1", 5_000, "Valve \"north\" loop"));
        rows.Add((Tenants.Local, "q2", 5_001, "ÄRGER Straße hydrants"));
        rows.Add((Tenants.Local, "q3", 5_002, "ärger strasse hydrants"));
        rows.Add((Tenants.Local, "q4", 5_003, null));
        rows.Add(("other-tenant", "o1", 5_004, "Valve \"north\" loop"));
        Insert(factory, rows);

        var titles = rows.Where(r => r.Item1 == Tenants.Local).OrderByDescending(r => r.Item3).ToList();
        List<string> Expected(string q) => titles.Where(r => r.Item4 is { } title && LikeContains(title, q)).Select(r => r.Item2).ToList();
        foreach (var q in new[] { "pump", "PUMP STATION 1", "station 2149 ch", "n 7", "\"north\"", "valve \"NORTH\" LOOP", "ärger", "ÄRGER", "Straße", "hy", "e", "no such title" })
            Assert.Equal(Expected(q), await AllIdsAsync(client, q));
    }

    /// <summary>LIKE '%q%' as SQLite evaluates it: ordinal, with ASCII letters folded.</summary>
    private static bool LikeContains(string title, string q)
    {
        static string FoldAscii(string s) => string.Concat(s.Select(c => c is >= 'A' and <= 'Z' ? (char)(c + ('a' - 'A')) : c));
        return FoldAscii(title).Contains(FoldAscii(q), StringComparison.Ordinal);
    }

    [Fact]
    public async Task New_and_deleted_reports_and_rowids_given_again_keep_the_index_right_and_an_older_database_is_indexed_at_start()
    {
        var path = Path.Combine(Path.GetTempPath(), $"qaservice-titles-{Guid.NewGuid():N}.db");
        using (var first = new QaServiceFactory(path))
        {
            var client = first.CreateClient();
            Assert.Empty(await AllIdsAsync(client, "warm"));
            Insert(first, [(Tenants.Local, "keep", 1, "Larch Lane hydrants"), (Tenants.Local, "gone", 2, "Larch Lane valves")]);
            Assert.Equal(["gone", "keep"], await AllIdsAsync(client, "larch lane"));
            Assert.Equal(System.Net.HttpStatusCode.NoContent, (await client.DeleteAsync("/v1/assessments/gone")).StatusCode);
            Assert.Equal(["keep"], await AllIdsAsync(client, "larch lane"));
            Assert.Empty(await AllIdsAsync(client, "valves"));
        }

        // Rowids handed out again after the newest rows go (SQLite gives max(rowid) + 1): deleting the indexed mark's row,
        // then a row below it, then the mark's row again, each followed by a new report that must be found.
        using (var third = new QaServiceFactory(path))
        {
            var client = third.CreateClient();
            Assert.Equal(["keep"], await AllIdsAsync(client, "larch lane"));
            Insert(third, [(Tenants.Local, "n1", 10, "Larch Lane n1"), (Tenants.Local, "n2", 11, "Larch Lane n2"), (Tenants.Local, "n3", 12, "Larch Lane n3")]);
            Assert.Equal(["n3", "n2", "n1", "keep"], await AllIdsAsync(client, "larch lane"));
            Assert.Equal(System.Net.HttpStatusCode.NoContent, (await client.DeleteAsync("/v1/assessments/n2")).StatusCode);
            Assert.Equal(System.Net.HttpStatusCode.NoContent, (await client.DeleteAsync("/v1/assessments/n3")).StatusCode);
            Insert(third, [(Tenants.Local, "n4", 13, "Larch Lane n4")]);
            Assert.Equal(["n4", "n1", "keep"], await AllIdsAsync(client, "larch lane"));
            Assert.Equal(System.Net.HttpStatusCode.NoContent, (await client.DeleteAsync("/v1/assessments/n4")).StatusCode);
            Insert(third, [(Tenants.Local, "n5", 14, "Larch Lane n5")]);
            Assert.Equal(System.Net.HttpStatusCode.NoContent, (await client.DeleteAsync("/v1/assessments/n5")).StatusCode);
            Insert(third, [(Tenants.Local, "n6", 15, "Larch Lane n6")]);
            Assert.Equal(["n6", "n1", "keep"], await AllIdsAsync(client, "larch lane"));
            Assert.Empty(await AllIdsAsync(client, "lane n4"));
        }

        // A database from before the index (schema version 9) with a report in it.
        using (var connection = new SqliteConnection($"Data Source={path};Pooling=False"))
        {
            connection.Open();
            using var command = connection.CreateCommand();
            command.CommandText = "DROP TRIGGER report_titles_delete; DROP TRIGGER report_titles_update; DROP TABLE report_titles; DROP TABLE report_titles_state; PRAGMA user_version = 9;"
                + $"INSERT INTO reports (tenant, id, created_at, title, verdict, json) VALUES ('{Tenants.Local}', 'old', '{T0.UtcDateTime:O}', 'Larch Lane poles', 'pass', '{{}}');";
            command.ExecuteNonQuery();
        }
        using var second = new QaServiceFactory(path);
        var again = second.CreateClient();
        Assert.Equal(["n6", "n1", "keep", "old"], await AllIdsAsync(again, "larch lane"));
        Assert.Equal(["old"], await AllIdsAsync(again, "lane poles"));
    }
}
