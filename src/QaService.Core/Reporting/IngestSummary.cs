namespace QaService.Core.Reporting;

/// <summary>How the files of a multipart upload were read (null for JSON requests).</summary>
/// <param name="RowErrors"><c>strict</c> or <c>lenient</c>.</param>
/// <param name="Marks">The marks file.</param>
/// <param name="Fixes">The fixes file.</param>
/// <param name="SkippedRows">Rows left out in lenient mode (all of them counted).</param>
/// <param name="Skipped">The rows left out, each with its pointer and reason (at most 1,000 listed).</param>
public sealed record IngestSummary(string RowErrors, IngestPartSummary Marks, IngestPartSummary Fixes, int SkippedRows, IReadOnlyList<IngestProblem> Skipped);

/// <summary>One file as read.</summary>
/// <param name="Format"><c>csv</c>, <c>geojson</c>, <c>gpx</c> or <c>nmea</c>, recognised from content.</param>
/// <param name="Points">Points read and kept.</param>
/// <param name="Columns">CSV: contract field → the file's header it was read from.</param>
/// <param name="SentencesWithoutFix">NMEA: GGA sentences without a position (quality 0), not counted as fixes.</param>
public sealed record IngestPartSummary(string Format, int Points, IReadOnlyDictionary<string, string>? Columns, long? SentencesWithoutFix);

/// <summary>A row that was left out.</summary>
public sealed record IngestProblem(string Pointer, string Message);
