namespace QaService.Core.Geodesy.Projections;

/// <summary>
/// Meridian distance M(φ) from the equator, and the footpoint latitude φ₁ with M(φ₁) = m, as the northing and inverse of
/// a Transverse Mercator with k₀ = 1 on its own central meridian (<see cref="TransverseMercator"/>, Krüger's series in
/// the third flattening to 6th order, Karney 2011: agrees with GeographicLib to nanometres), instead of the e⁶ series of
/// EPSG Guidance Note 7-2 "Cassini-Soldner" whose truncation reaches 0.9 mm at mid-latitudes (measured against
/// GeographicLib 2.1.2 GeodSolve, projection-sweep-proj.tsv). Units: metres, radians. Domain: |φ| ≤ 90°, |m| ≤ M(90°).
/// </summary>
internal sealed class MeridianArc(Ellipsoid ellipsoid)
{
    private readonly TransverseMercator _meridian = new(ellipsoid, 0, 1, 0, 0);

    /// <summary>M(90°), the quarter meridian, metres.</summary>
    public double QuarterMeridianMetres { get; } = new TransverseMercator(ellipsoid, 0, 1, 0, 0).Forward(90, 0).NorthingMetres;

    /// <summary>M(φ), metres (negative south of the equator).</summary>
    public double Metres(double latitudeRadians) => _meridian.Forward(latitudeRadians / AngleMath.RadiansPerDegree, 0).NorthingMetres;

    /// <summary>Footpoint latitude φ₁ with M(φ₁) = m, radians; NaN beyond the poles.</summary>
    public double Footpoint(double metres) =>
        Math.Abs(metres) > QuarterMeridianMetres ? double.NaN : _meridian.Inverse(0, metres).LatitudeDegrees * AngleMath.RadiansPerDegree;
}
