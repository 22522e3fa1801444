using System.Net;
using System.Text.Json;
using Microsoft.Extensions.DependencyInjection;
using QaService.Api.Security;
using QaService.Api.Storage;
using QaService.Api.Tests.Support;

namespace QaService.Api.Tests;

/// <summary>
/// GET /v1/assessments and DELETE /v1/assessments/{id} end to end on one host; run on SQLite (<see cref="ListingTests"/>)
/// and PostgreSQL (<see cref="Production.PostgresListingTests"/>). Rows are seeded through the host's own store with
/// chosen times; the expected order is computed here by LINQ (created DESC, then id DESC, ordinal), not read back.
/// </summary>
internal static class ListingScenarios
{
    private static readonly DateTimeOffset T0 = new(2026, 3, 1, 8, 0, 0, TimeSpan.Zero);

    public static async Task Paging_returns_every_report_once_newest_first_even_when_rows_change_between_pages(QaServiceFactory factory)
    {
        // 23 reports, three to a timestamp (ties broken by id), and another tenant's rows in between.
        var seeded = Enumerable.Range(0, 23).Select(i => Row(Tenants.Local, $"r{i:D2}", T0.AddMinutes(i / 3), $"Batch {i}", "pass")).ToList();
        await SeedAsync(factory, seeded);
        await SeedAsync(factory, Enumerable.Range(0, 5).Select(i => Row("other-tenant", $"o{i:D2}", T0.AddMinutes(i), "Other", "fail")));
        var expected = seeded.OrderByDescending(r => r.CreatedAt).ThenByDescending(r => r.Id, StringComparer.Ordinal).Select(r => r.Id).ToList();

        var client = factory.CreateClient();
        var seen = new List<string>();
        var (items, next) = await PageAsync(client, "/v1/assessments?limit=5");
        seen.AddRange(items);
        Assert.Equal(expected.Take(5), items);

        // Between pages: a newer report arrives and one not yet listed is deleted.
        await SeedAsync(factory, [Row(Tenants.Local, "r99", T0.AddDays(1), "Newest", "pass")]);
        var deleted = expected[7];
        Assert.Equal(HttpStatusCode.NoContent, (await client.DeleteAsync($"/v1/assessments/{deleted}")).StatusCode);

        var pages = 1;
        while (next is not null)
        {
            (items, next) = await PageAsync(client, $"/v1/assessments?limit=5&cursor={Uri.EscapeDataString(next)}");
            Assert.True(items.Count is > 0 and <= 5, $"page {pages + 1} has {items.Count} items");
            seen.AddRange(items);
            pages++;
        }
        Assert.Equal(expected.Where(id => id != deleted), seen);
        Assert.Equal(5, pages);

        // A fresh first page shows the newcomer first; limit defaults to 20.
        (items, next) = await PageAsync(client, "/v1/assessments");
        Assert.Equal("r99", items[0]);
        Assert.Equal(20, items.Count);
        Assert.NotNull(next);
    }

    public static async Task Filters_select_by_verdict_title_text_and_time(QaServiceFactory factory)
    {
        await SeedAsync(factory,
        [
            Row(Tenants.Local, "a1", T0, "Hydrant batch 1", "pass"),
            Row(Tenants.Local, "a2", T0.AddHours(1), "HYDRANT batch 2", "fail"),
            Row(Tenants.Local, "a3", T0.AddHours(2), "Valve 100% check", "inconclusive"),
            Row(Tenants.Local, "a4", T0.AddHours(3), "valve_a", "pass"),
            Row(Tenants.Local, "a5", T0.AddHours(4), "valveXa 1000 check", "pass"),
            Row(Tenants.Local, "a6", T0.AddHours(5), null, "fail"),
            Row("other-tenant", "b1", T0.AddHours(1), "Hydrant batch 9", "pass"),
        ]);
        var client = factory.CreateClient();
        async Task<List<string>> Ids(string query) => (await PageAsync(client, "/v1/assessments?" + query)).Items;

        Assert.Equal(["a5", "a4", "a1"], await Ids("verdict=pass"));
        Assert.Equal(["a6", "a2"], await Ids("verdict=fail"));
        Assert.Equal(["a2", "a1"], await Ids("q=hydrant"));                // case-insensitive, other tenant's not listed
        Assert.Equal(["a3"], await Ids("q=" + Uri.EscapeDataString("100%")));  // % is a character, not a wildcard
        Assert.Equal(["a4"], await Ids("q=valve_a"));                       // _ is a character, not a wildcard
        Assert.Equal(["a5", "a4"], await Ids("verdict=pass&q=VALVE"));
        // from inclusive, to exclusive: exactly a2's and a4's times.
        Assert.Equal(["a3", "a2"], await Ids("from=" + Uri.EscapeDataString("2026-03-01T09:00:00Z") + "&to=" + Uri.EscapeDataString("2026-03-01T11:00:00+00:00")));
        Assert.Equal(["a3", "a2"], await Ids("from=" + Uri.EscapeDataString("2026-03-01T10:00:00+01:00") + "&to=" + Uri.EscapeDataString("2026-03-01T06:00:00-05:00")));
        Assert.Empty(await Ids("q=nothing-like-this"));

        // Paging with a filter keeps to it.
        var (first, next) = await PageAsync(client, "/v1/assessments?verdict=pass&limit=2");
        Assert.Equal(["a5", "a4"], first);
        var (second, last) = await PageAsync(client, $"/v1/assessments?verdict=pass&limit=2&cursor={Uri.EscapeDataString(next!)}");
        Assert.Equal(["a1"], second);
        Assert.Null(last);
    }

