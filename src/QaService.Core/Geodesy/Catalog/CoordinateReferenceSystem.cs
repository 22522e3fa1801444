namespace QaService.Core.Geodesy.Catalog;

/// <summary>
/// A coordinate reference system the service can read points in. Every CRS of this catalog is
/// referenced to one geodetic frame (<see cref="Datum"/>) on one ellipsoid; projected CRSs carry
/// their map projection.
/// </summary>
/// <param name="Identifier">Canonical identifier, e.g. <c>EPSG:32633</c>.</param>
/// <param name="Name">Name as the EPSG dataset gives it, e.g. <c>WGS 84 / UTM zone 33N</c>.</param>
/// <param name="Kind">Which coordinate fields a point in this CRS has.</param>
/// <param name="Datum">The geodetic reference frame the coordinates refer to.</param>
/// <param name="Unit">Linear unit of projected coordinates and heights.</param>
/// <param name="Projection">Map projection for <see cref="CrsKind.Projected"/>; null otherwise.</param>
/// <param name="HasHeightAxis">True where the CRS itself is three-dimensional (EPSG:4979, 4978).</param>
public sealed record CoordinateReferenceSystem(
    string Identifier,
    string Name,
    CrsKind Kind,
    GeodeticDatum Datum,
    LinearUnit Unit,
    IMapProjection? Projection,
    bool HasHeightAxis)
{
    /// <summary>The datum's ellipsoid.</summary>
    public Ellipsoid Ellipsoid => Datum.Ellipsoid;

    /// <summary>Where the CRS is meant to be used (EPSG extent); null when unknown (e.g. WKT without an extent).</summary>
    public AreaOfUse? AreaOfUse { get; init; }

    /// <summary>The coordinate axes in the CRS's own order (EPSG: latitude before longitude for geographic CRSs).</summary>
    public IReadOnlyList<CrsAxis> Axes { get; init; } = [];

    /// <summary>Method and parameters of <see cref="Projection"/> as data; null for geographic and geocentric CRSs.</summary>
    public ProjectionDefinition? Conversion { get; init; }

    /// <summary>The geographic CRS a projected CRS is based on, e.g. <c>EPSG:4269</c>; null otherwise.</summary>
    public string? BaseCrsIdentifier { get; init; }
}
