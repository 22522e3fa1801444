namespace QaService.Core.Geodesy;

/// <summary>
/// Local east-north-up (topocentric) frame: EPSG method 9836 "Geocentric/topocentric conversions",
/// EPSG Guidance Note 7-2 (IOGP Publication 373-7-2) §4.1.2.
/// </summary>
public static class LocalTangentPlane
{
    /// <summary>
    /// ENU components of (target − origin) in the local east-north-up frame at the geodetic position
    /// <paramref name="originGeodetic"/> (rotation ECEF→ENU, EPSG Guidance Note 7-2 §4.1.2, method EPSG 9836):
    /// <code>
    /// E = −sinλ·ΔX + cosλ·ΔY
    /// N = −sinφ cosλ·ΔX − sinφ sinλ·ΔY + cosφ·ΔZ
    /// U =  cosφ cosλ·ΔX + cosφ sinλ·ΔY + sinφ·ΔZ
    /// </code>
    /// </summary>
    /// <param name="origin">Frame origin, geocentric X, Y, Z in metres.</param>
    /// <param name="originGeodetic">The same origin in geodetic coordinates (φ degrees [−90, 90], λ degrees finite;
    /// height unused). The caller is responsible for it describing the same point as <paramref name="origin"/>;
    /// only the direction of the normal matters, so a latitude error δφ rotates the result by δφ.</param>
    /// <param name="target">Target, geocentric X, Y, Z in metres.</param>
    /// <returns>East, north, up in metres.</returns>
    /// <remarks>
    /// Exact rotation (orthonormal), valid everywhere including the poles (at φ = ±90° east is the direction of
    /// increasing λ for the supplied λ). Error is floating-point rounding only: a few ulp of |target − origin|,
    /// i.e. ≈ 1e-15 m for differences of a few metres (the ECEF subtraction itself is exact to ≈ 1e-9 m).
    /// </remarks>
    /// <exception cref="ArgumentOutOfRangeException">Latitude outside [−90, 90] or non-finite inputs.</exception>
    public static EnuVector Difference(GeocentricCoordinate origin, GeodeticCoordinate originGeodetic, GeocentricCoordinate target)
        => TopocentricFrame.At(origin, originGeodetic).Difference(target);
}
