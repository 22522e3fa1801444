using Microsoft.Extensions.Options;
using Npgsql;

namespace QaService.Api.Storage;

/// <summary>Registers the stores of the configured <c>Storage:Provider</c>.</summary>
internal static class StorageRegistration
{
    public static IServiceCollection AddReportStorage(this IServiceCollection services, IConfiguration configuration)
    {
        services.AddOptions<StorageOptions>().BindConfiguration(StorageOptions.Section).ValidateDataAnnotations()
            .Validate(o => !o.IsPostgres || !string.IsNullOrWhiteSpace(o.ConnectionString),
                "Storage:ConnectionString is required when Storage:Provider is postgres (e.g. Host=db;Database=qaservice;Username=qaservice;Password=…)")
            .ValidateOnStart();

        var postgres = string.Equals(configuration[$"{StorageOptions.Section}:{nameof(StorageOptions.Provider)}"], StorageOptions.PostgresProvider, StringComparison.OrdinalIgnoreCase);
        if (postgres)
        {
            // One pooled data source per process; Npgsql keeps connections open between requests.
            services.AddSingleton(provider => new NpgsqlDataSourceBuilder(provider.GetRequiredService<IOptions<StorageOptions>>().Value.EffectiveConnectionString).Build());
            services.AddSingleton<IReportStore, PostgresReportStore>();
            services.AddSingleton<ITenantStore, PostgresTenantStore>();
            services.AddSingleton<IShareLinkStore, PostgresShareLinkStore>();
            services.AddSingleton<IUploadStagingStore, PostgresUploadStagingStore>();
            services.AddSingleton<IProjectStore, PostgresProjectStore>();
            services.AddSingleton<IDecisionStore, PostgresDecisionStore>();
        }
        else
        {
            services.AddSingleton<IReportStore, SqliteReportStore>();
            services.AddSingleton<ITenantStore, SqliteTenantStore>();
            services.AddSingleton<IShareLinkStore, SqliteShareLinkStore>();
            services.AddSingleton<IUploadStagingStore, SqliteUploadStagingStore>();
            services.AddSingleton<IProjectStore, SqliteProjectStore>();
            services.AddSingleton<IDecisionStore, SqliteDecisionStore>();
        }
        return services;
    }
}
