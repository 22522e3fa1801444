using QaService.Core.Geodesy;

namespace QaService.Core.Assessment;

/// <summary>A fix and the mark it is tested against.</summary>
/// <param name="PairedBy"><c>id</c> or <c>proximity</c>.</param>
public sealed record MarkFixPair(FramedPoint Mark, FramedPoint Fix, string PairedBy);

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
        var marksById = new Dictionary<string, int>(StringComparer.Ordinal);
        for (var i = 0; i < assessment.Marks.Count; i++)
            marksById[assessment.Marks[i].Id] = i;

        var pairs = new List<MarkFixPair>(assessment.Fixes.Count);
        var unpaired = 0;
        foreach (var fix in assessment.Fixes)
        {
            if (fix.MarkId is { } markId && marksById.TryGetValue(markId, out var byId))
            {
                pairs.Add(new MarkFixPair(assessment.Marks[byId], fix, ById));
                continue;
            }
            var nearest = assessment.PairingRadiusMetres is { } radius
                ? NearestWithin(assessment, markGeocentric, fix, radius)
                : -1;
            if (nearest < 0)
                unpaired++;
            else
                pairs.Add(new MarkFixPair(assessment.Marks[nearest], fix, ByProximity));
        }
        return (pairs, unpaired);
    }

    private static int NearestWithin(ValidatedAssessment assessment, IReadOnlyList<GeocentricCoordinate> markGeocentric, FramedPoint fix, double radiusMetres)
    {
        var best = -1;
        var bestDistance = double.PositiveInfinity;
        for (var i = 0; i < assessment.Marks.Count; i++)
        {
            var mark = assessment.Marks[i];
            var fixAtMarkHeight = fix.Geodetic with { EllipsoidalHeightMetres = mark.Geodetic.EllipsoidalHeightMetres };
            var enu = LocalTangentPlane.Difference(markGeocentric[i], mark.Geodetic,
                GeocentricConversion.ToGeocentric(fixAtMarkHeight, assessment.MarksFrame.Crs.Ellipsoid));
            var distance = Math.Sqrt(enu.EastMetres * enu.EastMetres + enu.NorthMetres * enu.NorthMetres);
            if (distance <= radiusMetres && distance < bestDistance)
            {
                best = i;
                bestDistance = distance;
            }
        }
        return best;
    }
}
