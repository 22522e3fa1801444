namespace QaService.Core.Geodesy;

/// <summary>
/// A map projection with all its parameters bound (method, ellipsoid, origin, scale, false origin):
/// geodetic latitude/longitude in degrees ↔ easting/northing in metres.
/// </summary>
public interface IMapProjection
{
    /// <summary>EPSG method name, e.g. "Transverse Mercator".</summary>
    string MethodName { get; }

    /// <summary>Geodetic (degrees) → grid (metres).</summary>
    ProjectedCoordinate Forward(double latitudeDegrees, double longitudeDegrees);

    /// <summary>Grid (metres) → geodetic (degrees).</summary>
    (double LatitudeDegrees, double LongitudeDegrees) Inverse(double eastingMetres, double northingMetres);
}
