namespace QaService.Core.Geodesy.Catalog;

/// <summary>How a CRS names its coordinates (api-v1 "Coordinates" table).</summary>
public enum CrsKind
{
    /// <summary><c>lat</c>, <c>lon</c> in decimal degrees, optional <c>h</c> in metres.</summary>
    Geographic,
    /// <summary><c>e</c>, <c>n</c> in the CRS's linear unit, optional <c>h</c>.</summary>
    Projected,
    /// <summary><c>x</c>, <c>y</c>, <c>z</c> in metres (Earth-centred, Earth-fixed).</summary>
    Geocentric,
}
