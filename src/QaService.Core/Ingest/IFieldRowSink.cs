using QaService.Core.Assessment;

namespace QaService.Core.Ingest;

/// <summary>
/// Where a reader that works in place (CSV) puts each row as it is read: a point's fields straight from the
/// line, or the row's problem. Spares a large upload one record object per row.
/// </summary>
internal interface IFieldRowSink
{
    /// <param name="row">Line number (1-based).</param>
    /// <param name="id">The id text, trimmed; empty when not given.</param>
    /// <param name="mark">The mark text, trimmed; empty when not given.</param>
    /// <param name="numbers">The <see cref="PointColumns.NumberFieldNames"/> fields in order, NaN where not given.</param>
    /// <param name="time">The time, when given.</param>
    /// <param name="attributes">The fix's text attributes, each empty when not given.</param>
    void Point(long row, ReadOnlySpan<char> id, ReadOnlySpan<char> mark, ReadOnlySpan<double> numbers, DateTimeOffset? time, AttributeTexts attributes);

    /// <param name="row">Line number (1-based).</param>
    /// <param name="problem">Why the row could not be read.</param>
    void Problem(long row, FieldProblem problem);
}

/// <summary>Collects rows as <see cref="FieldRow"/>s, in file order (for callers that want whole records).</summary>
internal sealed class FieldRowList : IFieldRowSink
{
    public List<FieldRow> Rows { get; } = [];

    public void Point(long row, ReadOnlySpan<char> id, ReadOnlySpan<char> mark, ReadOnlySpan<double> numbers, DateTimeOffset? time, AttributeTexts attributes)
    {
        var n = new double?[numbers.Length];
        for (var field = 0; field < numbers.Length; field++)
            n[field] = double.IsNaN(numbers[field]) ? null : numbers[field];
        Rows.Add(new FieldRow(row, new PointRecord(
            id.IsEmpty ? null : id.ToString(), mark.IsEmpty ? null : mark.ToString(),
            n[0], n[1], n[2], n[3], n[4], n[5], n[6], n[7], n[8], n[9], time,
            AttributeTexts.Text(attributes.FeatureClass), AttributeTexts.Text(attributes.Crew), AttributeTexts.Text(attributes.Receiver), n[10],
            AttributeTexts.Text(attributes.Quality))));
    }

    public void Problem(long row, FieldProblem problem) => Rows.Add(new FieldRow(row, null, null, problem));
}

/// <summary>The text attributes of one row read in place: feature class, crew, receiver and fix quality, each empty when not given.</summary>
internal readonly ref struct AttributeTexts(ReadOnlySpan<char> featureClass, ReadOnlySpan<char> crew, ReadOnlySpan<char> receiver, ReadOnlySpan<char> quality)
{
    public ReadOnlySpan<char> FeatureClass { get; } = featureClass;
    public ReadOnlySpan<char> Crew { get; } = crew;
    public ReadOnlySpan<char> Receiver { get; } = receiver;
    public ReadOnlySpan<char> Quality { get; } = quality;

    public ReadOnlySpan<char> this[int index] => index switch { 0 => FeatureClass, 1 => Crew, 2 => Receiver, _ => Quality };

    public static string? Text(ReadOnlySpan<char> text) => text.IsEmpty ? null : text.ToString();
}
