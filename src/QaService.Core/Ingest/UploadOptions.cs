using QaService.Core.Assessment;

namespace QaService.Core.Ingest;

/// <summary>
/// The <c>options</c> part of a multipart assessment (api-v1 "The same request as files"): the JSON
/// request without its <c>points</c> arrays, plus how to read the files.
/// </summary>
/// <param name="RowErrors"><c>strict</c> (default: any row that cannot be read rejects the upload with 400) or
/// <c>lenient</c> (such rows are listed in the report's <c>ingest</c> block and the rest is assessed).</param>
/// <param name="ProjectId">As in the JSON request: the project whose spec applies when <paramref name="Spec"/> is absent.</param>
public sealed record UploadOptions(
    FilePartOptions? Marks = null,
    FilePartOptions? Fixes = null,
    string? Title = null,
    AccuracySpec? Spec = null,
    PairingOptions? Pairing = null,
    IReadOnlyList<Exclusion?>? Exclusions = null,
    string? RowErrors = null,
    string? ProjectId = null);

/// <summary>How to read one file part, and the frame its points are in.</summary>
/// <param name="Crs">As in the JSON request. GeoJSON, GPX and NMEA default to EPSG:4979 (their formats fix WGS 84 latitude/longitude).</param>
/// <param name="Heights">As in the JSON request.</param>
/// <param name="Geoid">As in the JSON request.</param>
/// <param name="Epoch">As in the JSON request.</param>
/// <param name="Columns">CSV: contract field → header text, for headers that are not contract names (e.g. <c>{"lat": "Latitude"}</c>).</param>
/// <param name="LengthUnit">CSV: unit of e/n/x/y/z/h/sigma columns when it differs from the CRS unit: <c>metre</c>, <c>foot</c> (international, 0.3048 m), <c>us-survey-foot</c> (1200/3937 m).</param>
/// <param name="DecimalSeparator">CSV: <c>point</c> or <c>comma</c>; detected when omitted.</param>
/// <param name="Delimiter">CSV: <c>,</c> <c>;</c> or <c>tab</c>; detected from the header when omitted.</param>
public sealed record FilePartOptions(
    string? Crs = null,
    string? Heights = null,
    string? Geoid = null,
    double? Epoch = null,
    IReadOnlyDictionary<string, string>? Columns = null,
    string? LengthUnit = null,
    string? DecimalSeparator = null,
    string? Delimiter = null);
