using QaService.Core.Reporting;
using QaService.Core.Statistics;

namespace QaService.Core.Assessment;

/// <summary>
/// The residuals that count, as plain arrays taken once per assessment: the statistics, the checks and the report
/// blocks read these spans instead of each projecting the residual list again (every projection of a 400,000-residual
/// list cost a few milliseconds). The values are copied unchanged and in residual order, so every sum sees the same
/// numbers in the same order as before. Shared results (the tested marks, Hotelling's test of the mean) are computed
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
        var n = rows.Count;
        East = new double[n];
        North = new double[n];
        Radial = new double[n];
        var withHeight = 0;
        for (var i = 0; i < n; i++)
        {
            var r = rows[i];
            East[i] = r.DE;
            North[i] = r.DN;
            Radial[i] = r.DH;
            withHeight += r.DU is null ? 0 : 1;
        }
        Up = new double[withHeight];
        UpRows = new int[withHeight];
        for (int i = 0, j = 0; i < n; i++)
        {
            if (rows[i].DU is { } up)
            {
                Up[j] = up;
                UpRows[j++] = i;
            }
        }
        testedMarks = new(() => Assessment.TestedMarks.Of(marks, groups));
        meanOffsetTest = new(() => rows.Count >= 3 ? HotellingTest.AgainstZero(East, North, Diagnosis.BiasCheck.SignificanceLevel) : null);
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
