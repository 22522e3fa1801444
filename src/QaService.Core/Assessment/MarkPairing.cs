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
        var (pairs, _, unpaired) = PairWithRows(assessment, markGeocentric);
        return (pairs, unpaired);
    }

    /// <summary>As <see cref="Pair"/>, with the row in <c>Marks</c> of each pair's mark (so no caller looks the id up again).</summary>
    internal static (List<MarkFixPair> Pairs, int[] MarkRows, int Unpaired) PairWithRows(ValidatedAssessment assessment, IReadOnlyList<GeocentricCoordinate> markGeocentric)
    {
        var marksById = new Dictionary<string, int>(StringComparer.Ordinal);
        for (var i = 0; i < assessment.Marks.Count; i++)
            marksById[assessment.Marks[i].Id] = i;

        var fixes = assessment.Fixes;
        var pairs = new List<MarkFixPair>(fixes.Count);
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
                if (fixes[i].MarkId is { } markId && marksById.TryGetValue(markId, out var row))
                {
                    markRows[i] = row;
                    continue;
                }
                var (nearest, others) = nearby?.Nearest(fixes[i], candidates) ?? (-1, null);
                markRows[i] = nearest < 0 ? Unpaired : NearbyCode(nearest);
                if (others is not null)
                    ambiguous[i] = others;
            }
        });
        var unpaired = 0;
        for (var f = 0; f < fixes.Count; f++)
        {
            var code = markRows[f];
            if (code == Unpaired)
            {
                unpaired++;
                continue;
            }
            var byId = code >= 0;
            var row = byId ? code : NearbyCode(code);
            markRows[pairs.Count] = row;
            pairs.Add(byId
                ? new MarkFixPair(assessment.Marks[row], fixes[f], ById)
                : new MarkFixPair(assessment.Marks[row], fixes[f], ByProximity, ambiguous.GetValueOrDefault(f)));
        }
        if (pairs.Count < markRows.Length)
            Array.Resize(ref markRows, pairs.Count);
        return (pairs, markRows, unpaired);
    }

    /// <summary>Slot value of a fix that pairs with no mark.</summary>
    private const int Unpaired = -1;

    /// <summary>Slot value of a fix paired by proximity with mark <paramref name="row"/> (−2 − row; its own inverse).</summary>
    private static int NearbyCode(int row) => -2 - row;
}
