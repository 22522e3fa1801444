using System.ComponentModel.DataAnnotations;

namespace QaService.Api.Storage;

/// <summary>Storage settings (configuration section <c>Storage</c>, api-v1 "Configuration keys").</summary>
public sealed class StorageOptions
{
    public const string Section = "Storage";

    /// <summary><c>sqlite</c> (default). <c>postgres</c> arrives with the production-readiness work.</summary>
    [RegularExpression("^(?i:sqlite)$", ErrorMessage = "Storage:Provider must be \"sqlite\" in this version (\"postgres\" is not supported yet)")]
    public string Provider { get; set; } = "sqlite";

    /// <summary>ADO.NET connection string; default: SQLite file <c>data/qaservice.db</c> under the working folder.</summary>
    public string? ConnectionString { get; set; }

    /// <summary>The connection string in force.</summary>
    public string EffectiveConnectionString =>
        string.IsNullOrWhiteSpace(ConnectionString)
            ? $"Data Source={Path.Combine(Directory.GetCurrentDirectory(), "data", "qaservice.db")}"
            : ConnectionString;
}
