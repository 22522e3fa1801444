using System.Diagnostics;
using System.Net;
using Npgsql;
using QaService.Api.Tests.Support;
using QaService.Tests.Shared;

namespace QaService.Api.Tests.Production;

/// <summary>
/// Real processes (<c>dotnet QaService.Api.dll</c>, the build beside this project): instances that start together on one
/// fresh PostgreSQL database all become ready; a bad setting ends the process with one line naming the key.
/// </summary>
public sealed class StartupProcessTests
{
    private static readonly TimeSpan ExitTimeout = TimeSpan.FromSeconds(90);

    [PostgresFact]
    public async Task Two_instances_started_at_the_same_moment_on_a_fresh_database_both_become_ready()
    {
        var database = $"qa_start_{Guid.NewGuid():N}";
        await using (var admin = NpgsqlDataSource.Create(PostgresFactAttribute.ConnectionString!))
            await admin.CreateCommand($"CREATE DATABASE {database}").ExecuteNonQueryAsync();
        var connection = new NpgsqlConnectionStringBuilder(PostgresFactAttribute.ConnectionString) { Database = database }.ConnectionString;
        var settings = new Dictionary<string, string>
        {
            ["Storage:Provider"] = "postgres", ["Storage:ConnectionString"] = connection, ["Demo:Enabled"] = "true", ["WarmUp:Enabled"] = "false",
        };
        // No schema, no demo yet: both instances create the schema and store the demo at once.
        var instances = new[] { ServiceProcess.Launch(settings), ServiceProcess.Launch(settings) };
        try
        {
            using var http = new HttpClient();
            await Task.WhenAll(instances.Select(instance => instance.WaitUntilReadyAsync()));
            foreach (var instance in instances)
            {
                Assert.False(instance.HasExited, instance.Log);
                Assert.Equal(HttpStatusCode.OK, (await http.GetAsync(new Uri(instance.BaseAddress, "v1/assessments/demo"))).StatusCode);
            }
            await using var source = NpgsqlDataSource.Create(connection);
            Assert.Equal(1L, await source.CreateCommand("SELECT COUNT(*) FROM reports WHERE id = 'demo'").ExecuteScalarAsync());
            Assert.Equal((long)Storage.PostgresSchema.Version, await source.CreateCommand("SELECT COUNT(*) FROM qaservice_schema").ExecuteScalarAsync());
        }
        finally
        {
            foreach (var instance in instances)
                await instance.DisposeAsync();
            NpgsqlConnection.ClearAllPools();
            await using var admin = NpgsqlDataSource.Create(PostgresFactAttribute.ConnectionString!);
            await admin.CreateCommand($"DROP DATABASE {database} WITH (FORCE)").ExecuteNonQueryAsync();
        }
    }

    [Theory]
    [InlineData("Auth:AdminToken", "too-short")]
    [InlineData("Storage:Provider", "oracle")]
    [InlineData("Storage:RetentionDays", "0")]
    [InlineData("Storage:RetentionDays", "week")]
    public async Task A_bad_setting_ends_the_process_with_one_line_naming_the_key(string key, string value)
    {
        var clock = Stopwatch.StartNew();
        await using var service = ServiceProcess.Launch(new Dictionary<string, string> { [key] = value, ["WarmUp:Enabled"] = "false" });
        Assert.True(await service.WaitForExitAsync(ExitTimeout), "the process kept running with a bad setting");
        var lines = service.Log.Split('\n').Where(line => line.Trim().Length > 0).ToList();
        Assert.True(lines.Count == 1, "expected one line, got:\n" + string.Join('\n', lines));
        Assert.Contains(key, lines[0]);
        Assert.StartsWith("QaService did not start: configuration error:", lines[0]);
        Assert.NotEqual(0, service.ExitCode);
        // "Within seconds": start-up of the runtime and configuration only (bounded generously for a loaded 2-core machine).
        Assert.True(clock.Elapsed < TimeSpan.FromSeconds(30), $"took {clock.Elapsed.TotalSeconds:0.0} s");
    }
}
