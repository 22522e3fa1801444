using QaService.Api.Tests.Support;

namespace QaService.Api.Tests.Production;

/// <summary>The listing scenarios on Storage:Provider = postgres, each on a fresh schema.</summary>
public sealed class PostgresListingTests
{
    [PostgresFact]
    public Task Paging_returns_every_report_once_newest_first() =>
        RunAsync(ListingScenarios.Paging_returns_every_report_once_newest_first_even_when_rows_change_between_pages);

    [PostgresFact]
    public Task Filters_select_by_verdict_title_text_and_time() => RunAsync(ListingScenarios.Filters_select_by_verdict_title_text_and_time);

    [PostgresFact]
    public Task Delete_then_404_and_other_tenants_404() => RunAsync(ListingScenarios.Delete_answers_204_then_the_report_is_gone_and_other_tenants_get_404);

    [PostgresFact]
    public Task Demo_store_is_insert_if_absent() => RunAsync(ListingScenarios.The_demo_is_stored_only_if_absent);

    private static async Task RunAsync(Func<QaServiceFactory, Task> scenario)
    {
        await using var scope = await PostgresSchemaScope.CreateAsync();
        using var factory = new QaServiceFactory(extra: scope.Settings());
        await scenario(factory);
    }
}
