using QaService.Core.Geodesy;
using QaService.Core.Reporting;

namespace QaService.Core.Assessment;

/// <summary>
/// Residual = fix − mark in the local east-north-up frame at the mark (api-v1 "Definitions"):
/// both points to geocentric Cartesian coordinates, their difference rotated into ENU at the mark
/// (EPSG Guidance Note 7-2, §4.1.2, geocentric/topocentric conversion, method EPSG 9836).
/// Accuracy: the conversions are sub-micrometre, so a residual carries no computational error above 1e-6 m.
/// </summary>
public static class ResidualComputation
{
    public static Residual Compute(MarkFixPair pair, GeocentricCoordinate markGeocentric, Ellipsoid ellipsoid, string? exclusionReason) =>
        Compute(pair, TopocentricFrame.At(markGeocentric, pair.Mark.Geodetic), ellipsoid, exclusionReason);

    /// <summary>The residual of <paramref name="pair"/> in the mark's frame, built once per mark by the caller (many fixes share a mark).</summary>
    public static Residual Compute(MarkFixPair pair, in TopocentricFrame markFrame, Ellipsoid ellipsoid, string? exclusionReason)
    {
        var (mark, fix) = (pair.Mark, pair.Fix);
        var enu = Components(mark, fix.Geodetic, fix.HasHeight, markFrame, ellipsoid);
        var horizontal = Math.Sqrt(enu.EastMetres * enu.EastMetres + enu.NorthMetres * enu.NorthMetres);
        return new Residual(mark.Id, fix.Id, enu.EastMetres, enu.NorthMetres, double.IsNaN(enu.UpMetres) ? null : enu.UpMetres, horizontal,
            pair.PairedBy, exclusionReason, mark.Geodetic.LatitudeDegrees, mark.Geodetic.LongitudeDegrees) { Attributes = fix.Attributes };
    }

    /// <summary>dE, dN, dU of fix − mark in the mark's frame, metres; dU is NaN when either side has no height.</summary>
    internal static EnuVector Components(FramedPoint mark, GeodeticCoordinate fix, bool fixHasHeight, in TopocentricFrame markFrame, Ellipsoid ellipsoid)
    {
        var hasVertical = mark.HasHeight && fixHasHeight;
        // Without both heights, take the fix at the mark's height: a height difference would otherwise
        // leak into the horizontal components through the tilt between the two ellipsoid normals.
        var fixGeodetic = hasVertical ? fix : fix with { EllipsoidalHeightMetres = mark.Geodetic.EllipsoidalHeightMetres };
        var enu = markFrame.Difference(GeocentricConversion.ToGeocentric(fixGeodetic, ellipsoid));
        return hasVertical ? enu : enu with { UpMetres = double.NaN };
    }
}
