using QaService.Core.Geodesy;
using QaService.Core.Geodesy.Catalog;

namespace QaService.Core.Assessment;

/// <summary>What the <c>h</c> values of a point set mean.</summary>
public enum HeightReference
{
    /// <summary>Height above the ellipsoid of the set's CRS.</summary>
    Ellipsoidal,
    /// <summary>Height above a geoid model (named by the set's <c>geoid</c>).</summary>
    Orthometric,
    /// <summary>2D only: heights are ignored and no vertical figures are produced.</summary>
    None,
}

/// <summary>The frame a point set was given in, after validation.</summary>
/// <param name="HeightsStated">False when the request left <c>heights</c> out and the default was taken.</param>
public sealed record PointSetFrame(CoordinateReferenceSystem Crs, HeightReference Heights, string? Geoid, double? EpochDecimalYear, bool HeightsStated)
{
    /// <summary>Fixes: the EPSG datum transformation the caller chose; null to let the planner choose.</summary>
    public int? OperationCode { get; init; }

    /// <summary>Marks: the plate motion model and plate that carry them to the fixes' epoch; null when none was named.</summary>
    public (Geodesy.Transformations.PlateMotionModel Model, Geodesy.Transformations.PlateRotation Plate)? PlateMotion { get; init; }
}

/// <summary>
/// A point brought into the common geodetic frame. <see cref="Geodetic"/> holds the ellipsoidal
/// height (0 when the point has none, as PROJ does for 2D input); <see cref="HasHeight"/> says whether
/// it was given.
/// </summary>
/// <param name="Index">Position of the point in its request array (for pointers).</param>
public sealed record FramedPoint(
    int Index,
    string Id,
    string? MarkId,
    GeodeticCoordinate Geodetic,
    bool HasHeight,
    double? SigmaHorizontalMetres,
    double? SigmaVerticalMetres,
    DateTimeOffset? Time)
{
    /// <summary>Settable inside Core so frame alignment moves a fix in place rather than copying a million points.</summary>
    public GeodeticCoordinate Geodetic { get; internal set; } = Geodetic;

    // The rarely given fields live in one immutable side object, null when none is given: a point then costs
    // about 72 bytes instead of 128 (a 1,000,000-fix upload holds every fix through the assessment).
    private Extras? extras = Extras.Of(SigmaHorizontalMetres, SigmaVerticalMetres, Time);

    public double? SigmaHorizontalMetres { get => extras?.SigmaHorizontalMetres; init => extras = Extras.Of(value, SigmaVerticalMetres, Time, VelocityMetresPerYear); }

    public double? SigmaVerticalMetres { get => extras?.SigmaVerticalMetres; init => extras = Extras.Of(SigmaHorizontalMetres, value, Time, VelocityMetresPerYear); }

    public DateTimeOffset? Time { get => extras?.Time; init => extras = Extras.Of(SigmaHorizontalMetres, SigmaVerticalMetres, value, VelocityMetresPerYear); }

    /// <summary>A mark's own velocity (east, north, up; metres per year) when the request gives one.</summary>
    public EnuVector? VelocityMetresPerYear { get => extras?.Velocity; init => extras = Extras.Of(SigmaHorizontalMetres, SigmaVerticalMetres, Time, value); }

    private sealed record Extras(double? SigmaHorizontalMetres, double? SigmaVerticalMetres, DateTimeOffset? Time, EnuVector? Velocity = null)
    {
        public static Extras? Of(double? sigmaHorizontal, double? sigmaVertical, DateTimeOffset? time, EnuVector? velocity = null) =>
            sigmaHorizontal is null && sigmaVertical is null && time is null && velocity is null ? null : new(sigmaHorizontal, sigmaVertical, time, velocity);
    }
}

/// <summary>The required accuracy after validation (metres, in the measure of <paramref name="Standard"/>).</summary>
/// <param name="Standard">Canonical standard id (<see cref="Standards.AccuracyStandards"/>).</param>
/// <param name="Confidence">Confidence level the verdict is judged at; null to judge point estimates.</param>
/// <param name="MapScaleDenominator">NMAS publication scale denominator.</param>
/// <param name="ContourIntervalMetres">NMAS contour interval, metres.</param>
public sealed record RequiredAccuracy(string Standard, double? HorizontalMetres, double? VerticalMetres,
    double? Confidence = null, double? MapScaleDenominator = null, double? ContourIntervalMetres = null);

/// <summary>A request that passed validation: every point is in the marks' geodetic frame with ellipsoidal heights.</summary>
/// <param name="FrameOperation">How the fixes were brought into the marks' frame (steps, accuracies, epoch); null when built directly in tests.</param>
public sealed record ValidatedAssessment(
    string? Title,
    PointSetFrame MarksFrame,
    PointSetFrame FixesFrame,
    IReadOnlyList<FramedPoint> Marks,
    IReadOnlyList<FramedPoint> Fixes,
    RequiredAccuracy? Spec,
    double? PairingRadiusMetres,
    IReadOnlyDictionary<string, string> ExclusionReasonsByFixId,
    string? FrameOperation = null,
    OccupationMode Occupations = OccupationMode.Each)
{
    /// <summary>Marks or fixes outside an area of use (CRS or datum operation), for the <c>area-of-use</c> check.</summary>
    public IReadOnlyList<SideAreaWarning> AreaWarnings { get; init; } = [];

    /// <summary>True when both sides carry heights that can be compared.</summary>
    public bool HasVerticalComparison =>
        MarksFrame.Heights != HeightReference.None && FixesFrame.Heights != HeightReference.None;
}

/// <summary>An area-of-use warning for one side of the assessment; <see cref="Ids"/> are the point ids concerned.</summary>
public sealed record SideAreaWarning(string Side, string Message, IReadOnlyList<string> Ids);
