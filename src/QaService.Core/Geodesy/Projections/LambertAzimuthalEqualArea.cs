namespace QaService.Core.Geodesy.Projections;

/// <summary>
/// Lambert Azimuthal Equal Area, EPSG method 9820 (oblique, equatorial and polar aspects), after EPSG
/// Guidance Note 7-2 (IOGP Publication 373-7-2, September 2019), section "Lambert Azimuthal Equal Area";
/// Snyder (1987), USGS PP 1395, pp. 187–190 (eqs. 24-11 to 24-30).
/// </summary>
/// <remarks>
/// Forward is closed form. The inverse takes φ from the authalic latitude by the GN7-2 series (terms to e⁶,
/// ≤ 0.9 mm truncation at 45°, the same series PROJ 9.1.1 uses). Units: degrees, metres. Domain: the whole
/// ellipsoid except the antipode of the origin.
/// </remarks>
public sealed class LambertAzimuthalEqualArea : IMapProjection
{
    /// <summary>Below this |qP − |qO||, the origin is treated as a pole (polar aspect formulas of GN7-2).</summary>
    private const double PolarAspectTolerance = 1e-12;

    private readonly double _e, _a, _qp, _rq, _d;
    private readonly double _sinBeta0, _cosBeta0;
    private readonly int _pole; // +1 north polar, −1 south polar, 0 oblique/equatorial

    /// <summary>Creates the projection.</summary>
    /// <param name="ellipsoid">Ellipsoid.</param>
    /// <param name="originLatitudeDegrees">φ₀, degrees.</param>
    /// <param name="originLongitudeDegrees">λ₀, degrees.</param>
    /// <param name="falseEastingMetres">FE, metres.</param>
    /// <param name="falseNorthingMetres">FN, metres.</param>
    public LambertAzimuthalEqualArea(Ellipsoid ellipsoid, double originLatitudeDegrees, double originLongitudeDegrees, double falseEastingMetres, double falseNorthingMetres)
    {
        AngleMath.ValidateLatitude(originLatitudeDegrees, nameof(originLatitudeDegrees));
        Ellipsoid = ellipsoid;
        _e = ellipsoid.FirstEccentricity;
        _a = ellipsoid.SemiMajorAxisMetres;
        OriginLatitudeDegrees = originLatitudeDegrees;
        OriginLongitudeDegrees = originLongitudeDegrees;
        FalseEastingMetres = falseEastingMetres;
        FalseNorthingMetres = falseNorthingMetres;
        _qp = AuthalicLatitude.QFromSin(1, _e);
        double q0 = AuthalicLatitude.Q(originLatitudeDegrees, _e);
        _pole = Math.Abs(_qp - Math.Abs(q0)) < PolarAspectTolerance ? Math.Sign(originLatitudeDegrees) : 0;
        _rq = _a * Math.Sqrt(_qp / 2);
        double beta0 = Math.Asin(Math.Clamp(q0 / _qp, -1, 1));
        (_sinBeta0, _cosBeta0) = Math.SinCos(beta0);
        (double sinPhi0, double cosPhi0) = AngleMath.SinCosDegrees(originLatitudeDegrees);
        _d = _pole != 0 ? 1 : _a * cosPhi0 / Math.Sqrt(1 - (_e * _e * sinPhi0 * sinPhi0)) / (_rq * _cosBeta0);
    }

    /// <inheritdoc />
    public string MethodName => "Lambert Azimuthal Equal Area";

    /// <summary>The ellipsoid.</summary>
    public Ellipsoid Ellipsoid { get; }

    /// <summary>Latitude of natural origin φ₀, degrees.</summary>
    public double OriginLatitudeDegrees { get; }

    /// <summary>Longitude of natural origin λ₀, degrees.</summary>
    public double OriginLongitudeDegrees { get; }

    /// <summary>False easting, metres.</summary>
    public double FalseEastingMetres { get; }

    /// <summary>False northing, metres.</summary>
    public double FalseNorthingMetres { get; }

    /// <inheritdoc />
    public ProjectedCoordinate Forward(double latitudeDegrees, double longitudeDegrees)
    {
        AngleMath.ValidateLatitude(latitudeDegrees, nameof(latitudeDegrees));
        AngleMath.ValidateFinite(longitudeDegrees, nameof(longitudeDegrees));
        double q = AuthalicLatitude.Q(latitudeDegrees, _e);
        (double sinL, double cosL) = AngleMath.SinCosDegrees(AngleMath.LongitudeDifferenceDegrees(longitudeDegrees, OriginLongitudeDegrees));
        if (_pole != 0)
        {
            // GN7-2 polar aspect: ρ = a√(qP ∓ q); north: N = FN − ρ cos, south: N = FN + ρ cos.
            double rho = _a * Math.Sqrt(Math.Max(0, _qp - (_pole * q)));
            return new ProjectedCoordinate(FalseEastingMetres + (rho * sinL), FalseNorthingMetres - (_pole * rho * cosL));
        }

        double sinBeta = Math.Clamp(q / _qp, -1, 1);
        double cosBeta = Math.Sqrt(1 - (sinBeta * sinBeta));
        double denominator = 1 + (_sinBeta0 * sinBeta) + (_cosBeta0 * cosBeta * cosL);
        if (!(denominator > 0))
            throw new ArgumentOutOfRangeException(nameof(latitudeDegrees), latitudeDegrees, "The antipode of the projection origin has no single image.");
        double b = _rq * Math.Sqrt(2 / denominator);
        return new ProjectedCoordinate(
            FalseEastingMetres + (b * _d * cosBeta * sinL),
            FalseNorthingMetres + (b / _d * ((_cosBeta0 * sinBeta) - (_sinBeta0 * cosBeta * cosL))));
    }

    /// <inheritdoc />
    public (double LatitudeDegrees, double LongitudeDegrees) Inverse(double eastingMetres, double northingMetres)
    {
        AngleMath.ValidateFinite(eastingMetres, nameof(eastingMetres));
        AngleMath.ValidateFinite(northingMetres, nameof(northingMetres));
        double x = eastingMetres - FalseEastingMetres;
        double y = northingMetres - FalseNorthingMetres;
        double betaPrime, dLon;
        if (_pole != 0)
        {
            double rho = double.Hypot(x, y);
            double q = _pole * (_qp - (rho * rho / (_a * _a)));
            betaPrime = Math.Asin(Math.Clamp(q / _qp, -1, 1));
            dLon = Math.Atan2(x, -_pole * y);
        }
        else
        {
            double rho = double.Hypot(x / _d, _d * y);
            if (rho == 0)
                return (OriginLatitudeDegrees, OriginLongitudeDegrees);
            double c = 2 * Math.Asin(Math.Clamp(rho / (2 * _rq), -1, 1));
            (double sinC, double cosC) = Math.SinCos(c);
            betaPrime = Math.Asin(Math.Clamp((cosC * _sinBeta0) + (_d * y * sinC * _cosBeta0 / rho), -1, 1));
            dLon = Math.Atan2(x * sinC, (_d * rho * _cosBeta0 * cosC) - (_d * _d * y * _sinBeta0 * sinC));
        }

        double lat = AuthalicLatitude.LatitudeFromBetaSeries(betaPrime, _e);
        return (lat, Math.IEEERemainder(OriginLongitudeDegrees + (dLon / AngleMath.RadiansPerDegree), AngleMath.FullTurnDegrees));
    }
}
