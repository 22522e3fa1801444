namespace QaService.Api.Tests.Support;

/// <summary>
/// A test that needs PostgreSQL: it runs when <c>QASERVICE_TEST_POSTGRES</c> holds a connection string
/// (CI starts a loopback cluster with tools/postgres/start-loopback-cluster.sh and sets it) and is
/// skipped with that reason otherwise.
/// </summary>
public sealed class PostgresFactAttribute : FactAttribute
{
    public const string Variable = "QASERVICE_TEST_POSTGRES";

    public PostgresFactAttribute()
    {
        if (string.IsNullOrWhiteSpace(ConnectionString))
            Skip = $"SKIPPED: {Variable} is not set (start a cluster with tools/postgres/start-loopback-cluster.sh, as .ci/run does)";
    }

    public static string? ConnectionString => Environment.GetEnvironmentVariable(Variable);

    /// <summary>Settings for a service instance on the test PostgreSQL database.</summary>
    public static Dictionary<string, string?> Settings(IDictionary<string, string?>? extra = null)
    {
        var settings = new Dictionary<string, string?>
        {
            ["Storage:Provider"] = "postgres",
            ["Storage:ConnectionString"] = ConnectionString + ";Maximum Pool Size=10",
        };
        foreach (var (key, value) in extra ?? new Dictionary<string, string?>())
            settings[key] = value;
        return settings;
    }
}
