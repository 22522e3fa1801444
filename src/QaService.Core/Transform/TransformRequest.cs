namespace QaService.Core.Transform;

/// <summary>
/// A batch transformation as a client sends it (api-v1 "POST /v1/transform"). Nullable throughout:
/// <see cref="TransformRunner"/> checks it and answers with input errors carrying JSON pointers.
/// </summary>
/// <param name="From">Source CRS, <c>"EPSG:&lt;code&gt;"</c>.</param>
/// <param name="To">Target CRS.</param>
/// <param name="Epoch">Observation epoch of the points, decimal year (used by time-dependent datum steps).</param>
/// <param name="FromGeoid">When given, the source heights are orthometric on this geoid (e.g. "egm96"); otherwise ellipsoidal.</param>
/// <param name="ToGeoid">When given, the output heights are orthometric on this geoid; otherwise ellipsoidal.</param>
/// <param name="Points">The points; fields by the source CRS kind.</param>
/// <param name="OperationCode">An EPSG datum transformation to use, <c>"EPSG:15948"</c> (or the bare code), where EPSG offers several; the route goes through it.</param>
public sealed record TransformRequest(
    string? From,
    string? To,
    [property: System.Text.Json.Serialization.JsonConverter(typeof(TransformPointListJsonConverter))] IReadOnlyList<TransformPoint?>? Points,
    double? Epoch = null,
    string? FromGeoid = null,
    string? ToGeoid = null,
    string? OperationCode = null);

/// <summary>One point: geographic <c>lat</c>/<c>lon</c> (degrees), projected <c>e</c>/<c>n</c> (CRS unit) or geocentric <c>x</c>/<c>y</c>/<c>z</c> (metres); optional <c>h</c>.</summary>
public sealed record TransformPoint(
    double? Lat = null, double? Lon = null,
    double? E = null, double? N = null,
    double? X = null, double? Y = null, double? Z = null,
    double? H = null);
