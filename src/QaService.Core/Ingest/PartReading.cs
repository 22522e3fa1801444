using QaService.Core.Assessment;

namespace QaService.Core.Ingest;

/// <summary>
/// What was read from one file part. Pointers into a file name the part, the kind of row and the row:
/// <c>/fixes/line/17/lat</c> for line formats (CSV, GPX, NMEA; 1-based physical lines) and
/// <c>/fixes/features/3/lat</c> for GeoJSON (0-based feature index); the last segment is the contract
/// field when one field is at fault.
/// </summary>
public sealed record PartReading(
    string Part,
    FieldFormat Format,
    PointColumns Points,
    IReadOnlyList<InputError> RowProblems,
    IReadOnlyDictionary<string, string> Columns,
    long SentencesWithoutFix)
{
    public string RowSegment => Format == FieldFormat.GeoJson ? "features" : "line";

    public string PointerOf(long row, string? field) =>
        InvariantText.Format($"/{Part}/{RowSegment}/{row}") + (field is null ? "" : "/" + field);

    /// <summary>The file's own column header for a contract field (CSV), for messages.</summary>
    public string? ColumnOf(string field) => Columns.GetValueOrDefault(field);
}
