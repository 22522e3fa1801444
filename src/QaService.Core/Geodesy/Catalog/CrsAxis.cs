namespace QaService.Core.Geodesy.Catalog;

/// <summary>One coordinate axis as the EPSG dataset defines it.</summary>
/// <param name="Abbreviation">Axis abbreviation, e.g. "Lat", "E", "X".</param>
/// <param name="Direction">Axis direction, e.g. "north", "east", "up", "geocentricX", "South along 90°E".</param>
/// <param name="Unit">Unit name, e.g. "degree", "metre", "US survey foot".</param>
/// <param name="Field">The API point field that carries this axis: lat, lon, h, e, n, x, y or z.</param>
public sealed record CrsAxis(string Abbreviation, string Direction, string Unit, string Field);
