using QaService.Core.Assessment;

namespace QaService.Core.Ingest;

/// <summary>
/// A compact column store of read points: numbers in arrays (NaN for "not given"), so a million fixes
/// cost tens of megabytes rather than a million objects. Presents itself as the request's point list;
/// each <see cref="PointRecord"/> is made when asked for. Also keeps each point's row in its file.
/// </summary>
public sealed class PointColumns : IReadOnlyList<PointRecord?>
{
    private const long NoTime = long.MinValue;

    private readonly ChunkedColumn<long> rows = new();
    private readonly ChunkedColumn<string?> ids = new();
    private readonly ChunkedColumn<string?> marks = new();
    private readonly Dictionary<string, string> markNames = new(StringComparer.Ordinal);
    // A column exists only once some point gives that field (a lat/lon/h file holds 3 of the 10), so absent fields cost nothing.
    private readonly ChunkedColumn<double>?[] numbers = new ChunkedColumn<double>?[NumberFields];
    private ChunkedColumn<long>? timeTicks;
    private const int NumberFields = 10;

    public int Count => rows.Count;

    /// <summary>Row of point <paramref name="index"/> in its file (line, or GeoJSON feature index).</summary>
    public long RowOf(int index) => rows[index];

    public void Add(long row, PointRecord point)
    {
        var index = rows.Count;
        rows.Add(row);
        ids.Add(point.Id);
        marks.Add(point.Mark is null ? null : Shared(point.Mark));
        AddNumber(0, index, point.Lat);
        AddNumber(1, index, point.Lon);
        AddNumber(2, index, point.E);
        AddNumber(3, index, point.N);
        AddNumber(4, index, point.X);
        AddNumber(5, index, point.Y);
        AddNumber(6, index, point.Z);
        AddNumber(7, index, point.H);
        AddNumber(8, index, point.SigmaH);
        AddNumber(9, index, point.SigmaV);
        if (point.Time is { } time)
        {
            timeTicks ??= ChunkedColumn<long>.Filled(index, NoTime);
            timeTicks.Add(time.UtcTicks);
        }
        else
            timeTicks?.Add(NoTime);
    }

    private void AddNumber(int field, int index, double? value)
    {
        if (value is { } v)
            (numbers[field] ??= ChunkedColumn<double>.Filled(index, double.NaN)).Add(v);
        else
            numbers[field]?.Add(double.NaN);
    }


    /// <summary>Multiplies every length (not lat/lon) of every point by <paramref name="factor"/> (a file length unit to the CRS unit).</summary>
    public void ScaleLengths(double factor)
    {
        // e, n, x, y, z, h, sigmaH, sigmaV: every field but lat/lon holds a length.
        for (var field = 2; field < NumberFields; field++)
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
            double? At(int field) => numbers[field] is { } column && column[index] is var v && !double.IsNaN(v) ? v : null;
            var ticks = timeTicks?[index] ?? NoTime;
            return new PointRecord(ids[index], marks[index], At(0), At(1), At(2), At(3), At(4), At(5), At(6), At(7), At(8), At(9),
                ticks == NoTime ? null : new DateTimeOffset(ticks, TimeSpan.Zero));
        }
    }

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

    /// <summary>Mark ids repeat across fixes: keep one string per distinct id.</summary>
    private string Shared(string mark)
    {
        if (markNames.TryGetValue(mark, out var existing))
            return existing;
        markNames[mark] = mark;
        return mark;
    }
}
