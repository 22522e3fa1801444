namespace QaService.Core.Geodesy.Projections;

/// <summary>
/// Oblique Stereographic, EPSG method 9809 (the "double" stereographic: Gauss conformal sphere, then the
/// spherical stereographic), after EPSG Guidance Note 7-2 (IOGP Publication 373-7-2, September 2019),
/// section "Oblique and Equatorial Stereographic"; spherical inverse after Snyder (1987), USGS PP 1395,
/// pp. 158–159 (eqs. 20-14, 20-15, 21-15).
/// </summary>
/// <remarks>
/// GN7-2's w = c·(Sa·Sb^e)ⁿ equals c·exp(2nψ), ψ the isometric latitude, so the conformal-sphere
/// latitude is χ = gd(nψ + ½ ln c); the inverse inverts this exactly (ψ → φ by Newton) instead of GN7-2's
/// fixed-point loop. R = √(ρ₀ν₀), n = √(1 + e² cos⁴φ₀/(1 − e²)). Units: degrees, metres. Domain: the
/// whole ellipsoid except the antipode of the origin; an origin at a pole is taken in its limit (see the constructor).
/// </remarks>
public sealed class ObliqueStereographic : IMapProjection
{
    private readonly double _e, _n, _halfLnC, _twoRk, _sinChi0, _cosChi0;

    /// <summary>Creates the projection.</summary>
    /// <param name="ellipsoid">Ellipsoid.</param>
    /// <param name="originLatitudeDegrees">φ₀, degrees.</param>
    /// <param name="originLongitudeDegrees">λ₀, degrees.</param>
    /// <param name="scaleFactor">k₀ at the origin.</param>
    /// <param name="falseEastingMetres">FE, metres.</param>
    /// <param name="falseNorthingMetres">FN, metres.</param>
    public ObliqueStereographic(Ellipsoid ellipsoid, double originLatitudeDegrees, double originLongitudeDegrees, double scaleFactor, double falseEastingMetres, double falseNorthingMetres)
    {
        AngleMath.ValidateLatitude(originLatitudeDegrees, nameof(originLatitudeDegrees));
        Ellipsoid = ellipsoid;
        _e = ellipsoid.FirstEccentricity;
        double e2 = _e * _e;
        (double sin0, double cos0) = AngleMath.SinCosDegrees(originLatitudeDegrees);
        double w = 1 - (e2 * sin0 * sin0);
        double radius = ellipsoid.SemiMajorAxisMetres * Math.Sqrt(1 - e2) / w; // √(ρ₀ν₀)
        _n = Math.Sqrt(1 + (e2 * Math.Pow(cos0, 4) / (1 - e2)));
        double psi0 = IsometricLatitude.Psi(originLatitudeDegrees, _e);
        // GN7-2: sin χ₀ = (w₁ − 1)/(w₁ + 1) with w₁ = exp(2nψ₀); c = (n + sin φ₀)(1 − sin χ₀)/((n − sin φ₀)(1 + sin χ₀)).
        // Near a pole that is 0/0 (PROJ 9.1.1's +proj=sterea returns garbage at lat_0 = 89.99999999°). Rewritten without
        // cancellation, using (1 − tanh x)/(1 + tanh x) = e^(−2x), n − s = cos²φ₀(1 + e²cos²φ₀/(1 − e²))/(n + s) and
        // ψ₀ = atanh s − e·atanh(e·s), s = |sin φ₀|:
        //   ½ ln c = ln(n + s) − ½ ln(1 + e²cos²φ₀/(1 − e²)) − ½(n + 1) ln(1 + s) + ½(n − 1) ln(1 − s) + n·e·atanh(e·s),
        // odd in φ₀. At a pole (n = 1) it is e·atanh e and the method is Polar Stereographic (variant A) (PROJ's sterea at
        // lat_0 = ±90 gives the same values as +proj=stere).
        double s = Math.Abs(sin0), cos2 = cos0 * cos0;
        double lowerPoleTerm = _n == 1 ? 0 : (_n - 1) / 2 * Math.Log(1 - s);
        _halfLnC = Math.Sign(originLatitudeDegrees) * (Math.Log(_n + s) - (Math.Log(1 + (e2 * cos2 / (1 - e2))) / 2)
            - ((_n + 1) / 2 * Math.Log(1 + s)) + lowerPoleTerm + (_n * _e * Math.Atanh(_e * s)));
        double x0 = (_n * psi0) + _halfLnC;
        (_sinChi0, _cosChi0) = double.IsInfinity(x0) ? (Math.Sign(x0), 0.0) : (Math.Tanh(x0), 1 / Math.Cosh(x0));
        _twoRk = 2 * radius * scaleFactor;
        OriginLongitudeDegrees = originLongitudeDegrees;
        FalseEastingMetres = falseEastingMetres;
        FalseNorthingMetres = falseNorthingMetres;
    }

