using QaService.Core.Geodesy;
using QaService.Core.Geodesy.Transformations;

namespace QaService.Core.Assessment;

/// <summary>
/// Carries marks within one dynamic frame from their epoch to the fixes' epoch: X(t₁) = X(t₀) + v·(t₁ − t₀) on geocentric
/// coordinates (linear station motion, the ITRF's own model between discontinuities). v is the mark's own velocity
/// (vE/vN/vU, rotated from east-north-up at the mark, EPSG GN 7-2 §4.1.2) or ω × X of the named plate
/// (<see cref="PlateMotionModel"/>). Units: metres, metres per year, decimal years.
/// </summary>
public static class EpochPropagation
{
    /// <summary>The marks at <paramref name="toEpoch"/>, and the sentence saying how; unchanged with a note when nothing was given.</summary>
    public static (IReadOnlyList<FramedPoint> Marks, string Note) CarryMarks(IReadOnlyList<FramedPoint> marks, PointSetFrame marksFrame, double fromEpoch, double toEpoch)
    {
        var withVelocity = marks.Count(m => m.VelocityMetresPerYear is not null);
        var plate = marksFrame.PlateMotion;
        var frame = marksFrame.Crs.Datum.Name;
        if (withVelocity == 0 && plate is null)
            return (marks, InvariantText.Format($"epochs {fromEpoch:0.0##} (marks) and {toEpoch:0.0##} (fixes) differ within the dynamic frame {frame}: no plate-motion model was applied (several cm per year in most places); name marks.plate or give the marks' vE/vN/vU to correct it"));
        var dt = toEpoch - fromEpoch;
        var ellipsoid = marksFrame.Crs.Ellipsoid;
        var moved = marks.Select(m => m with { Geodetic = Move(m, dt, ellipsoid, plate?.Plate) }).ToList();
        var how = withVelocity == marks.Count ? "each mark's own velocity (vE, vN, vU from the request)"
            : plate is { } p ? (withVelocity > 0 ? InvariantText.Format($"{withVelocity} marks by their own velocity (vE, vN, vU), the others by ") : "") + p.Model.Describe(p.Plate)
            : InvariantText.Format($"their own velocity for {withVelocity} of {marks.Count} marks; the others are left at {fromEpoch:0.0##} (name marks.plate to move them too)");
        return (moved, InvariantText.Format($"marks carried from epoch {fromEpoch:0.0##} to the fixes' epoch {toEpoch:0.0##} ({dt:0.0##} years) within {frame} by {how}"));
    }

    private static GeodeticCoordinate Move(FramedPoint mark, double years, Ellipsoid ellipsoid, PlateRotation? plate)
    {
        var g = mark.Geodetic;
        var x = GeocentricConversion.ToGeocentric(g, ellipsoid);
        double vx, vy, vz;
        if (mark.VelocityMetresPerYear is { } v)
        {
            var (sinPhi, cosPhi) = Math.SinCos(g.LatitudeDegrees * Math.PI / 180);
            var (sinLam, cosLam) = Math.SinCos(g.LongitudeDegrees * Math.PI / 180);
            vx = (-sinLam * v.EastMetres) - (sinPhi * cosLam * v.NorthMetres) + (cosPhi * cosLam * v.UpMetres);
            vy = (cosLam * v.EastMetres) - (sinPhi * sinLam * v.NorthMetres) + (cosPhi * sinLam * v.UpMetres);
            vz = (cosPhi * v.NorthMetres) + (sinPhi * v.UpMetres);
        }
        else if (plate is not null)
            (vx, vy, vz) = PlateMotionModel.Velocity(plate, x.XMetres, x.YMetres, x.ZMetres);
        else
            return g;
        var moved = GeocentricConversion.ToGeodetic(new GeocentricCoordinate(x.XMetres + (vx * years), x.YMetres + (vy * years), x.ZMetres + (vz * years)), ellipsoid);
        return mark.HasHeight ? moved : moved with { EllipsoidalHeightMetres = g.EllipsoidalHeightMetres };
    }
}
