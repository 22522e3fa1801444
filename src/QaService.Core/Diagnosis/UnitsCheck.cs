using static QaService.Core.InvariantText;
using QaService.Core.Assessment;
using QaService.Core.Geodesy;
using QaService.Core.Geodesy.Catalog;
using QaService.Core.Geodesy.Projections;
using QaService.Core.Reporting;

namespace QaService.Core.Diagnosis;

/// <summary>
/// Unit, axis and zone blunders (the arithmetic of each hypothesis is exact; the thresholds are common practice):
/// <list type="bullet">
/// <item>Residuals proportional to the grid coordinates of a projected CRS (scaling about the grid origin, false origin
/// included): k = Σ(dE·E + dN·N)/Σ(E² + N²) is compared with the scale a unit mix-up gives — US survey foot read as
/// international foot or back, ±1.999996e-6 (0.3048·3937/1200 − 1, "2 ppm", check-values §6); metres read as feet,
/// 0.3048 − 1; feet read as metres, 1/0.3048 − 1. It must explain ≥ 90 % of Σ(dE² + dN²) and lie within 25 % of the candidate.</item>
/// <item>Gross residuals (median dH over <see cref="GrossResidualMetres"/>): swapped axes (lat/lon or E/N), a flipped sign, or
/// a neighbouring UTM zone (the fixes' grid coordinates re-read with the central meridian 6° east or west) are tried on the
/// fixes; a hypothesis that brings ≥ 80 % of the fixes within max(5 m, 1 % of the median dH) of their marks is named.</item>
/// </list>
/// </summary>
public sealed class UnitsCheck : IDataCheck
{
    /// <summary>International foot over US survey foot, minus 1: 0.3048·3937/1200 − 1 = 1.999996e-6.</summary>
    public const double SurveyFootScale = (0.3048 * 3937.0 / 1200.0) - 1.0;

    /// <summary>Share of the residual sum of squares the proportional model must explain.</summary>
    public const double ExplainedShare = 0.9;

    /// <summary>Median dH from which gross hypotheses (axes, signs, zone) are tried, metres.</summary>
    public const double GrossResidualMetres = 100.0;

    /// <summary>Share of fixes a gross hypothesis must bring back to their marks.</summary>
    public const double RecoveredShare = 0.8;

    private const int FewestPoints = 3;

    public string Id => "units";

    public CheckResult Evaluate(CheckContext context)
    {
        var included = context.Included;
        if (included.Count < FewestPoints)
            return new CheckResult(Id, CheckStatus.Pass, "too few residuals to look for unit, axis or zone mix-ups");
        var input = context.Input;
        var marksById = input.Marks.ToDictionary(m => m.Id, StringComparer.Ordinal);

        var columns = context.Columns;
        var medianDh = Statistics.Percentile.LinearInterpolation(columns.Radial, 0.5);
        if (medianDh >= GrossResidualMetres)
        {
            var fixesById = input.Fixes.GroupBy(f => f.Id, StringComparer.Ordinal).ToDictionary(g => g.Key, g => g.First(), StringComparer.Ordinal);
            var pairs = included.Where(r => fixesById.ContainsKey(r.Fix)).Select(r => (Mark: marksById[r.Mark].Geodetic, Fix: fixesById[r.Fix].Geodetic)).ToList();
            var limit = Math.Max(5.0, 0.01 * medianDh);
            foreach (var (name, map) in GrossHypotheses(input.FixesFrame.Crs))
            {
                var recovered = pairs.Count(p => map(p.Fix) is { } g && HorizontalDistance(p.Mark, g) <= limit);
                if (pairs.Count > 0 && recovered >= RecoveredShare * pairs.Count)
                {
                    return new CheckResult(Id, CheckStatus.Fail,
                        Format($"median dH {medianDh:F0} m, but {recovered} of {pairs.Count} fixes land within {limit:F0} m of their marks if {name}. Fix: correct the fixes' coordinates or their declared \"crs\""),
                        recovered / (double)pairs.Count, RecoveredShare, "share");
                }
            }
        }

        var gridCrs = input.FixesFrame.Crs.Projection is not null ? input.FixesFrame.Crs : input.MarksFrame.Crs.Projection is not null ? input.MarksFrame.Crs : null;
        if (gridCrs?.Projection is { } projection)
        {
            // Sums gathered per mark first (in residual order), so each mark is projected once rather than once per fix;
            // the marks are then taken in order of first appearance.
            var (east, north, groups) = (columns.East, columns.North, columns.Groups);
            var perMark = new (double SumDE, double SumDN, int Count)[groups.Count];
            double syy = 0;
            for (var i = 0; i < east.Length; i++)
            {
                ref var sums = ref perMark[groups.GroupOf[i]];
                sums = (sums.SumDE + east[i], sums.SumDN + north[i], sums.Count + 1);
                syy += east[i] * east[i] + north[i] * north[i];
            }
            double sxy = 0, sxx = 0;
            for (var g = 0; g < perMark.Length; g++)
            {
                var sums = perMark[g];
                var mark = marksById[groups.MarkIds[g]].Geodetic;
                var grid = projection.Forward(mark.LatitudeDegrees, mark.LongitudeDegrees);
                sxy += sums.SumDE * grid.EastingMetres + sums.SumDN * grid.NorthingMetres;
                sxx += sums.Count * (grid.EastingMetres * grid.EastingMetres + grid.NorthingMetres * grid.NorthingMetres);
            }
            if (sxx > 0 && syy > 0)
            {
                var k = sxy / sxx;
                var explained = k * k * sxx / syy;
                foreach (var (scale, meaning) in ScaleHypotheses)
                {
                    foreach (var sign in new[] { 1.0, -1.0 })
                    {
                        var candidate = sign * scale;
                        if (explained >= ExplainedShare && Math.Abs(k - candidate) <= 0.25 * Math.Abs(candidate))
                        {
                            var side = sign > 0 ? "the fixes'" : "the marks'";
                            return new CheckResult(Id, CheckStatus.Fail,
                                Format($"the residuals grow in proportion to the {gridCrs.Name} grid coordinates (scale {k:0.######e0}, explaining {explained:P0} of the squared residuals): {side} coordinates look like {meaning}. Fix: declare the CRS with the unit the coordinates were really measured in"),
                                k, candidate, "scale");
                        }
                    }
                }
            }
        }
        return new CheckResult(Id, CheckStatus.Pass, "no sign of a unit mix-up (feet, US survey feet, metres), swapped axes, a flipped sign or a wrong UTM zone");
    }

