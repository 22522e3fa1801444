using QaService.Core.Geodesy;
using QaService.Core.Geodesy.Catalog;
using QaService.Core.Geodesy.Transformations;
using QaService.Core.Geodesy.Vertical;

namespace QaService.Core.Assessment;

/// <summary>
/// Brings the fixes into the marks' geodetic frame and both sides to ellipsoidal heights, so the residual
/// pipeline compares like with like: orthometric heights become h = H + N on their geoid (each side in its own
/// frame), then the fixes go through the planned datum operation (<see cref="CoordinateOperationPlanner"/>),
/// time-dependent steps evaluated at each fix's observation epoch (the fixes' <c>epoch</c>, else the fix's
/// <c>time</c> as a decimal year). The operation is the one whose EPSG area of use covers the fixes (or the fixes'
/// <c>operationCode</c>); fixes and marks outside an area of use are listed for the <c>area-of-use</c> check.
/// When the marks' frame is dynamic and the two sides' epochs differ, the marks are carried to the fixes' epoch by
/// their own velocities (vE/vN/vU) or the named plate of a plate motion model (<see cref="PlateMotionModel"/>);
/// without either the difference is stated, not corrected.
/// </summary>
public static class FrameAlignment
{
    /// <summary>Result: the points in the marks' frame (ellipsoidal heights) and the steps in words.</summary>
    public sealed record Aligned(IReadOnlyList<FramedPoint> Marks, IReadOnlyList<FramedPoint> Fixes, string Operation)
    {
        /// <summary>Marks or fixes outside an area of use.</summary>
        public IReadOnlyList<SideAreaWarning> AreaWarnings { get; init; } = [];
    }

    /// <summary>
    /// Plans the alignment; null with a message when no operation joins the two frames (<c>ProblemIsOperationCode</c> when the
    /// fixes' operationCode is at fault). A <see cref="List{T}"/> of fixes is updated in place.
    /// </summary>
    public static (Aligned? Result, string? Problem, bool ProblemIsOperationCode) Align(PointSetFrame marksFrame, PointSetFrame fixesFrame,
        IReadOnlyList<FramedPoint> marks, IReadOnlyList<FramedPoint> fixes)
    {
        var markGeoid = marksFrame.Heights == HeightReference.Orthometric ? GeoidModel.Find(marksFrame.Geoid) : null;
        var fixGeoid = fixesFrame.Heights == HeightReference.Orthometric ? GeoidModel.Find(fixesFrame.Geoid) : null;
        var fixLatitudes = new double[fixes.Count];
        var fixLongitudes = new double[fixes.Count];
        for (var i = 0; i < fixes.Count; i++)
            (fixLatitudes[i], fixLongitudes[i]) = (fixes[i].Geodetic.LatitudeDegrees, fixes[i].Geodetic.LongitudeDegrees);
        var plan = CoordinateOperationPlanner.Plan(AsGeographic(fixesFrame.Crs), AsGeographic(marksFrame.Crs), fixGeoid, null, null,
            AreaOfUse.Around(fixLatitudes, fixLongitudes), fixesFrame.OperationCode);
        if (plan.Operation is null)
            return (null, plan.Problem, plan.ProblemIsOperationCode);
        var operation = plan.Operation;
        var areaWarnings = AreaWarnings(operation, marksFrame, marks, fixes, fixLatitudes, fixLongitudes);

        var alignedMarks = markGeoid is null ? marks : marks.Select(m => ToEllipsoidal(m, markGeoid)).ToList();

        // No step and no geoid leave every fix as it is: the batch round trip would copy each coordinate back unchanged.
        var alignedFixes = operation.Steps.Count == 0 && fixGeoid is null ? fixes : Transform(operation, fixesFrame, fixes, fixGeoid);

        var text = new List<string> { operation.Steps.Count == 0 ? "fixes are in the marks' frame: no transformation" : "fixes: " + operation.Describe(EpochNote(fixesFrame, fixes)) };
        if (markGeoid is not null)
            text.Add($"marks: orthometric H to ellipsoidal h = H + N with the {markGeoid.Grid.Name} geoid (bilinear; EGM96 accuracy about {markGeoid.AccuracyMetres:0.#} m absolute, it cancels where both sides use it)");
        if (marksFrame.EpochDecimalYear is { } me && FixesEpoch(fixesFrame, fixes) is { } fe && me != fe && IsDynamic(marksFrame.Crs.Datum))
        {
            var (moved, note) = EpochPropagation.CarryMarks(alignedMarks, marksFrame, me, fe);
            alignedMarks = moved;
            text.Add(note);
        }
        return (new Aligned(alignedMarks, alignedFixes, string.Join("; ", text)) { AreaWarnings = areaWarnings }, null, false);
    }

    /// <summary>A frame whose coordinates change with time: a dynamic datum (EPSG frame reference epoch) or the WGS 84 ensemble.</summary>
    private static bool IsDynamic(GeodeticDatum datum) => datum.FrameReferenceEpochYear is not null || datum.Code == GeodeticDatum.Wgs84Ensemble.Code;

