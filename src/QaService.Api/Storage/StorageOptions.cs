using System.ComponentModel.DataAnnotations;

namespace QaService.Api.Storage;

/// <summary>Storage settings (configuration section <c>Storage</c>, api-v1 "Configuration keys").</summary>
public sealed class StorageOptions
{
    public const string Section = "Storage";

    public const string SqliteProvider = "sqlite";
    public const string PostgresProvider = "postgres";

    /// <summary><c>sqlite</c> (default, one instance) or <c>postgres</c> (several instances share one database).</summary>
    [RegularExpression("^(?i:sqlite|postgres)$", ErrorMessage = "Storage:Provider must be \"sqlite\" or \"postgres\"")]
    public string Provider { get; set; } = SqliteProvider;

    /// <summary>ADO.NET connection string; default: SQLite file <c>data/qaservice.db</c> under the working folder. Required for postgres.</summary>
    public string? ConnectionString { get; set; }

    /// <summary>Reports older than this many days are deleted (at start, then hourly); unset keeps them forever.</summary>
    [Range(1, 365_000, ErrorMessage = "Storage:RetentionDays must be a whole number of days from 1 to 365000 (leave it unset to keep reports forever)")]
    public int? RetentionDays { get; set; }

    public bool IsPostgres => string.Equals(Provider, PostgresProvider, StringComparison.OrdinalIgnoreCase);

    /// <summary>The connection string in force.</summary>
    public string EffectiveConnectionString =>
        string.IsNullOrWhiteSpace(ConnectionString)
            ? $"Data Source={Path.Combine(Directory.GetCurrentDirectory(), "data", "qaservice.db")}"
            : ConnectionString;
}
