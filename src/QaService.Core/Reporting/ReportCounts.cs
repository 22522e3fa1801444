namespace QaService.Core.Reporting;

/// <summary>How many points took part (api-v1 "counts").</summary>
/// <param name="Marks">Marks received.</param>
/// <param name="Fixes">Fixes received.</param>
/// <param name="Paired">Fixes paired with a mark.</param>
/// <param name="Unpaired">Fixes with no mark (no id and none within the pairing radius).</param>
/// <param name="Excluded">Paired fixes left out of the statistics by request.</param>
public sealed record ReportCounts(int Marks, int Fixes, int Paired, int Unpaired, int Excluded);
