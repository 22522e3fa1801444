using System.Globalization;
using QaService.Core.Geodesy;
using QaService.Core.Ingest;

namespace QaService.Core.Assessment;

/// <summary>
/// Validated fixes as columns (struct of arrays): position, height flag, ids and the rarely given fields each in an
/// array, the latter only once some fix gives one. A 1,000,000-fix upload holds a handful of arrays instead of a million
/// point objects; frame alignment moves the fixes by writing the position columns in place. Presents itself as the
/// request's fix list: a <see cref="FramedPoint"/> is made only when one is asked for by index (tests, small paths);
/// the pairing, the residuals and the checks read the columns. The ids of fixes read from a file stay in the file's
/// <see cref="IdTexts"/> chunks (a location per row, no string per fix); ids from JSON points are kept as their strings.
/// </summary>
public sealed class FixTable : IReadOnlyList<FramedPoint>
{
    private const long NoTime = long.MinValue;

    private readonly int[] indexes;
    private readonly string[]? ids;
    private readonly IdCharacters? idSource;
    private readonly long[]? idLocations;
    private readonly string?[] markIds;
    private readonly double[] latitudes, longitudes, heights;
    private readonly bool[] hasHeight;
    private double[]? sigmaHorizontal, sigmaVertical;
    private long[]? timeTicks;
    private FixAttributes?[]? attributes;

    /// <summary>An empty table of <paramref name="count"/> rows, filled row by row (each row by one writer).</summary>
    /// <param name="idSource">Where the fixes' ids are when they were read from a file (rows then set with <see cref="SetIdAt"/>).</param>
    internal FixTable(int count, IdCharacters? idSource = null)
    {
        indexes = new int[count];
        if (idSource is null)
            ids = new string[count];
        else
            (this.idSource, idLocations) = (idSource, new long[count]);
        markIds = new string?[count];
        latitudes = new double[count];
        longitudes = new double[count];
        heights = new double[count];
        hasHeight = new bool[count];
    }

    public int Count => indexes.Length;

    /// <summary>The columns of any fix list: the list itself when it is a table, else a copy (tests and small requests).</summary>
    public static FixTable Of(IReadOnlyList<FramedPoint> fixes)
    {
        if (fixes is FixTable table)
            return table;
        var copy = new FixTable(fixes.Count);
        for (var i = 0; i < fixes.Count; i++)
            copy.Set(i, fixes[i]);
        return copy;
    }

    /// <summary>Writes row <paramref name="row"/>; rows may be written side by side, each by one thread.</summary>
    internal void Set(int row, FramedPoint fix)
    {
        Set(row, fix.Index, fix.Id, fix.MarkId, fix.Geodetic, fix.HasHeight);
        SetExtras(row, fix.SigmaHorizontalMetres, fix.SigmaVerticalMetres, fix.Time, fix.Attributes);
    }

    internal void Set(int row, int index, string id, string? markId, GeodeticCoordinate geodetic, bool withHeight)
    {
        Set(row, index, markId, geodetic, withHeight);
        (ids ?? throw new InvalidOperationException("a table of a file's ids is written with SetIdAt"))[row] = id;
    }

    /// <summary>
    /// Writes row <paramref name="row"/> of a table whose ids are in its <see cref="IdTexts"/>: the id at
    /// <paramref name="idLocation"/>; <see cref="IdTexts.None"/> for a fix that gave none (its id is generated from the index).
    /// </summary>
    internal void SetIdAt(int row, int index, long idLocation, string? markId, GeodeticCoordinate geodetic, bool withHeight)
    {
        Set(row, index, markId, geodetic, withHeight);
        idLocations![row] = idLocation;
    }

    private void Set(int row, int index, string? markId, GeodeticCoordinate geodetic, bool withHeight)
    {
        indexes[row] = index;
        markIds[row] = markId;
        SetGeodetic(row, geodetic);
        hasHeight[row] = withHeight;
    }

    /// <summary>Makes the sparse columns a row needs (once; rows are written side by side, so the first to need one makes it under a lock).</summary>
    private void Reserve(bool sigmaH, bool sigmaV, bool time, bool withAttributes)
    {
        if ((!sigmaH || sigmaHorizontal is not null) && (!sigmaV || sigmaVertical is not null) && (!time || timeTicks is not null)
            && (!withAttributes || attributes is not null))
            return;
        lock (indexes)
            ReserveLocked(sigmaH, sigmaV, time, withAttributes);
    }

