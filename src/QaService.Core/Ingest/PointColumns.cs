using QaService.Core.Assessment;

namespace QaService.Core.Ingest;

/// <summary>
/// A compact column store of read points: numbers in arrays (NaN for "not given"), so a million fixes
/// cost tens of megabytes rather than a million objects. Presents itself as the request's point list;
/// each <see cref="PointRecord"/> is made when asked for. Also keeps each point's row in its file.
/// </summary>
public sealed class PointColumns : IPointValueList
{
    private const long NoTime = long.MinValue;

    private readonly ChunkedColumn<long> rows = new();
    private readonly IdTexts ids = new();
    private readonly ChunkedColumn<string?> marks = new();
    private readonly Dictionary<string, string> markNames = new(StringComparer.Ordinal);
    private string? lastMark;
    // A column exists only once some point gives that field (a lat/lon/h file holds 3 of the 10), so absent fields cost nothing.
    private readonly ChunkedColumn<double>?[] numbers = new ChunkedColumn<double>?[NumberFields];
    private ChunkedColumn<long>? timeTicks;
    // Text attributes (featureClass, crew, receiver, quality), each a column only once some point gives it; values repeat, so one string per distinct value.
    private readonly ChunkedColumn<string?>?[] texts = new ChunkedColumn<string?>?[TextFields];
    private readonly Dictionary<string, string> textValues = new(StringComparer.Ordinal);
    internal const int NumberFields = 11;
    private const int TextFields = 4;

    /// <summary>Number fields holding a length (e, n, x, y, z, h, sigmaH, sigmaV), scaled by a file's length unit; hdop is not one.</summary>
    private const int FirstLengthField = 2, EndLengthFields = 10;

    public int Count => rows.Count;

    /// <summary>Row of point <paramref name="index"/> in its file (line, or GeoJSON feature index).</summary>
    public long RowOf(int index) => rows[index];

    /// <summary>Number fields in column order (the order of the values a reader adds).</summary>
    internal static IReadOnlyList<string> NumberFieldNames { get; } =
    [
        ContractFields.Lat, ContractFields.Lon, ContractFields.E, ContractFields.N, ContractFields.X,
        ContractFields.Y, ContractFields.Z, ContractFields.H, ContractFields.SigmaH, ContractFields.SigmaV, ContractFields.Hdop,
    ];

    public void Add(long row, PointRecord point) =>
        Append(row, point.Id, point.Mark is null ? null : Shared(point.Mark),
            [Given(point.Lat), Given(point.Lon), Given(point.E), Given(point.N), Given(point.X),
             Given(point.Y), Given(point.Z), Given(point.H), Given(point.SigmaH), Given(point.SigmaV), Given(point.Hdop)],
            point.Time?.UtcTicks, new AttributeTexts(point.FeatureClass, point.Crew, point.Receiver, point.Quality));

    /// <summary>A point read in place (CSV): empty text means not given; the mark is kept as one shared string per distinct id.</summary>
    /// <param name="numbers">The <see cref="NumberFieldNames"/> fields in order, NaN where not given (readers accept finite numbers only).</param>
    internal void Add(long row, ReadOnlySpan<char> id, ReadOnlySpan<char> mark, ReadOnlySpan<double> numbers, DateTimeOffset? time, AttributeTexts attributes) =>
        Append(row, id, mark.IsEmpty ? null : Shared(mark), numbers, time?.UtcTicks, attributes);

    /// <summary>The points' ids, read in place (validation keeps their locations rather than a string per fix).</summary>
    internal IdTexts Ids => ids;

    private void Append(long row, ReadOnlySpan<char> id, string? sharedMark, ReadOnlySpan<double> numbers, long? utcTicks, AttributeTexts attributes)
    {
        for (var field = 0; field < TextFields; field++)
        {
            var text = attributes[field];
            if (!text.IsEmpty)
                (texts[field] ??= ChunkedColumn<string?>.Filled(rows.Count, null)).Add(SharedText(text));
            else
                texts[field]?.Add(null);
        }
        var index = rows.Count;
        rows.Add(row);
        ids.Add(id);
        marks.Add(sharedMark);
        for (var field = 0; field < NumberFields; field++)
        {
            var value = numbers[field];
            if (!double.IsNaN(value))
                (this.numbers[field] ??= ChunkedColumn<double>.Filled(index, double.NaN)).Add(value);
            else
                this.numbers[field]?.Add(double.NaN);
        }
        if (utcTicks is { } ticks)
        {
            timeTicks ??= ChunkedColumn<long>.Filled(index, NoTime);
            timeTicks.Add(ticks);
        }
        else
            timeTicks?.Add(NoTime);
    }