    private static readonly (double Scale, string Meaning)[] ScaleHypotheses =
    [
        (SurveyFootScale, "US survey feet read as international feet (or the reverse on the other side), 2 ppm"),
        (0.3048 - 1.0, "international feet read as metres, or metres read as feet"),
        ((1.0 / 0.3048) - 1.0, "metres read as feet, or feet read as metres"),
    ];

    private static IEnumerable<(string Name, Func<GeodeticCoordinate, GeodeticCoordinate?> Map)> GrossHypotheses(CoordinateReferenceSystem fixesCrs)
    {
        if (fixesCrs.Kind == CrsKind.Geographic)
        {
            yield return ("latitude and longitude were swapped", g => Valid(g.LongitudeDegrees, g.LatitudeDegrees, g));
            yield return ("the longitude's sign was flipped (east/west)", g => Valid(g.LatitudeDegrees, -g.LongitudeDegrees, g));
            yield return ("the latitude's sign was flipped (north/south)", g => Valid(-g.LatitudeDegrees, g.LongitudeDegrees, g));
        }
        if (fixesCrs.Projection is { } p)
        {
            yield return ("easting and northing were swapped", g =>
            {
                var grid = p.Forward(g.LatitudeDegrees, g.LongitudeDegrees);
                var (lat, lon) = p.Inverse(grid.NorthingMetres, grid.EastingMetres);
                return Valid(lat, lon, g);
            });
            if (UtmZoneOf(fixesCrs) is { } zone)
            {
                foreach (var step in new[] { -1, 1 })
                {
                    var other = (zone.Zone + step + 59) % 60 + 1;
                    var target = Utm.Zone(other, zone.South);
                    yield return (Format($"the coordinates belong to UTM zone {other}, not {zone.Zone}"), g =>
                    {
                        var grid = p.Forward(g.LatitudeDegrees, g.LongitudeDegrees);
                        var (lat, lon) = target.Inverse(grid.EastingMetres, grid.NorthingMetres);
                        return Valid(lat, lon, g);
                    });
                }
            }
        }
    }

    /// <summary>Zone and hemisphere of a UTM CRS (TM, k0 0.9996, FE 500 km, CM on a zone centre), in metres; null otherwise.</summary>
    private static (int Zone, bool South)? UtmZoneOf(CoordinateReferenceSystem crs)
    {
        if (crs.Conversion is not { MethodCode: ProjectionMethodCodes.TransverseMercator } conversion || crs.Unit != LinearUnit.Metre)
            return null;
        double Get(int code) => conversion.Parameters.FirstOrDefault(p => p.Code == code)?.Value ?? double.NaN;
        var centralMeridian = Get(ProjectionParameterCodes.LongitudeOfNaturalOrigin);
        if (Get(ProjectionParameterCodes.ScaleFactorAtNaturalOrigin) != Utm.ScaleFactor || Get(ProjectionParameterCodes.FalseEasting) != Utm.FalseEastingMetres)
            return null;
        var zone = Utm.ZoneForLongitude(centralMeridian);
        return Math.Abs(Utm.CentralMeridianDegrees(zone) - centralMeridian) < 1e-9
            ? (zone, Get(ProjectionParameterCodes.FalseNorthing) == Utm.SouthernFalseNorthingMetres)
            : null;
    }

    private static GeodeticCoordinate? Valid(double lat, double lon, GeodeticCoordinate original) =>
        double.IsFinite(lat) && double.IsFinite(lon) && Math.Abs(lat) <= 90 ? original with { LatitudeDegrees = lat, LongitudeDegrees = lon } : null;

    private static double HorizontalDistance(GeodeticCoordinate a, GeodeticCoordinate b)
    {
        var origin = GeocentricConversion.ToGeocentric(a, Ellipsoid.Wgs84);
        var enu = LocalTangentPlane.Difference(origin, a, GeocentricConversion.ToGeocentric(b with { EllipsoidalHeightMetres = a.EllipsoidalHeightMetres }, Ellipsoid.Wgs84));
        return Math.Sqrt(enu.EastMetres * enu.EastMetres + enu.NorthMetres * enu.NorthMetres);
    }
}
