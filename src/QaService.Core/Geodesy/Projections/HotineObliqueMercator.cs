namespace QaService.Core.Geodesy.Projections;

/// <summary>
/// Hotine Oblique Mercator, EPSG methods 9812 (variant A: false origin at the natural origin of the
/// uv grid) and 9815 (variant B: false origin at the projection centre), after EPSG Guidance Note 7-2
/// (IOGP Publication 373-7-2, September 2019), section "Oblique Mercator"; Snyder (1987), USGS PP 1395,
/// pp. 70–72 (eqs. 9-1 to 9-35).
/// </summary>
/// <remarks>
/// Aposphere constants B, A, H, γ₀, λ₀ per GN7-2; t^B written exp(−Bψ) (<see cref="IsometricLatitude"/>),
/// so the inverse recovers ψ exactly and φ by Newton's method. Units: degrees, metres.
/// Domain: the region of the ellipsoid around the initial line (the projection's poles are singular).
/// </remarks>
public sealed class HotineObliqueMercator : IMapProjection
{
    private readonly double _e, _b, _a, _h, _sinGamma0, _cosGamma0, _sinGammaC, _cosGammaC, _lambda0Degrees, _uOffset;

    /// <summary>Creates the projection (angles degrees, lengths metres).</summary>
    /// <param name="ellipsoid">Ellipsoid.</param>
    /// <param name="variantB">True for EPSG 9815 (easting/northing given at the projection centre).</param>
    /// <param name="centreLatitudeDegrees">φc, not ±90.</param>
    /// <param name="centreLongitudeDegrees">λc.</param>
    /// <param name="initialLineAzimuthDegrees">αc, azimuth of the initial line at the centre.</param>
    /// <param name="rectifiedToSkewDegrees">γc, angle from the rectified to the skew grid.</param>
    /// <param name="scaleFactor">kc on the initial line.</param>
    /// <param name="falseEastingMetres">FE (variant A) or Ec (variant B).</param>
    /// <param name="falseNorthingMetres">FN (variant A) or Nc (variant B).</param>
    public HotineObliqueMercator(Ellipsoid ellipsoid, bool variantB, double centreLatitudeDegrees, double centreLongitudeDegrees,
        double initialLineAzimuthDegrees, double rectifiedToSkewDegrees, double scaleFactor, double falseEastingMetres, double falseNorthingMetres)
    {
        if (!(Math.Abs(centreLatitudeDegrees) < AngleMath.QuarterTurnDegrees))
            throw new ArgumentOutOfRangeException(nameof(centreLatitudeDegrees), centreLatitudeDegrees, "The projection centre must not be a pole.");
        MethodName = variantB ? "Hotine Oblique Mercator (variant B)" : "Hotine Oblique Mercator (variant A)";
        Ellipsoid = ellipsoid;
        _e = ellipsoid.FirstEccentricity;
        double e2 = _e * _e;
        (double sinPhiC, double cosPhiC) = AngleMath.SinCosDegrees(centreLatitudeDegrees);
        (double sinAlpha, double cosAlpha) = AngleMath.SinCosDegrees(initialLineAzimuthDegrees);
        _b = Math.Sqrt(1 + (e2 * Math.Pow(cosPhiC, 4) / (1 - e2)));
        double w = 1 - (e2 * sinPhiC * sinPhiC);
        _a = ellipsoid.SemiMajorAxisMetres * _b * scaleFactor * Math.Sqrt(1 - e2) / w;
        double t0 = Math.Exp(-IsometricLatitude.Psi(centreLatitudeDegrees, _e));
        double d = _b * Math.Sqrt(1 - e2) / (cosPhiC * Math.Sqrt(w));
        double d2 = Math.Max(d * d, 1); // GN7-2: if D < 1 take D² = 1
        double signPhi = centreLatitudeDegrees < 0 ? -1 : 1;
        double f = d + (Math.Sqrt(d2 - 1) * signPhi);
        _h = f * Math.Pow(t0, _b);
        double g = (f - (1 / f)) / 2;
        double gamma0 = Math.Asin(Math.Clamp(sinAlpha / d, -1, 1));
        (_sinGamma0, _cosGamma0) = Math.SinCos(gamma0);
        // G·tan γ₀ is exactly 1 when αc = 90° (Swiss and Hungarian grids); clamp so rounding cannot push it past 1.
        _lambda0Degrees = centreLongitudeDegrees - (Math.Asin(Math.Clamp(g * Math.Tan(gamma0), -1, 1)) / _b / AngleMath.RadiansPerDegree);
        (_sinGammaC, _cosGammaC) = AngleMath.SinCosDegrees(rectifiedToSkewDegrees);
        double uc = Math.Abs(initialLineAzimuthDegrees) == AngleMath.QuarterTurnDegrees
            ? _a * AngleMath.LongitudeDifferenceDegrees(centreLongitudeDegrees, _lambda0Degrees) * AngleMath.RadiansPerDegree
            : _a / _b * Math.Atan2(Math.Sqrt(d2 - 1), cosAlpha) * signPhi;
        _uOffset = variantB ? Math.Abs(uc) * signPhi : 0;
        FalseEastingMetres = falseEastingMetres;
        FalseNorthingMetres = falseNorthingMetres;
    }

