using Microsoft.AspNetCore.Hosting;
using Microsoft.AspNetCore.Mvc.Testing;

namespace QaService.Api.Tests.Support;

/// <summary>Hosts the real service in memory on its own SQLite file (deleted with the factory unless kept).</summary>
public sealed class QaServiceFactory : WebApplicationFactory<Program>
{
    private readonly Dictionary<string, string?> settings;

    public QaServiceFactory(string? databasePath = null, bool demo = false, IDictionary<string, string?>? extra = null)
    {
        DatabasePath = databasePath ?? Path.Combine(Path.GetTempPath(), $"qaservice-test-{Guid.NewGuid():N}.db");
        settings = new Dictionary<string, string?>
        {
            ["Storage:ConnectionString"] = $"Data Source={DatabasePath};Pooling=False",
            ["Demo:Enabled"] = demo ? "true" : "false",
            // Hundreds of hosts start in a run: the start-up warm-up upload is tested on its own (WarmUpTests).
            ["WarmUp:Enabled"] = "false",
            ["Serilog:MinimumLevel:Default"] = "Warning",
            // Sweeps send thousands of requests from one in-memory client; LimitTests sets its own limit.
            ["Limits:RateLimitPermits"] = "1000000",
        };
        foreach (var (key, value) in extra ?? new Dictionary<string, string?>())
            settings[key] = value;
    }

    public string DatabasePath { get; }

    protected override void ConfigureWebHost(IWebHostBuilder builder)
    {
        foreach (var (key, value) in settings)
            builder.UseSetting(key, value);
    }
}
