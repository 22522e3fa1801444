namespace QaService.Core.Geodesy.Projections;

/// <summary>
/// Equal Earth, EPSG method 1078 (Šavrič, Patterson and Jenny 2018), after EPSG Guidance Note 7-2 (IOGP 373-7-2,
/// 2019) section "Equal Earth": authalic latitude β = asin(q/q_P), θ = asin(√3/2·sin β),
/// E = FE + R_q·2√3·Δλ·cos θ / (3(9A₄θ⁸ + 7A₃θ⁶ + 3A₂θ² + A₁)), N = FN + R_q·θ(A₁ + A₂θ² + A₃θ⁶ + A₄θ⁸), R_q = a√(q_P/2).
/// Inverse: θ from N by Newton (as PROJ 9.1.1 <c>+proj=eqearth</c>), φ from β by GN7-2's e⁶ series (PROJ's
/// <c>pj_authlat</c>, so results agree with it; series truncation ≤ 0.9 mm). Units: degrees, metres. Domain: the
/// whole ellipsoid, |Δλ| ≤ 180°.
/// </summary>
public sealed class EqualEarth : IMapProjection
{
    private const double A1 = 1.340264, A2 = -0.081106, A3 = 0.000893, A4 = 0.003796;

    /// <summary>√3/2.</summary>
    private static readonly double M = Math.Sqrt(3) / 2;

    /// <summary>Newton steps and tolerance for θ (PROJ 9.1.1 allows 12 steps to 1e-9 rad; it converges in 3–4 to 1e-15).</summary>
    private const int MaxIterations = 12;
    private const double ToleranceRadians = 1e-15;

    private readonly double _e, _qPole, _rq, _lon0, _fe, _fn;

    public EqualEarth(Ellipsoid ellipsoid, double originLongitudeDegrees, double falseEastingMetres, double falseNorthingMetres)
    {
        _e = ellipsoid.FirstEccentricity;
        _qPole = AuthalicLatitude.QFromSin(1, _e);
        _rq = ellipsoid.SemiMajorAxisMetres * Math.Sqrt(_qPole / 2);
        _lon0 = originLongitudeDegrees;
        _fe = falseEastingMetres;
        _fn = falseNorthingMetres;
    }

    /// <inheritdoc />
    public string MethodName => "Equal Earth";

    /// <inheritdoc />
    public ProjectedCoordinate Forward(double latitudeDegrees, double longitudeDegrees)
    {
        AngleMath.ValidateLatitude(latitudeDegrees, nameof(latitudeDegrees));
        AngleMath.ValidateFinite(longitudeDegrees, nameof(longitudeDegrees));
        double sinBeta = Math.Clamp(AuthalicLatitude.Q(latitudeDegrees, _e) / _qPole, -1, 1);
        double theta = Math.Asin(M * sinBeta), t2 = theta * theta, t6 = t2 * t2 * t2;
        double dLambda = AngleMath.LongitudeDifferenceDegrees(longitudeDegrees, _lon0) * AngleMath.RadiansPerDegree;
        double x = _rq * dLambda * Math.Cos(theta) / (M * (A1 + (3 * A2 * t2) + (t6 * ((7 * A3) + (9 * A4 * t2)))));
        double y = _rq * theta * (A1 + (A2 * t2) + (t6 * (A3 + (A4 * t2))));
        return new ProjectedCoordinate(_fe + x, _fn + y);
    }

    /// <inheritdoc />
    public (double LatitudeDegrees, double LongitudeDegrees) Inverse(double eastingMetres, double northingMetres)
    {
        AngleMath.ValidateFinite(eastingMetres, nameof(eastingMetres));
        AngleMath.ValidateFinite(northingMetres, nameof(northingMetres));
        double x = (eastingMetres - _fe) / _rq, y = (northingMetres - _fn) / _rq;
        double theta = y, t2 = 0, t6 = 0;
        for (int i = 0; i < MaxIterations; i++)
        {
            t2 = theta * theta;
            t6 = t2 * t2 * t2;
            double step = ((theta * (A1 + (A2 * t2) + (t6 * (A3 + (A4 * t2))))) - y) / (A1 + (3 * A2 * t2) + (t6 * ((7 * A3) + (9 * A4 * t2))));
            theta -= step;
            if (!(Math.Abs(step) > ToleranceRadians))
                break;
        }
        t2 = theta * theta;
        t6 = t2 * t2 * t2;
        double dLambda = M * x * (A1 + (3 * A2 * t2) + (t6 * ((7 * A3) + (9 * A4 * t2)))) / Math.Cos(theta);
        double sinBeta = Math.Sin(theta) / M;
        if (!(Math.Abs(sinBeta) <= 1 + 1e-10)) // up to about 1 mm beyond the pole line (rounding) is the pole
            return (double.NaN, double.NaN);
        double lat = AuthalicLatitude.LatitudeFromBetaSeries(Math.Asin(Math.Clamp(sinBeta, -1, 1)), _e);
        return (lat, Math.IEEERemainder(_lon0 + (dLambda / AngleMath.RadiansPerDegree), AngleMath.FullTurnDegrees));
    }
}
