using System.Net;
using System.Net.Http.Headers;
using System.Net.Http.Json;
using System.Text.Json;
using Microsoft.Extensions.DependencyInjection;
using Npgsql;
using QaService.Api.Storage;
using QaService.Api.Tests.Support;

namespace QaService.Api.Tests.Production;

/// <summary>Storage:Provider = postgres: the store, migrations at start, restarts, and two instances on one database.</summary>
public sealed class PostgresStoreTests
{
    [PostgresFact]
    public async Task Two_instances_share_the_database_what_one_creates_the_other_reads()
    {
        using var first = new QaServiceFactory(extra: PostgresFactAttribute.Settings());
        using var second = new QaServiceFactory(extra: PostgresFactAttribute.Settings());
        var created = await first.CreateClient().PostJsonAsync(Requests.Minimal());
        Assert.Equal(HttpStatusCode.Created, created.StatusCode);
        var read = await second.CreateClient().GetAsync(created.Headers.Location);
        Assert.Equal(HttpStatusCode.OK, read.StatusCode);
        Assert.Equal(await created.Content.ReadAsStringAsync(), await read.Content.ReadAsStringAsync());
    }

    [PostgresFact]
    public async Task Keys_made_on_one_instance_open_the_other_and_tenants_stay_apart()
    {
        var settings = PostgresFactAttribute.Settings(new Dictionary<string, string?> { ["Auth:Mode"] = "keys", ["Auth:AdminToken"] = KeysHost.AdminToken });
        using var first = new QaServiceFactory(extra: settings);
        using var second = new QaServiceFactory(extra: settings);
        var admin = first.CreateClient();
        admin.DefaultRequestHeaders.Authorization = new AuthenticationHeaderValue("Bearer", KeysHost.AdminToken);
        async Task<string> KeyAsync()
        {
            var response = await admin.PostAsJsonAsync("/v1/admin/tenants", new { name = $"pg-team-{Guid.NewGuid():N}" });
            Assert.Equal(HttpStatusCode.Created, response.StatusCode);
            return JsonDocument.Parse(await response.Content.ReadAsStringAsync()).RootElement.GetProperty("apiKey").GetString()!;
        }
        var (north, south) = (await KeyAsync(), await KeyAsync());

        var onFirst = first.CreateClient();
        onFirst.DefaultRequestHeaders.Authorization = new AuthenticationHeaderValue("Bearer", north);
        var created = await onFirst.PostJsonAsync(Requests.Minimal());
        Assert.Equal(HttpStatusCode.Created, created.StatusCode);

        var northOnSecond = second.CreateClient();
        northOnSecond.DefaultRequestHeaders.Authorization = new AuthenticationHeaderValue("Bearer", north);
        Assert.Equal(HttpStatusCode.OK, (await northOnSecond.GetAsync(created.Headers.Location)).StatusCode);
        var southOnSecond = second.CreateClient();
        southOnSecond.DefaultRequestHeaders.Authorization = new AuthenticationHeaderValue("Bearer", south);
        await ProblemAssert.IsProblemAsync(await southOnSecond.GetAsync(created.Headers.Location), HttpStatusCode.NotFound);
    }

    [PostgresFact]
    public async Task Reports_read_back_unchanged_after_a_restart()
    {
        string created;
        Uri location;
        using (var before = new QaServiceFactory(extra: PostgresFactAttribute.Settings()))
        {
            var response = await before.CreateClient().PostJsonAsync(Requests.Minimal());
            Assert.Equal(HttpStatusCode.Created, response.StatusCode);
            location = response.Headers.Location!;
            created = await response.Content.ReadAsStringAsync();
        }
        using var after = new QaServiceFactory(extra: PostgresFactAttribute.Settings());
        var again = await after.CreateClient().GetAsync(location);
        Assert.Equal(HttpStatusCode.OK, again.StatusCode);
        Assert.Equal(created, await again.Content.ReadAsStringAsync());
        Assert.Equal(HttpStatusCode.OK, (await after.CreateClient().GetAsync("/readyz")).StatusCode);
    }

