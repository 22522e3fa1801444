namespace QaService.Core.Screening;

/// <summary>A batch of fixes to screen as they are uploaded, against a named rule profile.</summary>
/// <param name="Profile">Profile name (see <see cref="ScreeningProfiles"/>); default <c>asset-inventory-sbas</c>.</param>
/// <param name="Thresholds">Values that override the profile's for this request.</param>
/// <param name="Fixes">The fixes with their receiver metadata.</param>
/// <param name="Calibration">Learned ratios of observed to reported error per receiver, for the expected-error rule.</param>
/// <param name="ProjectId">A project of this tenant: its deliveries' counted pairs calibrate the receivers (instead of
/// <c>calibration.assessments</c>/<c>entries</c>; <c>calibration.minimumPairs</c> still applies).</param>
public sealed record ScreeningRequest(string? Profile = null, ScreeningThresholds? Thresholds = null, IReadOnlyList<ScreeningFix?>? Fixes = null,
    ScreeningCalibrationInput? Calibration = null, string? ProjectId = null);

/// <summary>
/// Where the expected-error rule's calibration comes from: stored assessments (their residuals' receivers, reported σ/HDOP and
/// observed errors) or entries given inline (e.g. from an earlier screening's <c>calibration</c> block). One of the two.
/// </summary>
/// <param name="Assessments">Ids of stored assessments of this tenant whose counted pairs calibrate the receivers.</param>
/// <param name="Entries">Calibration entries given directly.</param>
/// <param name="MinimumPairs">Fewest pairs an entry needs to be used (default 20); below it the profile's rule applies.</param>
public sealed record ScreeningCalibrationInput(IReadOnlyList<string?>? Assessments = null, IReadOnlyList<CalibrationEntry?>? Entries = null,
    int? MinimumPairs = null);

/// <summary>One fix and what the receiver said about it. Every field is optional; a rule whose input is missing is listed as not checked.</summary>
/// <param name="Id">The app's id for the fix.</param>
/// <param name="Quality"><c>autonomous</c>, <c>dgnss</c>, <c>sbas</c>, <c>ppp</c>, <c>rtk-float</c> or <c>rtk-fixed</c>.</param>
/// <param name="Satellites">Satellites used in the solution.</param>
/// <param name="Pdop">Position dilution of precision.</param>
/// <param name="Hdop">Horizontal dilution of precision.</param>
/// <param name="Vdop">Vertical dilution of precision.</param>
/// <param name="HorizontalError">Receiver's reported horizontal error estimate, metres (as the receiver states it).</param>
/// <param name="VerticalError">Receiver's reported vertical error estimate, metres.</param>
/// <param name="CorrectionAge">Age of differential/RTK corrections, seconds.</param>
/// <param name="ElevationMask">Receiver's satellite elevation mask, degrees above the horizon.</param>
/// <param name="Time">Time of the fix (echoed).</param>
/// <param name="Receiver">Receiver that took the fix (as the assessments name it): selects its calibration.</param>
public sealed record ScreeningFix(
    string? Id = null,
    string? Quality = null,
    int? Satellites = null,
    double? Pdop = null,
    double? Hdop = null,
    double? Vdop = null,
    double? HorizontalError = null,
    double? VerticalError = null,
    double? CorrectionAge = null,
    double? ElevationMask = null,
    DateTimeOffset? Time = null,
    string? Receiver = null);

/// <summary>
/// Thresholds of a profile; in a request, any given value overrides the profile's. Errors in metres,
/// ages in seconds, angles in degrees, DOPs dimensionless.
/// </summary>
/// <param name="RejectQualities">Fix qualities rejected.</param>
/// <param name="FlagQualities">Fix qualities flagged.</param>
/// <param name="MinimumSatellites">Fewer satellites → reject (never below 4: a 3-D fix needs 4).</param>
/// <param name="FlagSatellitesBelow">Fewer satellites → flag.</param>
/// <param name="MaximumPdop">PDOP above → flag.</param>
/// <param name="MaximumHdop">HDOP above → flag.</param>
/// <param name="MaximumVdop">VDOP above → flag.</param>
/// <param name="FlagHorizontalError">Reported (or, for autonomous fixes, expected) horizontal error above → flag, metres.</param>
/// <param name="RejectHorizontalError">Reported horizontal error above → reject, metres.</param>
/// <param name="FlagVerticalError">Reported vertical error above → flag, metres.</param>
/// <param name="RejectVerticalError">Reported vertical error above → reject, metres.</param>
/// <param name="MaximumCorrectionAge">Correction age above → flag, seconds.</param>
/// <param name="RejectCorrectionAge">Correction age above → reject, seconds.</param>
/// <param name="MinimumElevationMask">Elevation mask below → flag, degrees.</param>
/// <param name="Uere95">User equivalent range error at 95 % for the expected autonomous error, metres.</param>
public sealed record ScreeningThresholds(
    IReadOnlyList<string>? RejectQualities = null,
    IReadOnlyList<string>? FlagQualities = null,
    int? MinimumSatellites = null,
    int? FlagSatellitesBelow = null,
    double? MaximumPdop = null,
    double? MaximumHdop = null,
    double? MaximumVdop = null,
    double? FlagHorizontalError = null,
    double? RejectHorizontalError = null,
    double? FlagVerticalError = null,
    double? RejectVerticalError = null,
    double? MaximumCorrectionAge = null,
    double? RejectCorrectionAge = null,
    double? MinimumElevationMask = null,
    double? Uere95 = null);
