using QaService.Core.Reporting;
using QaService.Core.Statistics;

namespace QaService.Core.Assessment;

/// <summary>
/// The residuals that count, as plain arrays taken once per assessment: the statistics, the checks and the report
/// blocks read these spans instead of each projecting the residual list again (every projection of a 400,000-residual
/// list cost a few milliseconds). A <see cref="ResidualTable"/>'s own arrays are shared, any other list's values are
/// copied unchanged, in residual order either way, so every sum sees the same numbers in the same order. Shared results (the tested marks, Hotelling's test of the mean) are computed
/// once, on first use, safely from any thread.
/// </summary>
internal sealed class ResidualColumns
{
    private readonly Lazy<List<FramedPoint>> testedMarks;
    private readonly Lazy<HotellingResult?> meanOffsetTest;

    private ResidualColumns(IReadOnlyList<FramedPoint> marks, IReadOnlyList<Residual> rows, MarkGroups groups)
    {
        Rows = rows;
        Groups = groups;
        if (rows is ResidualTable table && !table.HasExclusions)
            (East, North, Radial, Up, UpRows) = ShareColumns(table);
        else
            (East, North, Radial, Up, UpRows) = CopyColumns(rows);
        testedMarks = new(() => Assessment.TestedMarks.Of(marks, groups));
        meanOffsetTest = new(() => rows.Count >= 3 ? HotellingTest.AgainstZero(East, North, Diagnosis.BiasCheck.SignificanceLevel) : null);
    }

    /// <summary>A table's own arrays (read only here, never written), dU compacted only when some residual has none.</summary>
    private static (double[], double[], double[], double[], int[]) ShareColumns(ResidualTable table)
    {
        var withHeight = 0;
        foreach (var up in table.Up)
            withHeight += double.IsNaN(up) ? 0 : 1;
        if (withHeight == table.Count)
            return (table.East, table.North, table.Horizontal, table.Up, Enumerable.Range(0, withHeight).ToArray());
        var (compactUp, upRows) = (new double[withHeight], new int[withHeight]);
        for (int i = 0, j = 0; i < table.Count; i++)
        {
            if (!double.IsNaN(table.Up[i]))
            {
                compactUp[j] = table.Up[i];
                upRows[j++] = i;
            }
        }
        return (table.East, table.North, table.Horizontal, compactUp, upRows);
    }

    private static (double[], double[], double[], double[], int[]) CopyColumns(IReadOnlyList<Residual> rows)
    {
        var n = rows.Count;
        double[] east = new double[n], north = new double[n], radial = new double[n];
        var withHeight = 0;
        for (var i = 0; i < n; i++)
        {
            var r = rows[i];
            east[i] = r.DE;
            north[i] = r.DN;
            radial[i] = r.DH;
            withHeight += r.DU is null ? 0 : 1;
        }
        var (up, upRows) = (new double[withHeight], new int[withHeight]);
        for (int i = 0, j = 0; i < n; i++)
        {
            if (rows[i].DU is { } value)
            {
                up[j] = value;
                upRows[j++] = i;
            }
        }
        return (east, north, radial, up, upRows);
    }

    /// <summary>The attributes of residual <paramref name="row"/>'s fix, read from the table when there is one (no residual object made).</summary>
    public FixAttributes? AttributesOf(int row) => Rows is ResidualTable table ? table.Attributes(row) : Rows[row].Attributes;

    /// <summary>The fix id of residual <paramref name="row"/>.</summary>
    public string FixIdOf(int row) => Rows is ResidualTable table ? table.FixId(row) : Rows[row].Fix;

    /// <summary>The fix id of residual <paramref name="row"/> as characters (no string made for an id read from a file).</summary>
    public ReadOnlySpan<char> FixIdTextOf(int row) => Rows is ResidualTable table ? table.FixIdText(row).Span : Rows[row].Fix;

    /// <summary>The mark id of residual <paramref name="row"/>.</summary>
    public string MarkIdOf(int row) => Rows is ResidualTable table ? table.MarkId(row) : Rows[row].Mark;

    /// <summary>The latitude and longitude of residual <paramref name="row"/>'s mark, degrees (the residual's markLatitude/markLongitude).</summary>
    public (double Latitude, double Longitude) MarkLatLonOf(int row)
    {
        if (Rows is ResidualTable table)
        {
            var g = table.MarkPosition(row);
            return (g.LatitudeDegrees, g.LongitudeDegrees);
        }
        return (Rows[row].MarkLatitude, Rows[row].MarkLongitude);
    }

    /// <summary>The residuals, in the order of every column.</summary>
    public IReadOnlyList<Residual> Rows { get; }

    /// <summary>dE of every residual, m.</summary>
    public double[] East { get; }

    /// <summary>dN of every residual, m.</summary>
    public double[] North { get; }

    /// <summary>dH of every residual as the residual holds it, m.</summary>
    public double[] Radial { get; }

    /// <summary>dU of the residuals that have one, in residual order, m.</summary>
    public double[] Up { get; }

    /// <summary>For each value of <see cref="Up"/>, the index of its residual in <see cref="Rows"/>.</summary>
    public int[] UpRows { get; }

    /// <summary>The residuals grouped by mark.</summary>
    public MarkGroups Groups { get; }

    /// <summary>The marks the residuals test, in request order (<see cref="Assessment.TestedMarks"/>).</summary>
    public List<FramedPoint> TestedMarks => testedMarks.Value;

    /// <summary>Hotelling's T² test of the mean (dE, dN) against zero at the bias check's level; null for n &lt; 3 or singular spread.</summary>
    public HotellingResult? MeanOffsetTest => meanOffsetTest.Value;

    /// <summary>Columns of residuals whose marks' rows are known (the runner's case: no lookup by id).</summary>
    public static ResidualColumns Of(IReadOnlyList<FramedPoint> marks, IReadOnlyList<Residual> rows, MarkGroups groups) => new(marks, rows, groups);

    /// <summary>Columns of any residual list, grouped by mark id.</summary>
    public static ResidualColumns Of(IReadOnlyList<FramedPoint> marks, IReadOnlyList<Residual> rows) => new(marks, rows, MarkGroups.ById(rows));
}
