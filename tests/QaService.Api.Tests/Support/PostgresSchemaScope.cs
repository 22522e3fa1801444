using Npgsql;

namespace QaService.Api.Tests.Support;

/// <summary>
/// A fresh schema on the test PostgreSQL database (its own tables, migrated by the service at start), dropped on
/// dispose: tests that list a tenant's reports see only their own rows even with Auth:Mode none.
/// </summary>
public sealed class PostgresSchemaScope : IAsyncDisposable
{
    public string Schema { get; } = $"qa_scope_{Guid.NewGuid():N}";

    public static async Task<PostgresSchemaScope> CreateAsync()
    {
        var scope = new PostgresSchemaScope();
        await using var admin = NpgsqlDataSource.Create(PostgresFactAttribute.ConnectionString!);
        await admin.CreateCommand($"CREATE SCHEMA {scope.Schema}").ExecuteNonQueryAsync();
        return scope;
    }

    public string ConnectionString => $"{PostgresFactAttribute.ConnectionString};Search Path={Schema};Maximum Pool Size=10";

    /// <summary>Service settings on this schema.</summary>
    public Dictionary<string, string?> Settings(IDictionary<string, string?>? extra = null)
    {
        var settings = PostgresFactAttribute.Settings(extra);
        settings["Storage:ConnectionString"] = ConnectionString;
        return settings;
    }

    public async ValueTask DisposeAsync()
    {
        NpgsqlConnection.ClearAllPools();
        await using var admin = NpgsqlDataSource.Create(PostgresFactAttribute.ConnectionString!);
        await admin.CreateCommand($"DROP SCHEMA {Schema} CASCADE").ExecuteNonQueryAsync();
    }
}