    /// <inheritdoc />
    public string MethodName { get; }

    /// <summary>The ellipsoid.</summary>
    public Ellipsoid Ellipsoid { get; }

    /// <summary>FE or Ec, metres.</summary>
    public double FalseEastingMetres { get; }

    /// <summary>FN or Nc, metres.</summary>
    public double FalseNorthingMetres { get; }

    /// <inheritdoc />
    public ProjectedCoordinate Forward(double latitudeDegrees, double longitudeDegrees)
    {
        AngleMath.ValidateLatitude(latitudeDegrees, nameof(latitudeDegrees));
        AngleMath.ValidateFinite(longitudeDegrees, nameof(longitudeDegrees));
        double psi = IsometricLatitude.Psi(latitudeDegrees, _e);
        double q = _h * Math.Exp(_b * psi);       // Q = H/t^B
        double s = (q - (1 / q)) / 2, t = (q + (1 / q)) / 2;
        double bl = _b * AngleMath.LongitudeDifferenceDegrees(longitudeDegrees, _lambda0Degrees) * AngleMath.RadiansPerDegree;
        (double v, double cosBl) = Math.SinCos(bl);
        double u = ((-v * _cosGamma0) + (s * _sinGamma0)) / t;
        if (!(Math.Abs(u) < 1))
            throw new ArgumentOutOfRangeException(nameof(latitudeDegrees), latitudeDegrees, "The point is at a pole of the oblique Mercator projection.");
        double vGrid = _a * Math.Log((1 - u) / (1 + u)) / (2 * _b);
        double uGrid = (_a * Math.Atan2((s * _cosGamma0) + (v * _sinGamma0), cosBl) / _b) - _uOffset;
        return new ProjectedCoordinate(
            FalseEastingMetres + (vGrid * _cosGammaC) + (uGrid * _sinGammaC),
            FalseNorthingMetres + (uGrid * _cosGammaC) - (vGrid * _sinGammaC));
    }

    /// <inheritdoc />
    public (double LatitudeDegrees, double LongitudeDegrees) Inverse(double eastingMetres, double northingMetres)
    {
        AngleMath.ValidateFinite(eastingMetres, nameof(eastingMetres));
        AngleMath.ValidateFinite(northingMetres, nameof(northingMetres));
        double x = eastingMetres - FalseEastingMetres, y = northingMetres - FalseNorthingMetres;
        double vGrid = (x * _cosGammaC) - (y * _sinGammaC);
        double uGrid = (y * _cosGammaC) + (x * _sinGammaC) + _uOffset;
        double q = Math.Exp(-_b * vGrid / _a);
        double s = (q - (1 / q)) / 2, t = (q + (1 / q)) / 2;
        (double v, double cosBu) = Math.SinCos(_b * uGrid / _a);
        double u = ((v * _cosGamma0) + (s * _sinGamma0)) / t;
        // t' = (H/√((1+U)/(1−U)))^(1/B)  ⇒  ψ = −ln t' = (½ ln((1+U)/(1−U)) − ln H)/B
        double psi = Math.Abs(u) >= 1 ? Math.CopySign(double.PositiveInfinity, u) : (Math.Atanh(u) - Math.Log(_h)) / _b;
        double lat = IsometricLatitude.LatitudeDegrees(psi, _e);
        double lon = _lambda0Degrees - (Math.Atan2((s * _cosGamma0) - (v * _sinGamma0), cosBu) / _b / AngleMath.RadiansPerDegree);
        return (lat, Math.IEEERemainder(lon, AngleMath.FullTurnDegrees));
    }
}
