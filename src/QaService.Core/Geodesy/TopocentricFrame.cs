namespace QaService.Core.Geodesy;

/// <summary>
/// The local east-north-up frame at one origin with its rotation worked out once (EPSG method 9836
/// "Geocentric/topocentric conversions", EPSG Guidance Note 7-2 §4.1.2; the formula is on
/// <see cref="LocalTangentPlane.Difference"/>). Residuals of many fixes against one mark share the mark's frame, so
/// the four sines and cosines are taken once per mark instead of once per fix; <see cref="Difference"/> evaluates the
/// same expressions in the same order as before, so every component is bit for bit what the one-shot call gives.
/// </summary>
public readonly struct TopocentricFrame
{
    private readonly GeocentricCoordinate origin;
    private readonly double sinPhi, cosPhi, sinLam, cosLam;

    private TopocentricFrame(GeocentricCoordinate origin, double sinPhi, double cosPhi, double sinLam, double cosLam)
    {
        this.origin = origin;
        this.sinPhi = sinPhi;
        this.cosPhi = cosPhi;
        this.sinLam = sinLam;
        this.cosLam = cosLam;
    }

    /// <summary>The frame at <paramref name="origin"/>, whose geodetic position is <paramref name="originGeodetic"/>.</summary>
    /// <param name="origin">Frame origin, geocentric X, Y, Z in metres.</param>
    /// <param name="originGeodetic">The same origin: φ degrees in [−90, 90], λ degrees finite (height unused).</param>
    /// <exception cref="ArgumentOutOfRangeException">Latitude outside [−90, 90] or a non-finite longitude.</exception>
    public static TopocentricFrame At(GeocentricCoordinate origin, GeodeticCoordinate originGeodetic)
    {
        AngleMath.ValidateLatitude(originGeodetic.LatitudeDegrees, nameof(originGeodetic));
        AngleMath.ValidateFinite(originGeodetic.LongitudeDegrees, nameof(originGeodetic));
        (double sinPhi, double cosPhi) = AngleMath.SinCosDegrees(originGeodetic.LatitudeDegrees);
        (double sinLam, double cosLam) = AngleMath.SinCosDegrees(originGeodetic.LongitudeDegrees);
        return new TopocentricFrame(origin, sinPhi, cosPhi, sinLam, cosLam);
    }

    /// <summary>East, north, up (metres) of <paramref name="target"/> − origin; accuracy as <see cref="LocalTangentPlane.Difference"/>.</summary>
    /// <param name="target">Geocentric X, Y, Z in metres.</param>
    /// <exception cref="ArgumentOutOfRangeException">A coordinate difference that is not finite.</exception>
    public EnuVector Difference(GeocentricCoordinate target)
    {
        double dx = target.XMetres - origin.XMetres;
        double dy = target.YMetres - origin.YMetres;
        double dz = target.ZMetres - origin.ZMetres;
        AngleMath.ValidateFinite(dx, nameof(target));
        AngleMath.ValidateFinite(dy, nameof(target));
        AngleMath.ValidateFinite(dz, nameof(target));

        double east = (-sinLam * dx) + (cosLam * dy);
        double t = (cosLam * dx) + (sinLam * dy);
        double north = (-sinPhi * t) + (cosPhi * dz);
        double up = (cosPhi * t) + (sinPhi * dz);
        return new EnuVector(east, north, up);
    }
}
