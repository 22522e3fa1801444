namespace QaService.Core.Assessment;

/// <summary>
/// An assessment as a client sends it (api-v1 "POST /v1/assessments"). Everything is nullable here:
/// <see cref="RequestValidator"/> turns this into a checked <see cref="ValidatedAssessment"/> or a list
/// of <see cref="InputError"/>s with JSON pointers.
/// </summary>
/// <param name="Title">Free text shown on the report.</param>
/// <param name="Marks">Surveyed reference marks (check points).</param>
/// <param name="Fixes">Field positions to be tested.</param>
/// <param name="Spec">Required accuracy; either figure may be omitted.</param>
/// <param name="Pairing">When given, fixes without <c>mark</c> pair with the nearest mark within the radius.</param>
/// <param name="Exclusions">Fixes the QA lead leaves out of the statistics, each with a reason.</param>
/// <param name="ProjectId">The project (contract) this delivery belongs to; its spec applies when <paramref name="Spec"/> is absent.</param>
public sealed record AssessmentRequest(
    PointSet? Marks,
    PointSet? Fixes,
    string? Title = null,
    AccuracySpec? Spec = null,
    PairingOptions? Pairing = null,
    IReadOnlyList<Exclusion?>? Exclusions = null,
    string? ProjectId = null);

/// <summary>A set of points in one CRS and height reference.</summary>
/// <param name="Crs"><c>"EPSG:&lt;code&gt;"</c> (OGC WKT arrives with the geodesy catalog).</param>
/// <param name="Heights"><c>ellipsoidal</c>, <c>orthometric</c> (with <paramref name="Geoid"/>) or <c>none</c>.</param>
/// <param name="Geoid">Geoid model name when heights are orthometric, e.g. <c>egm96</c>.</param>
/// <param name="Epoch">Coordinate epoch as a decimal year, e.g. 2026.4.</param>
/// <param name="Points">The points.</param>
/// <param name="OperationCode">Fixes only: the EPSG datum transformation to bring them into the marks' frame, <c>"EPSG:1776"</c>, where EPSG offers several.</param>
/// <param name="Plate">Marks only: the tectonic plate (e.g. <c>EURA</c>) whose motion brings the marks from their epoch to the fixes' epoch.</param>
/// <param name="PlateModel">Marks only: <c>itrf2020-pmm</c> (default) or <c>itrf2014-pmm</c>.</param>
public sealed record PointSet(string? Crs, IReadOnlyList<PointRecord?>? Points, string? Heights = null, string? Geoid = null, double? Epoch = null,
    string? OperationCode = null, string? Plate = null, string? PlateModel = null);

/// <summary>
/// One point; which coordinate fields it must have depends on the kind of its set's CRS
/// (geographic <c>lat</c>/<c>lon</c> in degrees, projected <c>e</c>/<c>n</c> in the CRS unit,
/// geocentric <c>x</c>/<c>y</c>/<c>z</c> in metres; <c>h</c> in the CRS unit). A mark may carry its velocity
/// <c>vE</c>/<c>vN</c>/<c>vU</c> (metres per year, east/north/up) to bring it to the fixes' epoch. Fixes may also carry attributes the report
/// groups by (<c>featureClass</c>, <c>crew</c>, <c>receiver</c>) and what the receiver reported (<c>hdop</c>, <c>quality</c>;
/// <c>sigmaH</c> on a fix is the receiver's reported per-axis 1σ horizontal precision).
/// </summary>
public sealed record PointRecord(
    string? Id = null,
    string? Mark = null,
    double? Lat = null,
    double? Lon = null,
    double? E = null,
    double? N = null,
    double? X = null,
    double? Y = null,
    double? Z = null,
    double? H = null,
    double? SigmaH = null,
    double? SigmaV = null,
    DateTimeOffset? Time = null,
    string? FeatureClass = null,
    string? Crew = null,
    string? Receiver = null,
    double? Hdop = null,
    string? Quality = null,
    // Named explicitly: the camelCase policy would spell VE "ve", and the contract's name is "vE".
    [property: System.Text.Json.Serialization.JsonPropertyName("vE")] double? VE = null,
    [property: System.Text.Json.Serialization.JsonPropertyName("vN")] double? VN = null,
    [property: System.Text.Json.Serialization.JsonPropertyName("vU")] double? VU = null);

/// <summary>Required accuracy, in the measure of the selected standard (for <c>nssda</c>: 95 % confidence), metres.</summary>
/// <param name="Standard">Accuracy standard: <c>nssda</c> (FGDC-STD-007.3-1998, default), <c>asprs-2023</c>, <c>nmas-1947</c>, <c>nga-ce90</c>.</param>
/// <param name="Horizontal">Required horizontal accuracy, metres: nssda radial 95 %; asprs-2023 RMSE_H; nga-ce90 CE90.</param>
/// <param name="Vertical">Required vertical accuracy, metres: nssda 95 %; asprs-2023 RMSE_V; nga-ce90 LE90.</param>
/// <param name="Confidence">When given (e.g. 0.9), a figure passes only when its upper confidence bound meets the spec.</param>
/// <param name="MapScale">Publication scale denominator for <c>nmas-1947</c>, e.g. 24000 for 1:24,000.</param>
/// <param name="ContourInterval">Contour interval for <c>nmas-1947</c> vertical testing, metres.</param>
/// <param name="FeatureClasses">Required accuracy per feature class (fix attribute <c>featureClass</c>), in the same measures as
/// <paramref name="Horizontal"/>/<paramref name="Vertical"/>; each class's group in the report is judged against its own entry.</param>
public sealed record AccuracySpec(string? Standard = null, double? Horizontal = null, double? Vertical = null,
    double? Confidence = null, double? MapScale = null, double? ContourInterval = null,
    IReadOnlyDictionary<string, FeatureClassSpec?>? FeatureClasses = null);

/// <summary>Required accuracy of one feature class, metres, in the selected standard's measures (as spec.horizontal/vertical).</summary>
public sealed record FeatureClassSpec(double? Horizontal = null, double? Vertical = null);

/// <summary>Proximity pairing for fixes that name no mark.</summary>
/// <param name="Radius">Largest horizontal distance from fix to mark, metres (default 5).</param>
/// <param name="Occupations"><c>each</c> (default: every fix is a test point) or <c>mean</c> (each mark's repeat
/// occupations are averaged and the mean is the test point, as survey practice often does).</param>
public sealed record PairingOptions(double? Radius = null, string? Occupations = null);

/// <summary>A fix left out of the statistics on purpose (still listed among the residuals).</summary>
/// <param name="Fix">The fix id.</param>
/// <param name="Reason">Why it is excluded; shown on the report.</param>
public sealed record Exclusion(string? Fix, string? Reason = null);
