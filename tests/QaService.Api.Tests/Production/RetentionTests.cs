using System.Net;
using Microsoft.Extensions.Logging;
using Microsoft.Extensions.Options;
using QaService.Api.Storage;
using QaService.Api.Tests.Support;

namespace QaService.Api.Tests.Production;

/// <summary>Storage:RetentionDays: reports older than the limit are removed in batches, on both stores; newer ones stay.</summary>
public sealed class RetentionTests
{
    private static readonly DateTimeOffset Now = new(2026, 6, 15, 12, 0, 0, TimeSpan.Zero);

    [Fact]
    public async Task Sqlite_purge_removes_only_reports_older_than_the_limit_in_batches()
    {
        using var factory = new QaServiceFactory();
        await PurgeScenarioAsync(factory);
    }

    [PostgresFact]
    public async Task Postgres_purge_removes_only_reports_older_than_the_limit_in_batches()
    {
        await using var scope = await PostgresSchemaScope.CreateAsync();
        using var factory = new QaServiceFactory(extra: scope.Settings());
        await PurgeScenarioAsync(factory);
    }

    private static async Task PurgeScenarioAsync(QaServiceFactory factory)
    {
        var cutoff = Now.AddDays(-7);
        var old = Enumerable.Range(0, 27).Select(i => ListingScenarios.Row(i % 2 == 0 ? "north" : "south", $"old{i:D2}", cutoff.AddHours(-1 - i), "old", "pass")).ToList();
        var kept = new[]
        {
            ListingScenarios.Row("north", "edge", cutoff, "exactly at the cutoff", "pass"),   // not older: kept
            ListingScenarios.Row("north", "new1", cutoff.AddSeconds(1), "new", "fail"),
            ListingScenarios.Row("south", "new2", Now, "new", "pass"),
        };
        await ListingScenarios.SeedAsync(factory, old.Concat(kept));
        var store = ListingScenarios.Store(factory);

        var log = new CountingLogger();
        var purge = new RetentionPurge(store, Options.Create(new StorageOptions { RetentionDays = 7 }), new FixedClock(Now), log);
        Assert.Equal(27, await purge.PurgeAsync(7, batchSize: 4, CancellationToken.None));
        Assert.Contains(log.Messages, m => m.StartsWith("Retention removed 27 reports", StringComparison.Ordinal));
        foreach (var row in old)
            Assert.Null(await store.FindJsonAsync(row.Tenant, row.Id, CancellationToken.None));
        foreach (var row in kept)
            Assert.NotNull(await store.FindJsonAsync(row.Tenant, row.Id, CancellationToken.None));
        Assert.Equal(0, await purge.PurgeAsync(7, batchSize: 4, CancellationToken.None));
        Assert.Equal(0, await store.DeleteCreatedBeforeAsync(cutoff, 10, CancellationToken.None));
    }

    [Fact]
    public async Task The_service_purges_at_start_when_retention_is_set()
    {
        var path = Path.Combine(Path.GetTempPath(), $"qaservice-retention-{Guid.NewGuid():N}.db");
        using (var before = new QaServiceFactory(path))
            await ListingScenarios.SeedAsync(before, [ListingScenarios.Row("local", "ancient", new DateTimeOffset(2001, 1, 1, 0, 0, 0, TimeSpan.Zero), "old", "pass")]);

        using var after = new QaServiceFactory(path, extra: new Dictionary<string, string?> { ["Storage:RetentionDays"] = "30" });
        var client = after.CreateClient();
        var created = await client.PostJsonAsync(Requests.Minimal());
        Assert.Equal(HttpStatusCode.Created, created.StatusCode);
        var status = HttpStatusCode.OK;
        for (var attempt = 0; attempt < 50 && status == HttpStatusCode.OK; attempt++)
        {
            status = (await client.GetAsync("/v1/assessments/ancient")).StatusCode;
            if (status == HttpStatusCode.OK)
                await Task.Delay(100);
        }
        Assert.Equal(HttpStatusCode.NotFound, status);
        Assert.Equal(HttpStatusCode.OK, (await client.GetAsync(created.Headers.Location)).StatusCode);
    }

    [Theory]
    [InlineData("0")]
    [InlineData("-3")]
    [InlineData("seven")]
    public void A_bad_retention_stops_the_service_naming_the_key(string value)
    {
        using var factory = new QaServiceFactory(extra: new Dictionary<string, string?> { ["Storage:RetentionDays"] = value });
        var fault = Record.Exception(() => factory.CreateClient());
        Assert.NotNull(fault);
        Assert.Contains("RetentionDays", fault.ToString());
    }

    private sealed class FixedClock(DateTimeOffset now) : TimeProvider
    {
        public override DateTimeOffset GetUtcNow() => now;
    }

    private sealed class CountingLogger : ILogger<RetentionPurge>
    {
        public List<string> Messages { get; } = [];

        public IDisposable? BeginScope<TState>(TState state) where TState : notnull => null;

        public bool IsEnabled(LogLevel logLevel) => true;

        public void Log<TState>(LogLevel logLevel, EventId eventId, TState state, Exception? exception, Func<TState, Exception?, string> formatter) =>
            Messages.Add(formatter(state, exception));
    }
}
