namespace QaService.Core.Geodesy;

/// <summary>Ellipsoidal (geodetic) coordinates on some <see cref="Ellipsoid"/>.</summary>
/// <param name="LatitudeDegrees">Geodetic latitude φ in degrees, positive north; valid range [−90, 90].</param>
/// <param name="LongitudeDegrees">Longitude λ in degrees, positive east; any finite value (conventionally [−180, 180]).</param>
/// <param name="EllipsoidalHeightMetres">Height h above the ellipsoid along the normal, metres.</param>
public readonly record struct GeodeticCoordinate(double LatitudeDegrees, double LongitudeDegrees, double EllipsoidalHeightMetres);