    /// <summary>The fixes' epoch: theirs when stated, else the mean of their times (a campaign spans days: under 0.1 mm of plate motion per day).</summary>
    private static double? FixesEpoch(PointSetFrame fixesFrame, IReadOnlyList<FramedPoint> fixes)
    {
        if (fixesFrame.EpochDecimalYear is { } epoch)
            return epoch;
        var times = fixes.Where(f => f.Time is not null).Select(f => DecimalYear.From(f.Time!.Value)).ToList();
        return times.Count == 0 ? null : times.Average();
    }

    private static IReadOnlyList<SideAreaWarning> AreaWarnings(CoordinateOperation operation, PointSetFrame marksFrame, IReadOnlyList<FramedPoint> marks,
        IReadOnlyList<FramedPoint> fixes, double[] fixLatitudes, double[] fixLongitudes)
    {
        var result = operation.OutsideAreas(fixLatitudes, fixLongitudes)
            .Select(w => new SideAreaWarning("fixes", w.Message, w.PointIndexes.Select(i => fixes[i].Id).ToList())).ToList();
        if (marksFrame.Crs.AreaOfUse is { } area)
        {
            var outside = marks.Where(m => area.DegreesOutside(m.Geodetic.LatitudeDegrees, m.Geodetic.LongitudeDegrees) > 0).Select(m => m.Id).ToList();
            if (outside.Count > 0)
                result.Add(new SideAreaWarning("marks", InvariantText.Format($"{outside.Count} of {marks.Count} marks lie outside the area of use of their CRS {marksFrame.Crs.Identifier} ({area.Name})"), outside));
        }
        return result;
    }

    /// <summary>Runs the fixes through the operation as one batch; a fix without height keeps the geoid-free height it had.</summary>
    private static IReadOnlyList<FramedPoint> Transform(CoordinateOperation operation, PointSetFrame fixesFrame, IReadOnlyList<FramedPoint> fixes, GeoidModel? fixGeoid)
    {
        var buffer = new CoordinateBuffer(fixes.Count, withEpochs: true);
        for (var i = 0; i < fixes.Count; i++)
        {
            var g = fixes[i].Geodetic;
            buffer.First[i] = g.LatitudeDegrees;
            buffer.Second[i] = g.LongitudeDegrees;
            buffer.Third[i] = g.EllipsoidalHeightMetres;
            buffer.EpochYears![i] = fixesFrame.EpochDecimalYear ?? (fixes[i].Time is { } t ? DecimalYear.From(t) : double.NaN);
        }
        operation.Execute(buffer);
        // A caller's own list has its points moved in place, so the fixes are neither held twice nor copied (a 1,000,000-fix upload: ~120 MB).
        var alignedFixes = fixes as List<FramedPoint> ?? fixes.Select(f => f with { }).ToList();
        for (var i = 0; i < alignedFixes.Count; i++)
        {
            // A fix without height keeps the geoid-free 0 it was given (api-v1: 0 on the ellipsoid); its height is never compared.
            var height = alignedFixes[i].HasHeight || fixGeoid is null ? buffer.Third[i] : buffer.Third[i] - fixGeoid.Grid.UndulationMetres(buffer.First[i], buffer.Second[i]);
            alignedFixes[i].Geodetic = new GeodeticCoordinate(buffer.First[i], buffer.Second[i], height);
        }
        return alignedFixes;
    }

    /// <summary>The geographic form of a CRS, after <see cref="PointConversion"/> has already undone projection and unit.</summary>
    private static CoordinateReferenceSystem AsGeographic(CoordinateReferenceSystem crs) =>
        crs.Kind == CrsKind.Geographic && crs.Unit == LinearUnit.Metre
            ? crs
            : crs with { Kind = CrsKind.Geographic, Projection = null, Unit = LinearUnit.Metre, HasHeightAxis = true };

    private static FramedPoint ToEllipsoidal(FramedPoint mark, GeoidModel geoid)
    {
        if (!mark.HasHeight)
            return mark;
        var g = mark.Geodetic;
        return mark with { Geodetic = g with { EllipsoidalHeightMetres = g.EllipsoidalHeightMetres + geoid.Grid.UndulationMetres(g.LatitudeDegrees, g.LongitudeDegrees) } };
    }

    private static string? EpochNote(PointSetFrame fixesFrame, IReadOnlyList<FramedPoint> fixes)
    {
        if (fixesFrame.EpochDecimalYear is { } epoch)
            return InvariantText.Format($"{epoch} (fixes' epoch)");
        var times = fixes.Where(f => f.Time is not null).Select(f => DecimalYear.From(f.Time!.Value)).ToList();
        if (times.Count == 0)
            return null;
        var missing = fixes.Count - times.Count;
        return InvariantText.Format($"each fix's time as a decimal year ({times.Min():0.000}–{times.Max():0.000})") +
               (missing > 0 ? InvariantText.Format($"; {missing} fixes without time evaluated at the reference epoch") : "");
    }
}