    public static async Task Delete_answers_204_then_the_report_is_gone_and_other_tenants_get_404(QaServiceFactory factory)
    {
        var client = factory.CreateClient();
        var created = await client.PostJsonAsync(Requests.Minimal());
        Assert.Equal(HttpStatusCode.Created, created.StatusCode);
        var location = created.Headers.Location!.OriginalString;
        var id = location.Split('/')[^1];
        Assert.Contains(id, (await PageAsync(client, "/v1/assessments")).Items);

        var delete = await client.DeleteAsync(location);
        Assert.Equal(HttpStatusCode.NoContent, delete.StatusCode);
        Assert.Empty(await delete.Content.ReadAsByteArrayAsync());
        foreach (var path in Production.TenantKeyTests.TenantScopedReadPaths(location))
            await ProblemAssert.IsProblemAsync(await client.GetAsync(path), HttpStatusCode.NotFound);
        await ProblemAssert.IsProblemAsync(await client.DeleteAsync(location), HttpStatusCode.NotFound);
        Assert.DoesNotContain(id, (await PageAsync(client, "/v1/assessments")).Items);

        // Another tenant's report (same store) is 404 to this tenant's DELETE, and stays.
        await SeedAsync(factory, [Row("other-tenant", "keepme", T0, "Theirs", "pass")]);
        await ProblemAssert.IsProblemAsync(await client.DeleteAsync("/v1/assessments/keepme"), HttpStatusCode.NotFound);
        Assert.NotNull(await Store(factory).FindJsonAsync("other-tenant", "keepme", CancellationToken.None));
        await ProblemAssert.IsProblemAsync(await client.DeleteAsync("/v1/assessments/no%20such"), HttpStatusCode.NotFound);
    }

    public static async Task The_demo_is_stored_only_if_absent(QaServiceFactory factory)
    {
        var store = Store(factory);
        var header = new ReportHeader(Tenants.Local, "dup", T0, "first", "pass");
        Assert.True(await store.SaveIfAbsentAsync(header, new MemoryStream("""{"v":1}"""u8.ToArray()), CancellationToken.None));
        Assert.False(await store.SaveIfAbsentAsync(header with { Title = "second" }, new MemoryStream("""{"v":2}"""u8.ToArray()), CancellationToken.None));
        Assert.Equal("""{"v":1}""", await store.FindJsonAsync(Tenants.Local, "dup", CancellationToken.None));
        // Another tenant may hold the same id.
        Assert.True(await store.SaveIfAbsentAsync(header with { Tenant = "other-tenant" }, new MemoryStream("""{"v":3}"""u8.ToArray()), CancellationToken.None));
    }

    public static IReportStore Store(QaServiceFactory factory) => factory.Services.GetRequiredService<IReportStore>();

    public static StoredReport Row(string tenant, string id, DateTimeOffset created, string? title, string verdict) =>
        new(tenant, id, created, title, verdict, $$"""{"id":"{{id}}"}""");

    public static async Task SeedAsync(QaServiceFactory factory, IEnumerable<StoredReport> rows)
    {
        var store = Store(factory);
        foreach (var row in rows)
            await store.SaveAsync(row, CancellationToken.None);
    }

    public static async Task<(List<string> Items, string? Next)> PageAsync(HttpClient client, string path)
    {
        var response = await client.GetAsync(path);
        var text = await response.Content.ReadAsStringAsync();
        Assert.True(response.StatusCode == HttpStatusCode.OK, text);
        var body = JsonDocument.Parse(text).RootElement;
        var items = body.GetProperty("items").EnumerateArray().ToList();
        foreach (var item in items)
        {
            Assert.Equal(JsonValueKind.String, item.GetProperty("createdAt").ValueKind);
            Assert.Contains(item.GetProperty("verdict").GetString(), new[] { "pass", "fail", "inconclusive" });
            Assert.True(item.TryGetProperty("title", out _));
        }
        var next = body.GetProperty("next");
        return (items.Select(i => i.GetProperty("id").GetString()!).ToList(), next.ValueKind == JsonValueKind.Null ? null : next.GetString());
    }
}
