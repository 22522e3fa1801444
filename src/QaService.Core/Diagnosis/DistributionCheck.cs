using QaService.Core.Assessment;
using static QaService.Core.InvariantText;
using System.Globalization;
using QaService.Core.Geodesy;
using QaService.Core.Reporting;

namespace QaService.Core.Diagnosis;

/// <summary>
/// Check points spread over the area: the NSSDA testing guideline asks for at least 20 % of the
/// points in each quadrant of the (rectangular) data set and a spacing of at least 10 % of its
/// diagonal between points (FGDC-STD-007.3-1998 testing guidelines; values from memory, check-values.md
/// §1 status M). Distinct tested marks are placed on the local east-north plane at their centroid
/// (planar to well under 1 % for areas below ~50 km); quadrants split the bounding box at its centre.
/// </summary>
public sealed class DistributionCheck : IDataCheck
{
    /// <summary>Smallest share of marks per quadrant (NSSDA guideline, from memory).</summary>
    public const double MinimumQuadrantShare = 0.20;

    /// <summary>Smallest spacing between marks as a share of the diagonal (NSSDA guideline, from memory).</summary>
    public const double MinimumSpacingShareOfDiagonal = 0.10;

    /// <summary>Fewest distinct marks for quadrants to mean anything.</summary>
    public const int MinimumMarks = 4;

    public string Id => "distribution";

    public CheckResult Evaluate(CheckContext context)
    {
        var marks = context.Columns.TestedMarks;
        if (marks.Count < MinimumMarks)
            return new CheckResult(Id, CheckStatus.Warn, $"{marks.Count} distinct mark(s) tested: too few to judge how they cover the area", marks.Count, MinimumMarks, "marks");

        var plane = ToLocalPlane(marks.Select(m => m.Geodetic).ToList());
        var (minE, maxE) = (plane.Min(p => p.E), plane.Max(p => p.E));
        var (minN, maxN) = (plane.Min(p => p.N), plane.Max(p => p.N));
        var diagonal = Math.Sqrt((maxE - minE) * (maxE - minE) + (maxN - minN) * (maxN - minN));
        var centreE = (minE + maxE) / 2;
        var centreN = (minN + maxN) / 2;
        var quadrantCounts = new int[4];
        foreach (var (e, n) in plane)
            quadrantCounts[(e >= centreE ? 1 : 0) + (n >= centreN ? 2 : 0)]++;
        var smallestShare = quadrantCounts.Min() / (double)plane.Count;
        var closest = ClosestSpacing(plane);

        var problems = new List<string>();
        if (smallestShare < MinimumQuadrantShare)
            problems.Add(Format($"the emptiest quadrant holds {smallestShare:P0} of the marks (NSSDA guideline: at least {MinimumQuadrantShare:P0})"));
        if (diagonal > 0 && closest < MinimumSpacingShareOfDiagonal * diagonal)
            problems.Add(Format($"the closest two marks are {closest:F1} m apart, under {MinimumSpacingShareOfDiagonal:P0} of the {diagonal:F0} m diagonal"));
        return problems.Count == 0
            ? new CheckResult(Id, CheckStatus.Pass, Format($"{plane.Count} marks cover all four quadrants (smallest share {smallestShare:P0}) and are spaced at least {closest:F1} m apart"), smallestShare, MinimumQuadrantShare, "share")
            : new CheckResult(Id, CheckStatus.Warn, string.Join("; ", problems) + ": the figures may not represent the whole area", smallestShare, MinimumQuadrantShare, "share");
    }

    private static List<(double E, double N)> ToLocalPlane(IReadOnlyList<GeodeticCoordinate> points)
    {
        var origin = points[0];
        var originGeocentric = GeocentricConversion.ToGeocentric(origin, Ellipsoid.Wgs84);
        return points.Select(p =>
        {
            var enu = LocalTangentPlane.Difference(originGeocentric, origin, GeocentricConversion.ToGeocentric(p with { EllipsoidalHeightMetres = origin.EllipsoidalHeightMetres }, Ellipsoid.Wgs84));
            return (enu.EastMetres, enu.NorthMetres);
        }).ToList();
    }

    private static double ClosestSpacing(List<(double E, double N)> plane)
    {
        var closest = double.PositiveInfinity;
        for (var i = 0; i < plane.Count; i++)
        for (var j = i + 1; j < plane.Count; j++)
        {
            var de = plane[i].E - plane[j].E;
            var dn = plane[i].N - plane[j].N;
            closest = Math.Min(closest, Math.Sqrt(de * de + dn * dn));
        }
        return closest;
    }

}