    private void ReserveLocked(bool sigmaH, bool sigmaV, bool time, bool withAttributes)
    {
        if (sigmaH && sigmaHorizontal is null)
            sigmaHorizontal = Filled(double.NaN);
        if (sigmaV && sigmaVertical is null)
            sigmaVertical = Filled(double.NaN);
        if (time && timeTicks is null)
            timeTicks = Filled(NoTime);
        if (withAttributes && attributes is null)
            attributes = new FixAttributes?[Count];
    }

    /// <summary>Writes the sparse fields of a row (nothing when none is given).</summary>
    internal void SetExtras(int row, double? sigmaH, double? sigmaV, DateTimeOffset? time, FixAttributes? fixAttributes)
    {
        if (sigmaH is null && sigmaV is null && time is null && fixAttributes is null)
            return;
        Reserve(sigmaH is not null, sigmaV is not null, time is not null, fixAttributes is not null);
        if (sigmaH is { } sh)
            sigmaHorizontal![row] = sh;
        if (sigmaV is { } sv)
            sigmaVertical![row] = sv;
        if (time is { } t)
            timeTicks![row] = t.UtcTicks;
        if (fixAttributes is not null)
            attributes![row] = fixAttributes;
    }

    private T[] Filled<T>(T value)
    {
        var column = new T[Count];
        Array.Fill(column, value);
        return column;
    }

    public string Id(int row) => ids?[row] ?? (idLocations![row] == IdTexts.None ? GeneratedIdOf(indexes[row]) : IdText(row).ToString());

    /// <summary>The fix's id as characters, without a string when the table holds the file's ids (the report writer, lookups by id).</summary>
    public ReadOnlyMemory<char> IdText(int row)
    {
        if (ids is not null)
            return ids[row].AsMemory();
        var location = idLocations![row];
        return location == IdTexts.None ? GeneratedIdOf(indexes[row]).AsMemory() : idSource!.Memory(location);
    }

    /// <summary>The id given to a fix without one: "#" and its 1-based position in the set.</summary>
    internal static string GeneratedIdOf(int index) => string.Create(CultureInfo.InvariantCulture, $"#{index + 1}");

    public string? MarkId(int row) => markIds[row];

    public GeodeticCoordinate Geodetic(int row) => new(latitudes[row], longitudes[row], heights[row]);

    /// <summary>Moves fix <paramref name="row"/> (frame alignment writes the aligned position in place).</summary>
    internal void SetGeodetic(int row, GeodeticCoordinate geodetic) =>
        (latitudes[row], longitudes[row], heights[row]) = (geodetic.LatitudeDegrees, geodetic.LongitudeDegrees, geodetic.EllipsoidalHeightMetres);

    public bool HasHeight(int row) => hasHeight[row];

    public FixAttributes? Attributes(int row) => attributes?[row];

    /// <summary>The fix's time, or null when it has none.</summary>
    public DateTimeOffset? Time(int row) => timeTicks is { } t && t[row] != NoTime ? new DateTimeOffset(t[row], TimeSpan.Zero) : null;

    /// <summary>True when some fix carries a time.</summary>
    public bool AnyTime => timeTicks is not null;

    /// <summary>Latitudes of every fix, degrees (read only).</summary>
    public ReadOnlySpan<double> Latitudes => latitudes;

    /// <summary>Longitudes of every fix, degrees (read only).</summary>
    public ReadOnlySpan<double> Longitudes => longitudes;

    public FramedPoint this[int index] =>
        new(indexes[index], Id(index), markIds[index], Geodetic(index), hasHeight[index], Value(sigmaHorizontal, index), Value(sigmaVertical, index), Time(index))
        {
            Attributes = Attributes(index),
        };

    private static double? Value(double[]? column, int row) => column is { } c && !double.IsNaN(c[row]) ? c[row] : null;

    public IEnumerator<FramedPoint> GetEnumerator()
    {
        for (var i = 0; i < Count; i++)
            yield return this[i];
    }

    System.Collections.IEnumerator System.Collections.IEnumerable.GetEnumerator() => GetEnumerator();

    /// <summary>The rows at <paramref name="rows"/>, in that order (a reading that skipped points: only when it also reported a problem).</summary>
    internal FixTable Take(IReadOnlyList<int> rows)
    {
        var kept = new FixTable(rows.Count);
        for (var k = 0; k < rows.Count; k++)
            kept.Set(k, this[rows[k]]);
        return kept;
    }
}
