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

    private readonly List<long> rows = [];
    private readonly List<string?> ids = [];
    private readonly List<string?> marks = [];
    private readonly Dictionary<string, string> markNames = new(StringComparer.Ordinal);
    private readonly List<double>[] numbers = Enumerable.Range(0, NumberFields).Select(_ => new List<double>()).ToArray();
    private readonly List<long> timeTicks = [];
    private const int NumberFields = 10;

    public int Count => rows.Count;

    /// <summary>Row of point <paramref name="index"/> in its file (line, or GeoJSON feature index).</summary>
    public long RowOf(int index) => rows[index];

    public void Add(long row, PointRecord point)
    {
        rows.Add(row);
        ids.Add(point.Id);
        marks.Add(point.Mark is null ? null : Shared(point.Mark));
        double?[] values = [point.Lat, point.Lon, point.E, point.N, point.X, point.Y, point.Z, point.H, point.SigmaH, point.SigmaV];
        for (var i = 0; i < NumberFields; i++)
            numbers[i].Add(values[i] ?? double.NaN);
        timeTicks.Add(point.Time?.UtcTicks ?? NoTime);
    }

    /// <summary>Multiplies every length (not lat/lon) of every point by <paramref name="factor"/> (a file length unit to the CRS unit).</summary>
    public void ScaleLengths(double factor)
    {
        // e, n, x, y, z, h, sigmaH, sigmaV: every field but lat/lon holds a length.
        for (var field = 2; field < NumberFields; field++)
        {
            var column = numbers[field];
            for (var i = 0; i < column.Count; i++)
                column[i] *= factor;
        }
    }

    public PointRecord? this[int index]
    {
        get
        {
            double? At(int field) => numbers[field][index] is var v && double.IsNaN(v) ? null : v;
            var ticks = timeTicks[index];
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
