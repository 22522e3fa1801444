using System.Collections.Concurrent;
using QaService.Core.Geodesy;

namespace QaService.Core.Assessment;

/// <summary>A fix and the mark it is tested against (a value: a large upload holds one per fix, so no object each).</summary>
/// <param name="PairedBy"><c>id</c> or <c>proximity</c>.</param>
/// <param name="AlsoWithinRadius">Proximity pairing only: other marks within the radius (the pairing is ambiguous); null when none.</param>
public readonly record struct MarkFixPair(FramedPoint Mark, FramedPoint Fix, string PairedBy, IReadOnlyList<string>? AlsoWithinRadius = null);

/// <summary>
/// Pairs fixes with marks (api-v1: by <c>mark</c> id; otherwise, when pairing is requested, with the
/// nearest mark within the radius; otherwise unpaired). Several fixes may pair with one mark.
/// </summary>
public static class MarkPairing
{
    public const string ById = "id";
    public const string ByProximity = "proximity";

    /// <summary>
    /// Horizontal distance is measured in the local east-north-up frame at each candidate mark, with
    /// the fix taken at the mark's height so height differences do not count (common practice); a fix on the far side
    /// of the Earth from a mark is never within its radius (<see cref="MarkNeighbourhood"/>).
    /// </summary>
    public static (IReadOnlyList<MarkFixPair> Pairs, int Unpaired) Pair(ValidatedAssessment assessment, IReadOnlyList<GeocentricCoordinate> markGeocentric)
    {
        var rows = PairByRows(assessment, markGeocentric);
        var pairs = new List<MarkFixPair>(rows.MarkRows.Length);
        for (var i = 0; i < rows.MarkRows.Length; i++)
        {
            var (mark, fix) = (assessment.Marks[rows.MarkRows[i]], assessment.Fixes[rows.FixRows[i]]);
            pairs.Add(rows.ByProximity is { } near && near[i]
                ? new MarkFixPair(mark, fix, ByProximity, rows.AmbiguousByPair.GetValueOrDefault(i))
                : new MarkFixPair(mark, fix, ById));
        }
        return (pairs, rows.Unpaired);
    }

    /// <summary>
    /// The pairs as rows (no object per pair): for pair i, the row of its mark in <c>Marks</c> and of its fix in <c>Fixes</c>,
    /// in fix order.
    /// </summary>
    /// <param name="ByProximity">True where pair i was made by proximity; null when every pair was made by id.</param>
    /// <param name="AmbiguousByPair">Proximity pairs with other marks within the radius: pair index → those marks' ids.</param>
    internal sealed record PairRows(int[] MarkRows, int[] FixRows, bool[]? ByProximity, IReadOnlyDictionary<int, List<string>> AmbiguousByPair, int Unpaired);

    internal static PairRows PairByRows(ValidatedAssessment assessment, IReadOnlyList<GeocentricCoordinate> markGeocentric)
    {
        var marksById = new Dictionary<string, int>(StringComparer.Ordinal);
        for (var i = 0; i < assessment.Marks.Count; i++)
            marksById[assessment.Marks[i].Id] = i;

        var fixes = FixTable.Of(assessment.Fixes);
        // Each fix's mark is found side by side (reads only, one slot per fix): a named mark's row, a nearby mark's row
        // coded as NearbyCode(row), or Unpaired. The pairs are then made in fix order, each fix's row moved down to its
        // pair's slot (never above the fix's own index, so nothing is overwritten early).
        var markRows = new int[fixes.Count];
        var nearby = assessment.PairingRadiusMetres is { } radius && assessment.Marks.Count > 0
            ? new MarkNeighbourhood(assessment.Marks, markGeocentric, assessment.MarksFrame.Crs.Ellipsoid, radius)
            : null;
        // Rare (marks closer together than the radius), so kept aside rather than one slot per fix.
        var ambiguous = new ConcurrentDictionary<int, List<string>>();
        ParallelWork.ForRanges(fixes.Count, (start, end) =>
        {
            var candidates = new List<int>();
            for (var i = start; i < end; i++)
            {
                if (fixes.MarkId(i) is { } markId && marksById.TryGetValue(markId, out var row))
                {
                    markRows[i] = row;
                    continue;
                }
                var (nearest, others) = nearby?.Nearest(fixes.Geodetic(i), candidates) ?? (-1, null);
                markRows[i] = nearest < 0 ? Unpaired : NearbyCode(nearest);
                if (others is not null)
                    ambiguous[i] = others;
            }
        });
        var fixRows = new int[fixes.Count];
        bool[]? byProximity = null;
        var ambiguousByPair = new Dictionary<int, List<string>>();
        var count = 0;
        for (var f = 0; f < fixes.Count; f++)
        {
            var code = markRows[f];
            if (code == Unpaired)
                continue;
            if (code < 0)
            {
                (byProximity ??= new bool[fixes.Count])[count] = true;
                if (ambiguous.TryGetValue(f, out var others))
                    ambiguousByPair[count] = others;
            }
            markRows[count] = code >= 0 ? code : NearbyCode(code);
            fixRows[count++] = f;
        }
        if (count < fixes.Count)
        {
            Array.Resize(ref markRows, count);
            Array.Resize(ref fixRows, count);
            if (byProximity is not null)
                Array.Resize(ref byProximity, count);
        }
        return new PairRows(markRows, fixRows, byProximity, ambiguousByPair, fixes.Count - count);
    }

    /// <summary>Slot value of a fix that pairs with no mark.</summary>
    private const int Unpaired = -1;

    /// <summary>Slot value of a fix paired by proximity with mark <paramref name="row"/> (−2 − row; its own inverse).</summary>
    private static int NearbyCode(int row) => -2 - row;
}
