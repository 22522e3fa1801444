namespace QaService.Core.Geodesy.Projections;

/// <summary>
/// Meridian distance M(φ) from the equator and the footpoint latitude φ₁ for a given M, by the series of EPSG
/// Guidance Note 7-2 (IOGP 373-7-2, 2019) "Cassini-Soldner" / "Transverse Mercator (JHS)"; Snyder (1987), USGS PP
/// 1395, eqs. 3-21 (p. 17), 7-19 and 3-26 (pp. 63, 19). Units: metres, radians. Accuracy: terms to e⁶ in M (the
/// dropped e⁸ term is below 0.1 mm on Earth ellipsoids) and to e₁⁴ in φ₁ (below 1e-12 rad).
/// </summary>
internal readonly struct MeridianArc
{
    private readonly double _a, _c0, _c2, _c4, _c6, _f2, _f4, _f6, _f8;

    public MeridianArc(Ellipsoid ellipsoid)
    {
        _a = ellipsoid.SemiMajorAxisMetres;
        double e2 = ellipsoid.FirstEccentricitySquared, e4 = e2 * e2, e6 = e4 * e2;
        _c0 = 1 - (e2 / 4) - (3 * e4 / 64) - (5 * e6 / 256);
        _c2 = (3 * e2 / 8) + (3 * e4 / 32) + (45 * e6 / 1024);
        _c4 = (15 * e4 / 256) + (45 * e6 / 1024);
        _c6 = 35 * e6 / 3072;
        double s = Math.Sqrt(1 - e2), e1 = (1 - s) / (1 + s), e12 = e1 * e1, e13 = e12 * e1, e14 = e13 * e1;
        _f2 = (3 * e1 / 2) - (27 * e13 / 32);
        _f4 = (21 * e12 / 16) - (55 * e14 / 32);
        _f6 = 151 * e13 / 96;
        _f8 = 1097 * e14 / 512;
    }

    /// <summary>M(φ), metres (negative south of the equator).</summary>
    public double Metres(double latitudeRadians) =>
        _a * ((_c0 * latitudeRadians) - (_c2 * Math.Sin(2 * latitudeRadians)) + (_c4 * Math.Sin(4 * latitudeRadians)) - (_c6 * Math.Sin(6 * latitudeRadians)));

    /// <summary>Footpoint latitude φ₁ with M(φ₁) = m, radians (μ = m / (a·c₀), then the e₁ series).</summary>
    public double Footpoint(double metres)
    {
        double mu = metres / (_a * _c0);
        return mu + (_f2 * Math.Sin(2 * mu)) + (_f4 * Math.Sin(4 * mu)) + (_f6 * Math.Sin(6 * mu)) + (_f8 * Math.Sin(8 * mu));
    }
}
