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
    /// the fix taken at the mark's height so height differences do not count (common practice).
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
        // The named marks are looked up side by side (reads only, one slot per fix); the pairs are then made in fix order,
        // each fix's row moved down to its pair's slot (never above the fix's own index, so nothing is overwritten early).
        var markRows = new int[fixes.Count];
        ParallelWork.ForRanges(fixes.Count, (start, end) =>
        {
            for (var i = start; i < end; i++)
                markRows[i] = fixes[i].MarkId is { } markId && marksById.TryGetValue(markId, out var row) ? row : -1;
        });
        var unpaired = 0;
        for (var f = 0; f < fixes.Count; f++)
        {
            var fix = fixes[f];
            if (markRows[f] is var byId and >= 0)
            {
                markRows[pairs.Count] = byId;
                pairs.Add(new MarkFixPair(assessment.Marks[byId], fix, ById));
                continue;
            }
            var (nearest, others) = assessment.PairingRadiusMetres is { } radius
                ? NearestWithin(assessment, markGeocentric, fix, radius)
                : (-1, null);
            if (nearest < 0)
                unpaired++;
            else
            {
                markRows[pairs.Count] = nearest;
                pairs.Add(new MarkFixPair(assessment.Marks[nearest], fix, ByProximity, others));
            }
        }
        if (pairs.Count < markRows.Length)
            Array.Resize(ref markRows, pairs.Count);
        return (pairs, markRows, unpaired);
    }

    /// <summary>The nearest mark within the radius (nearest wins) and the ids of any other marks also within it.</summary>
    private static (int Nearest, List<string>? Others) NearestWithin(ValidatedAssessment assessment, IReadOnlyList<GeocentricCoordinate> markGeocentric, FramedPoint fix, double radiusMetres)
    {
        var best = -1;
        var bestDistance = double.PositiveInfinity;
        var within = 0;
        for (var i = 0; i < assessment.Marks.Count; i++)
        {
            var mark = assessment.Marks[i];
            var fixAtMarkHeight = fix.Geodetic with { EllipsoidalHeightMetres = mark.Geodetic.EllipsoidalHeightMetres };
            var enu = LocalTangentPlane.Difference(markGeocentric[i], mark.Geodetic,
                GeocentricConversion.ToGeocentric(fixAtMarkHeight, assessment.MarksFrame.Crs.Ellipsoid));
            var distance = Math.Sqrt(enu.EastMetres * enu.EastMetres + enu.NorthMetres * enu.NorthMetres);
            if (distance > radiusMetres)
                continue;
            within++;
            if (distance < bestDistance)
            {
                best = i;
                bestDistance = distance;
            }
        }
        if (within < 2)
            return (best, null);
        // Rare: a second pass names the other marks, so the common case allocates nothing.
        var others = new List<string>(within - 1);
        for (var i = 0; i < assessment.Marks.Count; i++)
        {
            var mark = assessment.Marks[i];
            if (i == best)
                continue;
            var fixAtMarkHeight = fix.Geodetic with { EllipsoidalHeightMetres = mark.Geodetic.EllipsoidalHeightMetres };
            var enu = LocalTangentPlane.Difference(markGeocentric[i], mark.Geodetic,
                GeocentricConversion.ToGeocentric(fixAtMarkHeight, Ellipsoid.Wgs84));
            if (Math.Sqrt(enu.EastMetres * enu.EastMetres + enu.NorthMetres * enu.NorthMetres) <= radiusMetres)
                others.Add(mark.Id);
        }
        return (best, others);
    }
}
