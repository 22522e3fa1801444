using System.Net;
using System.Text;
using QaService.Api.Tests.Support;

namespace QaService.Api.Tests;

/// <summary>The report list and delete on SQLite (the same scenarios run on PostgreSQL in PostgresListingTests); bad parameters.</summary>
public sealed class ListingTests
{
    [Fact]
    public async Task Paging_returns_every_report_once_newest_first()
    {
        using var factory = new QaServiceFactory();
        await ListingScenarios.Paging_returns_every_report_once_newest_first_even_when_rows_change_between_pages(factory);
    }

    [Fact]
    public async Task Filters_select_by_verdict_title_text_and_time()
    {
        using var factory = new QaServiceFactory();
        await ListingScenarios.Filters_select_by_verdict_title_text_and_time(factory);
    }

    [Fact]
    public async Task Delete_then_404_and_other_tenants_404()
    {
        using var factory = new QaServiceFactory();
        await ListingScenarios.Delete_answers_204_then_the_report_is_gone_and_other_tenants_get_404(factory);
    }

    [Fact]
    public async Task Demo_store_is_insert_if_absent()
    {
        using var factory = new QaServiceFactory();
        await ListingScenarios.The_demo_is_stored_only_if_absent(factory);
    }

    [Fact]
    public async Task The_local_tenant_may_delete_the_demo_and_it_returns_at_the_next_start()
    {
        var path = Path.Combine(Path.GetTempPath(), $"qaservice-demo-{Guid.NewGuid():N}.db");
        using (var first = new QaServiceFactory(path, demo: true))
        {
            var client = first.CreateClient();
            Assert.Equal(HttpStatusCode.NoContent, (await client.DeleteAsync("/v1/assessments/demo")).StatusCode);
            Assert.Equal(HttpStatusCode.NotFound, (await client.GetAsync("/v1/assessments/demo")).StatusCode);
        }
        using var second = new QaServiceFactory(path, demo: true);
        Assert.Equal(HttpStatusCode.OK, (await second.CreateClient().GetAsync("/v1/assessments/demo")).StatusCode);
    }

    [Theory]
    [InlineData("limit=0", "/limit", "1..100")]
    [InlineData("limit=101", "/limit", "1..100")]
    [InlineData("limit=ten", "/limit", "whole number")]
    [InlineData("limit=-1", "/limit", "whole number")]
    [InlineData("cursor=not-a-cursor", "/cursor", "next")]
    [InlineData("cursor=djI6MTox", "/cursor", "next")] // base64url of "v2:1:1": not this version
    [InlineData("verdict=maybe", "/verdict", "pass, fail, inconclusive")]
    [InlineData("from=2026-05-01", "/from", "RFC 3339")]                // a date alone is not an RFC 3339 date-time
    [InlineData("from=yesterday", "/from", "RFC 3339")]
    [InlineData("to=2026-05-01T00:00:00", "/to", "RFC 3339")]          // no offset (RFC 3339 §5.6 requires one)
    [InlineData("from=2026-05-02T00:00:00Z&to=2026-05-01T00:00:00Z", "/to", "later than from")]
    [InlineData("from=2026-05-01T00:00:00Z&to=2026-05-01T00:00:00Z", "/to", "later than from")]
    public async Task Bad_parameters_are_400_problems_pointing_at_the_parameter(string query, string pointer, string fragment)
    {
        using var factory = new QaServiceFactory();
        var response = await factory.CreateClient().GetAsync("/v1/assessments?" + query);
        await ProblemAssert.IsBadInputAsync(response, pointer, fragment);
    }

    [Fact]
    public async Task A_long_title_search_and_several_bad_parameters_are_each_named()
    {
        using var factory = new QaServiceFactory();
        var response = await factory.CreateClient().GetAsync($"/v1/assessments?q={new string('x', 201)}&limit=0&verdict=ok");
        var problem = await ProblemAssert.IsBadInputAsync(response, "/q", "200 characters");
        var pointers = problem.GetProperty("errors").EnumerateArray().Select(e => e.GetProperty("pointer").GetString()).ToList();
        Assert.Equal(["/limit", "/verdict", "/q"], pointers);
    }

    [Fact]
    public async Task Accepted_forms_of_the_parameters()
    {
        using var factory = new QaServiceFactory();
        var client = factory.CreateClient();
        foreach (var query in new[] { "limit=1", "limit=100", "verdict=PASS", "q=%25_%5C", "from=2026-05-01T00:00:00.1234567Z", "to=2026-05-01t00:00:00-07:30", "q=" })
            Assert.True((await client.GetAsync("/v1/assessments?" + query)).StatusCode == HttpStatusCode.OK, query);
        var body = Encoding.UTF8.GetString(await client.GetByteArrayAsync("/v1/assessments"));
        Assert.Equal("""{"items":[],"next":null}""", body);
    }
}