    private static double Given(double? value) => value ?? double.NaN;

    /// <summary>Multiplies every length (not lat/lon) of every point by <paramref name="factor"/> (a file length unit to the CRS unit).</summary>
    public void ScaleLengths(double factor)
    {
        // e, n, x, y, z, h, sigmaH, sigmaV: every field but lat/lon holds a length.
        for (var field = FirstLengthField; field < EndLengthFields; field++)
        {
            if (numbers[field] is not { } column)
                continue;
            for (var i = 0; i < column.Count; i++)
                column[i] *= factor;
        }
    }

    public PointRecord? this[int index]
    {
        get
        {
            TryGetValues(index, out var p);
            return new PointRecord(p.Id, p.Mark, p.Lat, p.Lon, p.E, p.N, p.X, p.Y, p.Z, p.H, p.SigmaH, p.SigmaV, p.Time,
                p.FeatureClass, p.Crew, p.Receiver, p.Hdop, p.Quality);
        }
    }

    /// <summary>Point <paramref name="index"/> read from the columns (never null here).</summary>
    public bool TryGetValues(int index, out PointValues point)
    {
        ValuesWithoutId(index, out point);
        point = point with { Id = ids.StringOf(index) };
        return true;
    }

    /// <summary>Point <paramref name="index"/> without its id (<see cref="PointValues.Id"/> null): read that from <see cref="Ids"/>.</summary>
    internal void ValuesWithoutId(int index, out PointValues point)
    {
        var ticks = timeTicks?[index] ?? NoTime;
        point = new PointValues(null, marks[index], At(0, index), At(1, index), At(2, index), At(3, index), At(4, index),
            At(5, index), At(6, index), At(7, index), At(8, index), At(9, index),
            ticks == NoTime ? null : new DateTimeOffset(ticks, TimeSpan.Zero),
            texts[0]?[index], texts[1]?[index], texts[2]?[index], At(10, index), texts[3]?[index]);
    }

    private double? At(int field, int index) => numbers[field] is { } column && column[index] is var v && !double.IsNaN(v) ? v : null;

    /// <summary>A copy without the points at <paramref name="drop"/> (lenient reading).</summary>
    public PointColumns Without(IReadOnlySet<int> drop)
    {
        var kept = new PointColumns();
        for (var i = 0; i < Count; i++)
        {
            if (!drop.Contains(i))
                kept.Add(rows[i], this[i]!);
        }
        return kept;
    }

    public IEnumerator<PointRecord?> GetEnumerator()
    {
        for (var i = 0; i < Count; i++)
            yield return this[i];
    }

    System.Collections.IEnumerator System.Collections.IEnumerable.GetEnumerator() => GetEnumerator();

    /// <summary>Attribute values repeat across fixes (a handful of classes, crews, receivers): one string per distinct value.</summary>
    private string SharedText(ReadOnlySpan<char> text)
    {
        var byText = textValues.GetAlternateLookup<ReadOnlySpan<char>>();
        if (!byText.TryGetValue(text, out var value))
        {
            value = text.ToString();
            textValues[value] = value;
        }
        return value;
    }

    /// <summary>Mark ids repeat across fixes: keep one string per distinct id.</summary>
    private string Shared(string mark)
    {
        if (markNames.TryGetValue(mark, out var existing))
            return existing;
        markNames[mark] = mark;
        return mark;
    }

    /// <summary>
    /// As <see cref="Shared(string)"/>, looked up by the text itself so a repeated id costs no string; a run of fixes
    /// on one mark (repeat occupations are often logged together) is recognised without a lookup.
    /// </summary>
    private string Shared(ReadOnlySpan<char> mark)
    {
        if (lastMark is { } last && mark.SequenceEqual(last))
            return last;
        var byText = markNames.GetAlternateLookup<ReadOnlySpan<char>>();
        if (!byText.TryGetValue(mark, out var name))
        {
            name = mark.ToString();
            markNames[name] = name;
        }
        lastMark = name;
        return name;
    }
}
