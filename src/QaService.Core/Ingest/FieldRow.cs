using QaService.Core.Assessment;

namespace QaService.Core.Ingest;

/// <summary>
/// One row read from a field file: a point in the request's own shape (so the JSON request's validator
/// judges it), where it came from, and what the receiver said about it, or the problem that stopped it
/// being read. Readers only read: units, frames and plausibility are judged later.
/// </summary>
/// <param name="Row">Line number (1-based) in line formats (CSV, GPX, NMEA); feature index (0-based) in GeoJSON.</param>
/// <param name="Point">The point, or null when <paramref name="Problem"/> is set.</param>
/// <param name="Receiver">Receiver metadata where the format carries it (NMEA GGA/GSA/GST/RMC, GPX fix/sat/dop).</param>
/// <param name="Problem">Why the row could not be read; the rest of the file is still read.</param>
public sealed record FieldRow(long Row, PointRecord? Point, ReceiverReport? Receiver = null, FieldProblem? Problem = null)
{
    public static FieldRow Bad(long row, string? field, string message) => new(row, null, null, new FieldProblem(field, message));
}

/// <summary>A row that cannot be read.</summary>
/// <param name="Field">Contract field name (<c>lat</c>, <c>time</c>…) when one field is at fault; null for the whole row.</param>
/// <param name="Message">What is wrong, naming the file's own column or sentence.</param>
public sealed record FieldProblem(string? Field, string Message);

/// <summary>
/// A file that cannot be read further (truncated XML, bytes that are not text, a line longer than the
/// limit): reading stops here. Carries the row where it happened.
/// </summary>
public sealed class FieldFileException(long row, string message) : Exception(message)
{
    public long Row { get; } = row;
}
