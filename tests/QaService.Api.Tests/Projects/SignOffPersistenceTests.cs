using System.Data.Common;
using System.Globalization;
using System.Net;
using Microsoft.Data.Sqlite;
using Npgsql;
using System.Security.Cryptography;
using System.Text.Json;
using QaService.Api.Tests.Support;

namespace QaService.Api.Tests.Projects;

/// <summary>Projects, their deliveries and decisions survive a restart on both stores (SQLite file; PostgreSQL when QASERVICE_TEST_POSTGRES is set).</summary>
public sealed class SignOffPersistenceTests
{
    [Fact]
    public async Task Sqlite_keeps_projects_and_decisions_across_a_restart()
    {
        var path = Path.Combine(Path.GetTempPath(), $"qaservice-signoff-{Guid.NewGuid():N}.db");
        try
        {
            await RoundTripAsync(() => new QaServiceFactory(path));
        }
        finally
        {
            foreach (var file in Directory.GetFiles(Path.GetTempPath(), Path.GetFileName(path) + "*"))
                File.Delete(file);
        }
    }

    [PostgresFact]
    public async Task Postgres_keeps_projects_and_decisions_across_a_restart() =>
        await RoundTripAsync(() => new QaServiceFactory(extra: PostgresFactAttribute.Settings()));

    [Fact]
    public async Task Sqlite_decisions_go_with_their_report_and_are_never_updated()
    {
        var path = Path.Combine(Path.GetTempPath(), $"qaservice-cascade-{Guid.NewGuid():N}.db");
        try
        {
            string report;
            using (var host = new QaServiceFactory(path))
                report = await DecideAsync(host.CreateClient());
            await using var connection = new SqliteConnection($"Data Source={path};Pooling=False");
            await connection.OpenAsync();
            await AssertAppendOnlyAndCascadeAsync(connection, report, "$report", (command, name, value) => command.Parameters.Add(new SqliteParameter(name, value)));
        }
        finally
        {
            SqliteConnection.ClearAllPools();
            foreach (var file in Directory.GetFiles(Path.GetTempPath(), Path.GetFileName(path) + "*"))
                File.Delete(file);
        }
    }

    [PostgresFact]
    public async Task Postgres_decisions_go_with_their_report_and_are_never_updated()
    {
        string report;
        using (var host = new QaServiceFactory(extra: PostgresFactAttribute.Settings()))
            report = await DecideAsync(host.CreateClient());
        await using var source = NpgsqlDataSource.Create(PostgresFactAttribute.ConnectionString!);
        await using var connection = await source.OpenConnectionAsync();
        await AssertAppendOnlyAndCascadeAsync(connection, report, "@report", (command, name, value) => command.Parameters.Add(new NpgsqlParameter(name[1..], value)));
    }

    private static async Task<string> DecideAsync(HttpClient client)
    {
        var (report, _) = await client.AssessAsync(Requests.Minimal());
        Assert.Equal(HttpStatusCode.Created, (await client.PostDecisionAsync(report, new { decision = "accepted", by = "A. Lund" })).StatusCode);
        return report;
    }

    /// <summary>The schema itself refuses to rewrite a decision, and deleting the report (as DELETE /v1/assessments/{id} will) removes its decisions.</summary>
    private static async Task AssertAppendOnlyAndCascadeAsync(DbConnection connection, string report, string parameter, Action<DbCommand, string, string> bind)
    {
        async Task<object?> RunAsync(string sql, bool scalar)
        {
            await using var command = connection.CreateCommand();
            command.CommandText = sql.Replace("@report", parameter, StringComparison.Ordinal);
            bind(command, parameter, report);
            return scalar ? await command.ExecuteScalarAsync() : await command.ExecuteNonQueryAsync();
        }

        Assert.Equal(1L, Convert.ToInt64(await RunAsync("SELECT COUNT(*) FROM decisions WHERE report_id = @report", scalar: true), CultureInfo.InvariantCulture));
        var refused = await Assert.ThrowsAnyAsync<DbException>(() => RunAsync("UPDATE decisions SET decision = 'rejected' WHERE report_id = @report", scalar: false));
        Assert.Contains("append-only", refused.Message);
        await RunAsync("DELETE FROM reports WHERE id = @report", scalar: false);
        Assert.Equal(0L, Convert.ToInt64(await RunAsync("SELECT COUNT(*) FROM decisions WHERE report_id = @report", scalar: true), CultureInfo.InvariantCulture));
    }

    private static async Task RoundTripAsync(Func<QaServiceFactory> start)
    {
        string project, report, firstDetail, firstDecisions;
        byte[] created;
        using (var first = start())
        {
            var client = first.CreateClient();
            project = await client.CreateProjectAsync("Lowbridge hydrants", """{ "standard": "nssda", "horizontal": 0.5 }""");
            var request = Requests.Minimal();
            request.Remove("spec");
            request["projectId"] = project;
            (report, created) = await client.AssessAsync(request);
            Assert.Equal(HttpStatusCode.Created, (await client.PostDecisionAsync(report, new { decision = "rejected", by = "first look" })).StatusCode);
            Assert.Equal(HttpStatusCode.Created, (await client.PostDecisionAsync(report, new { decision = "accepted", by = "after field check", comment = "re-observed" })).StatusCode);
            firstDetail = await client.GetStringAsync($"/v1/projects/{project}");
            firstDecisions = await client.GetStringAsync($"/v1/assessments/{report}/decisions");
        }

        using var second = start();
        var again = second.CreateClient();
        Assert.Equal(firstDetail, await again.GetStringAsync($"/v1/projects/{project}"));
        Assert.Equal(firstDecisions, await again.GetStringAsync($"/v1/assessments/{report}/decisions"));
        var detail = JsonDocument.Parse(firstDetail).RootElement;
        var delivery = detail.GetProperty("assessments").EnumerateArray().Single();
        Assert.Equal(report, delivery.GetProperty("id").GetString());
        Assert.Equal("accepted", delivery.GetProperty("acceptance").GetString());
        Assert.Equal("after field check", delivery.GetProperty("decision").GetProperty("by").GetString());
        var decisions = JsonDocument.Parse(firstDecisions).RootElement.GetProperty("decisions");
        Assert.Equal(2, decisions.GetArrayLength());
        Assert.All(decisions.EnumerateArray(), d => Assert.Equal(Convert.ToHexStringLower(SHA256.HashData(created)), d.GetProperty("reportSha256").GetString()));
        Assert.Contains(JsonDocument.Parse(await again.GetStringAsync("/v1/projects")).RootElement.GetProperty("projects").EnumerateArray(),
            p => p.GetProperty("id").GetString() == project);
    }
}
