using QaService.Core.Geodesy;
using QaService.Core.Reporting;

namespace QaService.Core.Assessment;

/// <summary>
/// The residuals of one assessment as columns (struct of arrays): a row per pair, the mark and fix kept as their rows in
/// the validated input, the components as plain arrays. A 400,000-fix upload holds four double arrays and two int arrays
/// instead of 400,000 residual objects; the report writer renders the JSON straight from the columns
/// (<see cref="ResidualJsonBytes"/>), and the statistics read the arrays without copying them. Presents itself as the
/// report's residual list: a <see cref="Residual"/> is made only when one is asked for by index.
/// </summary>
public sealed class ResidualTable : IReadOnlyList<Residual>
{
    private readonly IReadOnlyList<FramedPoint> marks;
    private readonly FixTable fixes;

    private ResidualTable(IReadOnlyList<FramedPoint> marks, FixTable fixes, int[] markRows, int[] fixRows, double[] east, double[] north,
        double[] up, double[] horizontal, bool[]? byProximity, string?[]? excluded)
    {
        this.marks = marks;
        this.fixes = fixes;
        MarkRows = markRows;
        FixRows = fixRows;
        East = east;
        North = north;
        Up = up;
        Horizontal = horizontal;
        ByProximity = byProximity;
        Excluded = excluded;
    }

    public int Count => MarkRows.Length;

    /// <summary>Row in the input's marks of each residual's mark.</summary>
    internal int[] MarkRows { get; }

    /// <summary>Row in the input's fixes of each residual's fix.</summary>
    internal int[] FixRows { get; }

    /// <summary>dE, m.</summary>
    internal double[] East { get; }

    /// <summary>dN, m.</summary>
    internal double[] North { get; }

    /// <summary>dU, m; NaN where either side has no height (the residual's <c>dU</c> is null).</summary>
    internal double[] Up { get; }

    /// <summary>dH = sqrt(dE² + dN²), m.</summary>
    internal double[] Horizontal { get; }

    /// <summary>True where the pair was made by proximity; null when every pair was made by id.</summary>
    internal bool[]? ByProximity { get; }

    /// <summary>Reason each residual is left out of the statistics (null where it counts); null when none is.</summary>
    internal string?[]? Excluded { get; }

    public string MarkId(int row) => marks[MarkRows[row]].Id;

    public string FixId(int row) => fixes.Id(FixRows[row]);

    /// <summary>The fix id of residual <paramref name="row"/> as characters (no string for ids read from a file).</summary>
    public ReadOnlyMemory<char> FixIdText(int row) => fixes.IdText(FixRows[row]);

    public string PairedBy(int row) => ByProximity is { } p && p[row] ? MarkPairing.ByProximity : MarkPairing.ById;

    public string? ExclusionReason(int row) => Excluded?[row];

    public double? UpOrNull(int row) => double.IsNaN(Up[row]) ? null : Up[row];

    public GeodeticCoordinate MarkPosition(int row) => marks[MarkRows[row]].Geodetic;

    public FixAttributes? Attributes(int row) => fixes.Attributes(FixRows[row]);

    public Residual this[int index]
    {
        get
        {
            var mark = marks[MarkRows[index]];
            return new Residual(mark.Id, FixId(index), East[index], North[index], UpOrNull(index), Horizontal[index], PairedBy(index),
                ExclusionReason(index), mark.Geodetic.LatitudeDegrees, mark.Geodetic.LongitudeDegrees) { Attributes = Attributes(index) };
        }
    }

    public IEnumerator<Residual> GetEnumerator()
    {
        for (var i = 0; i < Count; i++)
            yield return this[i];
    }

    System.Collections.IEnumerator System.Collections.IEnumerable.GetEnumerator() => GetEnumerator();

    /// <summary>True when some residual is excluded from the statistics.</summary>
    public bool HasExclusions => Excluded is not null;

    /// <summary>
    /// Residual = fix − mark in east-north-up at the mark (<see cref="ResidualComputation"/>), one row per pair, computed side
    /// by side: each row is written by one worker only, so the table is the same whatever the scheduling. Each mark's
    /// rotation is worked out once (2,000 marks against 400,000 fixes).
    /// </summary>
    internal static ResidualTable Compute(ValidatedAssessment input, MarkPairing.PairRows pairs, GeocentricCoordinate[] markGeocentric, Ellipsoid ellipsoid)
    {
        var (marks, fixes) = (input.Marks, FixTable.Of(input.Fixes));
        var frames = new TopocentricFrame?[markGeocentric.Length];
        foreach (var row in pairs.MarkRows)
            frames[row] ??= TopocentricFrame.At(markGeocentric[row], marks[row].Geodetic);

        var n = pairs.MarkRows.Length;
        double[] east = new double[n], north = new double[n], up = new double[n], horizontal = new double[n];
        var exclusions = input.ExclusionReasonsByFixId;
        var excluded = exclusions.Count == 0 ? null : new string?[n];
        var reasonOf = ExclusionLookup(exclusions, fixes);
        ParallelWork.ForRanges(n, (start, end) =>
        {
            for (var i = start; i < end; i++)
            {
                var (mark, fix) = (marks[pairs.MarkRows[i]], pairs.FixRows[i]);
                var enu = ResidualComputation.Components(mark, fixes.Geodetic(fix), fixes.HasHeight(fix), frames[pairs.MarkRows[i]]!.Value, ellipsoid);
                (east[i], north[i], up[i]) = (enu.EastMetres, enu.NorthMetres, enu.UpMetres);
                horizontal[i] = Math.Sqrt(enu.EastMetres * enu.EastMetres + enu.NorthMetres * enu.NorthMetres);
                if (excluded is not null)
                    excluded[i] = reasonOf(fix);
            }
        });
        if (excluded is not null && Array.TrueForAll(excluded, reason => reason is null))
            excluded = null;
        return new ResidualTable(marks, fixes, pairs.MarkRows, pairs.FixRows, east, north, up, horizontal, pairs.ByProximity, excluded);
    }

    /// <summary>The exclusion reason of a fix row, looked up by the id's characters when the reasons are an ordinal dictionary (no string per fix).</summary>
    private static Func<int, string?> ExclusionLookup(IReadOnlyDictionary<string, string> exclusions, FixTable fixes)
    {
        if (exclusions is Dictionary<string, string> byId && byId.TryGetAlternateLookup<ReadOnlySpan<char>>(out var byText))
            return fix => byText.TryGetValue(fixes.IdText(fix).Span, out var reason) ? reason : null;
        return fix => exclusions.GetValueOrDefault(fixes.Id(fix));
    }

    /// <summary>The rows that count (not excluded), in order; this table itself when every row counts.</summary>
    internal ResidualTable Counted()
    {
        if (Excluded is null)
            return this;
        var keep = new List<int>(Count);
        for (var i = 0; i < Count; i++)
        {
            if (Excluded[i] is null)
                keep.Add(i);
        }
        T[] Take<T>(T[] column) => keep.Select(i => column[i]).ToArray();
        return new ResidualTable(marks, fixes, Take(MarkRows), Take(FixRows), Take(East), Take(North), Take(Up), Take(Horizontal),
            ByProximity is null ? null : Take(ByProximity), null);
    }

    /// <summary>The excluded rows as residual objects (few: a caller names them one by one).</summary>
    internal IEnumerable<Residual> ExcludedRows()
    {
        for (var i = 0; i < Count; i++)
        {
            if (Excluded?[i] is not null)
                yield return this[i];
        }
    }
}
