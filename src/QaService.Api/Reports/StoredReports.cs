using System.Text.Json;
using QaService.Api.Storage;
using QaService.Core.Reporting;

namespace QaService.Api.Reports;

/// <summary>Loads a stored report's JSON back into the report model for the HTML, CSV and GeoJSON views.</summary>
internal static class StoredReports
{
    /// <summary>
    /// Lenient on purpose (unlike request reading): a report stored by an older or newer build, with a field
    /// this build does not know, still renders.
    /// </summary>
    private static readonly JsonSerializerOptions Options = new(JsonSerializerDefaults.Web);

    public static async Task<AssessmentReport?> LoadAsync(IReportStore store, string tenant, string id, CancellationToken cancellationToken)
    {
        if (!ReportIds.IsPlausible(id))
            return null;
        var json = await store.FindJsonAsync(tenant, id, cancellationToken);
        return json is null ? null : JsonSerializer.Deserialize<AssessmentReport>(json, Options);
    }
}
