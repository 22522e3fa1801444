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
    /// fixes' operationCode is at fault). The fixes' table is updated in place (a 1,000,000-fix upload is neither held twice nor copied).
    /// </summary>
    public static (Aligned? Result, string? Problem, bool ProblemIsOperationCode) Align(PointSetFrame marksFrame, PointSetFrame fixesFrame,
        IReadOnlyList<FramedPoint> marks, IReadOnlyList<FramedPoint> fixList)
    {
        var fixes = FixTable.Of(fixList);
        var markGeoid = marksFrame.Heights == HeightReference.Orthometric ? GeoidModel.Find(marksFrame.Geoid) : null;
        var fixGeoid = fixesFrame.Heights == HeightReference.Orthometric ? GeoidModel.Find(fixesFrame.Geoid) : null;
        var plan = CoordinateOperationPlanner.Plan(AsGeographic(fixesFrame.Crs), AsGeographic(marksFrame.Crs), fixGeoid, null, null,
            AreaOfUse.Around(fixes.Latitudes, fixes.Longitudes), fixesFrame.OperationCode);
        if (plan.Operation is null)
            return (null, plan.Problem, plan.ProblemIsOperationCode);
        var operation = plan.Operation;
        // Judged on the fixes as given, before the batch moves them.
        var areaWarnings = AreaWarnings(operation, marksFrame, marks, fixes);

        var alignedMarks = markGeoid is null ? marks : marks.Select(m => ToEllipsoidal(m, markGeoid)).ToList();

        // No step and no geoid leave every fix as it is: the batch round trip would copy each coordinate back unchanged.
        if (operation.Steps.Count > 0 || fixGeoid is not null)
            Transform(operation, fixesFrame, fixes, fixGeoid);

        var text = new List<string> { operation.Steps.Count == 0 ? "fixes are in the marks' frame: no transformation" : "fixes: " + operation.Describe(EpochNote(fixesFrame, fixes)) };
        if (markGeoid is not null)
            text.Add($"marks: orthometric H to ellipsoidal h = H + N with the {markGeoid.Grid.Name} geoid (bilinear; EGM96 accuracy about {markGeoid.AccuracyMetres:0.#} m absolute, it cancels where both sides use it)");
        if (marksFrame.EpochDecimalYear is { } me && FixesEpoch(fixesFrame, fixes) is { } fe && me != fe && IsDynamic(marksFrame.Crs.Datum))
        {
            var (moved, note) = EpochPropagation.CarryMarks(alignedMarks, marksFrame, me, fe);
            alignedMarks = moved;
            text.Add(note);
        }
        return (new Aligned(alignedMarks, fixes, string.Join("; ", text)) { AreaWarnings = areaWarnings }, null, false);
    }

    /// <summary>A frame whose coordinates change with time: a dynamic datum (EPSG frame reference epoch) or the WGS 84 ensemble.</summary>
    private static bool IsDynamic(GeodeticDatum datum) => datum.FrameReferenceEpochYear is not null || datum.Code == GeodeticDatum.Wgs84Ensemble.Code;

    /// <summary>The fixes' epoch: theirs when stated, else the mean of their times (a campaign spans days: under 0.1 mm of plate motion per day).</summary>
    private static double? FixesEpoch(PointSetFrame fixesFrame, FixTable fixes)
    {
        if (fixesFrame.EpochDecimalYear is { } epoch)
            return epoch;
        var times = TimesAsDecimalYears(fixes);
        return times.Count == 0 ? null : times.Average();
    }

    private static IReadOnlyList<SideAreaWarning> AreaWarnings(CoordinateOperation operation, PointSetFrame marksFrame, IReadOnlyList<FramedPoint> marks,
        FixTable fixes)
    {
        var result = operation.OutsideAreas(fixes.Latitudes, fixes.Longitudes)
            .Select(w => new SideAreaWarning("fixes", w.Message, w.PointIndexes.Select(fixes.Id).ToList())).ToList();
        if (marksFrame.Crs.AreaOfUse is { } area)
        {
            var outside = marks.Where(m => area.DegreesOutside(m.Geodetic.LatitudeDegrees, m.Geodetic.LongitudeDegrees) > 0).Select(m => m.Id).ToList();
            if (outside.Count > 0)
                result.Add(new SideAreaWarning("marks", InvariantText.Format($"{outside.Count} of {marks.Count} marks lie outside the area of use of their CRS {marksFrame.Crs.Identifier} ({area.Name})"), outside));
        }
        return result;
    }

    /// <summary>Runs the fixes through the operation as one batch and writes them back in place; a fix without height keeps the geoid-free height it had.</summary>
    private static void Transform(CoordinateOperation operation, PointSetFrame fixesFrame, FixTable fixes, GeoidModel? fixGeoid)
    {
        var buffer = new CoordinateBuffer(fixes.Count, withEpochs: true);
        for (var i = 0; i < fixes.Count; i++)
        {
            var g = fixes.Geodetic(i);
            buffer.First[i] = g.LatitudeDegrees;
            buffer.Second[i] = g.LongitudeDegrees;
            buffer.Third[i] = g.EllipsoidalHeightMetres;
            buffer.EpochYears![i] = fixesFrame.EpochDecimalYear ?? (fixes.Time(i) is { } t ? DecimalYear.From(t) : double.NaN);
        }
        operation.Execute(buffer);
        for (var i = 0; i < fixes.Count; i++)
        {
            // A fix without height keeps the geoid-free 0 it was given (api-v1: 0 on the ellipsoid); its height is never compared.
            var height = fixes.HasHeight(i) || fixGeoid is null ? buffer.Third[i] : buffer.Third[i] - fixGeoid.Grid.UndulationMetres(buffer.First[i], buffer.Second[i]);
            fixes.SetGeodetic(i, new GeodeticCoordinate(buffer.First[i], buffer.Second[i], height));
        }
    }

    /// <summary>The fixes' times as decimal years, in fix order (empty when none has a time).</summary>
    internal static List<double> TimesAsDecimalYears(FixTable fixes)
    {
        var years = new List<double>();
        if (!fixes.AnyTime)
            return years;
        for (var i = 0; i < fixes.Count; i++)
        {
            if (fixes.Time(i) is { } t)
                years.Add(DecimalYear.From(t));
        }
        return years;
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

    private static string? EpochNote(PointSetFrame fixesFrame, FixTable fixes)
    {
        if (fixesFrame.EpochDecimalYear is { } epoch)
            return InvariantText.Format($"{epoch} (fixes' epoch)");
        var times = TimesAsDecimalYears(fixes);
        if (times.Count == 0)
            return null;
        var missing = fixes.Count - times.Count;
        return InvariantText.Format($"each fix's time as a decimal year ({times.Min():0.000}–{times.Max():0.000})") +
               (missing > 0 ? InvariantText.Format($"; {missing} fixes without time evaluated at the reference epoch") : "");
    }
}
