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

    /// <summary>The report and the SHA-256 of its stored bytes, from one read of the stream.</summary>
    public static async Task<(AssessmentReport? Report, string? Sha256)> LoadHashedAsync(IReportStore store, string tenant, string id, CancellationToken cancellationToken)
    {
        if (!ReportIds.IsPlausible(id))
            return (null, null);
        var json = await store.OpenJsonAsync(tenant, id, cancellationToken);
        if (json is null)
            return (null, null);
        await using var hashing = new SignOff.Sha256ReadStream(json);
        var report = await JsonSerializer.DeserializeAsync<AssessmentReport>(hashing, Options, cancellationToken);
        return (report, await hashing.FinishAsync(cancellationToken));
    }
}
