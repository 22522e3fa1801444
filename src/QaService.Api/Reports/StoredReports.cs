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
    private static JsonSerializerOptions Options => ReportJson.StoredReport;

    public static async Task<AssessmentReport?> LoadAsync(IReportStore store, string tenant, string id, CancellationToken cancellationToken)
    {
        if (!ReportIds.IsPlausible(id))
            return null;
        // Read from the stored stream: a large report is never one string (see IReportStore.OpenJsonAsync).
        await using var json = await store.OpenJsonAsync(tenant, id, cancellationToken);
        return json is null ? null : await JsonSerializer.DeserializeAsync<AssessmentReport>(json, Options, cancellationToken);
    }
}
