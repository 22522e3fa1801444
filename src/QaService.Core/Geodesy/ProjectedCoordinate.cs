namespace QaService.Core.Geodesy;

/// <summary>Map-grid coordinates (e.g. UTM), including any false easting/northing.</summary>
/// <param name="EastingMetres">Easting E, metres.</param>
/// <param name="NorthingMetres">Northing N, metres.</param>
public readonly record struct ProjectedCoordinate(double EastingMetres, double NorthingMetres);