    [PostgresFact]
    public async Task A_large_report_streams_in_and_out_byte_for_byte()
    {
        var schema = $"qa_stream_{Guid.NewGuid():N}";
        await using (var admin = NpgsqlDataSource.Create(PostgresFactAttribute.ConnectionString!))
            await admin.CreateCommand($"CREATE SCHEMA {schema}").ExecuteNonQueryAsync();
        await using var source = NpgsqlDataSource.Create($"{PostgresFactAttribute.ConnectionString};Search Path={schema}");
        try
        {
            var store = new PostgresReportStore(source);
            await store.InitializeAsync(CancellationToken.None);
            var json = System.Text.Encoding.UTF8.GetBytes("{\"text\":\"" + new string('é', 1_500_000) + "\"}");
            var stream = new MemoryStream(json);
            await ((IReportStore)store).SaveAsync(new ReportHeader("t1", "big", DateTimeOffset.UnixEpoch, "title", "pass"), stream, CancellationToken.None);

            // The caller answers from the same stream after saving (AssessmentsApi): it must still be open.
            stream.Position = 0;
            Assert.Equal(json.Length, stream.Length);
            Assert.Equal(System.Text.Encoding.UTF8.GetString(json), await store.FindJsonAsync("t1", "big", CancellationToken.None));
            await using (var read = await ((IReportStore)store).OpenJsonAsync("t1", "big", CancellationToken.None))
            {
                Assert.NotNull(read);
                Assert.Equal(json.Length, read!.Length);
                var copy = new MemoryStream();
                await read.CopyToAsync(copy);
                Assert.Equal(json, copy.ToArray());
            }
            Assert.Null(await ((IReportStore)store).OpenJsonAsync("t2", "big", CancellationToken.None));
            await Assert.ThrowsAsync<PostgresException>(() => ((IReportStore)store).SaveAsync(
                new ReportHeader("t1", "big", DateTimeOffset.UnixEpoch, null, "pass"), new MemoryStream("{}"u8.ToArray()), CancellationToken.None));
            Assert.Equal(System.Text.Encoding.UTF8.GetString(json), await store.FindJsonAsync("t1", "big", CancellationToken.None));
        }
        finally
        {
            await using var admin = NpgsqlDataSource.Create(PostgresFactAttribute.ConnectionString!);
            await admin.CreateCommand($"DROP SCHEMA {schema} CASCADE").ExecuteNonQueryAsync();
        }
    }

    [PostgresFact]
    public async Task Instances_starting_together_migrate_once()
    {
        // A fresh schema, so the migrations really run here, from four stores at once.
        var schema = $"qa_migrate_{Guid.NewGuid():N}";
        await using (var admin = NpgsqlDataSource.Create(PostgresFactAttribute.ConnectionString!))
            await admin.CreateCommand($"CREATE SCHEMA {schema}").ExecuteNonQueryAsync();
        var connection = $"{PostgresFactAttribute.ConnectionString};Search Path={schema}";
        var sources = Enumerable.Range(0, 4).Select(_ => NpgsqlDataSource.Create(connection)).ToList();
        try
        {
            await Task.WhenAll(sources.Select(source => new PostgresReportStore(source).InitializeAsync(CancellationToken.None)));
            await using var count = sources[0].CreateCommand("SELECT string_agg(version::text, ',' ORDER BY version) FROM qaservice_schema");
            // Each migration once, in order (however many later features append).
            Assert.Equal(string.Join(',', Enumerable.Range(1, PostgresSchema.Count)), await count.ExecuteScalarAsync());
            Assert.True(PostgresSchema.Count >= 4, "projects (3) and decisions (4) are migrations");

            var store = new PostgresReportStore(sources[0]);
            var report = new StoredReport("t1", "id1", DateTimeOffset.UnixEpoch, null, "pass", """{"id":"id1"}""");
            await store.SaveAsync(report, CancellationToken.None);
            Assert.Equal(report.Json, await store.FindJsonAsync("t1", "id1", CancellationToken.None));
            Assert.Null(await store.FindJsonAsync("t2", "id1", CancellationToken.None));
            await Assert.ThrowsAsync<PostgresException>(() => store.SaveAsync(report, CancellationToken.None));

            var tenants = new PostgresTenantStore(sources[1]);
            var tenant = new StoredTenant("t1", "north", new string('a', 64), DateTimeOffset.UnixEpoch);
            Assert.True(await tenants.CreateAsync(tenant, CancellationToken.None));
            Assert.False(await tenants.CreateAsync(tenant with { Id = "t2", KeyHash = new string('b', 64) }, CancellationToken.None));
            Assert.Equal("north", (await tenants.FindByKeyHashAsync(new string('a', 64), CancellationToken.None))?.Name);
            Assert.Null(await tenants.FindByKeyHashAsync(new string('c', 64), CancellationToken.None));
        }
        finally
        {
            foreach (var source in sources)
                await source.DisposeAsync();
            await using var admin = NpgsqlDataSource.Create(PostgresFactAttribute.ConnectionString!);
            await admin.CreateCommand($"DROP SCHEMA {schema} CASCADE").ExecuteNonQueryAsync();
        }
    }

    [PostgresFact]
    public async Task Readiness_is_503_when_the_database_cannot_be_reached()
    {
        var settings = PostgresFactAttribute.Settings();
        using var factory = new QaServiceFactory(extra: settings);
        var client = factory.CreateClient();
        Assert.Equal(HttpStatusCode.OK, (await client.GetAsync("/readyz")).StatusCode);

        // A second store on a port where nothing listens, asked directly (the host would not start on it).
        var unreachable = new NpgsqlConnectionStringBuilder(PostgresFactAttribute.ConnectionString) { Port = 1, Timeout = 2 };
        await using var source = NpgsqlDataSource.Create(unreachable.ConnectionString);
        Assert.False(await new PostgresReportStore(source).IsReachableAsync(CancellationToken.None));
        Assert.NotNull(factory.Services.GetRequiredService<IReportStore>() as PostgresReportStore);
    }
}