    /// <inheritdoc />
    public string MethodName => "Oblique Stereographic";

    /// <summary>The ellipsoid.</summary>
    public Ellipsoid Ellipsoid { get; }

    /// <summary>λ₀, degrees.</summary>
    public double OriginLongitudeDegrees { get; }

    /// <summary>FE, metres.</summary>
    public double FalseEastingMetres { get; }

    /// <summary>FN, metres.</summary>
    public double FalseNorthingMetres { get; }

    /// <inheritdoc />
    public ProjectedCoordinate Forward(double latitudeDegrees, double longitudeDegrees)
    {
        AngleMath.ValidateLatitude(latitudeDegrees, nameof(latitudeDegrees));
        AngleMath.ValidateFinite(longitudeDegrees, nameof(longitudeDegrees));
        double psi = IsometricLatitude.Psi(latitudeDegrees, _e);
        double sinChi = Math.Tanh((_n * psi) + _halfLnC);
        double cosChi = 1 / Math.Cosh((_n * psi) + _halfLnC);
        double dLambda = _n * AngleMath.LongitudeDifferenceDegrees(longitudeDegrees, OriginLongitudeDegrees) * AngleMath.RadiansPerDegree;
        (double sinL, double cosL) = Math.SinCos(dLambda);
        double b = 1 + (sinChi * _sinChi0) + (cosChi * _cosChi0 * cosL);
        if (!(b > 0))
            throw new ArgumentOutOfRangeException(nameof(latitudeDegrees), latitudeDegrees, "The antipode of the projection origin has no image.");
        return new ProjectedCoordinate(
            FalseEastingMetres + (_twoRk * cosChi * sinL / b),
            FalseNorthingMetres + (_twoRk * ((sinChi * _cosChi0) - (cosChi * _sinChi0 * cosL)) / b));
    }

    /// <inheritdoc />
    public (double LatitudeDegrees, double LongitudeDegrees) Inverse(double eastingMetres, double northingMetres)
    {
        AngleMath.ValidateFinite(eastingMetres, nameof(eastingMetres));
        AngleMath.ValidateFinite(northingMetres, nameof(northingMetres));
        double x = eastingMetres - FalseEastingMetres;
        double y = northingMetres - FalseNorthingMetres;
        double rho = double.Hypot(x, y);
        double sinChi, dLambda;
        if (rho == 0)
        {
            sinChi = _sinChi0;
            dLambda = 0;
        }
        else
        {
            double c = 2 * Math.Atan(rho / _twoRk);
            (double sinC, double cosC) = Math.SinCos(c);
            sinChi = Math.Clamp((cosC * _sinChi0) + (y * sinC * _cosChi0 / rho), -1, 1);
            dLambda = Math.Atan2(x * sinC, (rho * _cosChi0 * cosC) - (y * _sinChi0 * sinC));
        }

        double psi = (Math.Atanh(sinChi) - _halfLnC) / _n;
        double lat = IsometricLatitude.LatitudeDegrees(psi, _e);
        double lon = OriginLongitudeDegrees + (dLambda / _n / AngleMath.RadiansPerDegree);
        return (lat, Math.IEEERemainder(lon, AngleMath.FullTurnDegrees));
    }
}
