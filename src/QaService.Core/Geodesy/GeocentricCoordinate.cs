namespace QaService.Core.Geodesy;

/// <summary>
/// Earth-centred, Earth-fixed Cartesian coordinates (EPSG Guidance Note 7-2 §4.1.1): origin at the
/// ellipsoid centre, Z along the minor axis (north), X through (φ = 0, λ = 0), Y through (φ = 0, λ = 90°E).
/// </summary>
/// <param name="XMetres">X, metres.</param>
/// <param name="YMetres">Y, metres.</param>
/// <param name="ZMetres">Z, metres.</param>
public readonly record struct GeocentricCoordinate(double XMetres, double YMetres, double ZMetres);
