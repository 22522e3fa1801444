namespace QaService.Core.Geodesy.Catalog;

/// <summary>The map projection of a projected CRS as data: method and parameters, for display and search.</summary>
/// <param name="MethodCode">EPSG method code, e.g. 9802; null when read from WKT without one.</param>
/// <param name="MethodName">EPSG method name, e.g. "Lambert Conic Conformal (2SP)".</param>
/// <param name="Parameters">Parameters in EPSG order, values converted to degrees, metres or unity.</param>
public sealed record ProjectionDefinition(int? MethodCode, string MethodName, IReadOnlyList<ProjectionParameter> Parameters);

/// <summary>One projection parameter.</summary>
/// <param name="Code">EPSG parameter code, e.g. 8806.</param>
/// <param name="Name">EPSG parameter name, e.g. "False easting".</param>
/// <param name="Value">Value in <paramref name="Unit"/>.</param>
/// <param name="Unit">"degree", "metre" or "unity".</param>
public sealed record ProjectionParameter(int Code, string Name, double Value, string Unit);
