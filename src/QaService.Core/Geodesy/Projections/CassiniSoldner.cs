namespace QaService.Core.Geodesy.Projections;

/// <summary>
/// Cassini-Soldner, EPSG method 9806, by the forward series of EPSG Guidance Note 7-2 (IOGP 373-7-2, 2019) section
/// "Cassini-Soldner" (Snyder 1987, USGS PP 1395, eqs. 13-7 to 13-12, pp. 95–96), with M(φ) from <see cref="MeridianArc"/>.
/// Inverse: GN7-2's inverse series as the first guess, refined by Newton's method on the forward series until
/// forward(inverse(E, N)) = (E, N) to rounding — the published inverse series is not the exact inverse of the forward
/// one (kilometres apart 30° from the central meridian), and PROJ 9.1.1 <c>+proj=cass</c> inverts exactly too (a cs2cs
/// round trip at 30° returns the input to 1e-10°). Units: degrees, metres. Accuracy of the forward series as a
/// map of the ellipsoid (common practice): centimetres within about 3° (300 km) of the central meridian, worse as A⁵
/// beyond; the values here equal PROJ's everywhere (projection-sweep-proj.tsv).
/// </summary>
public sealed class CassiniSoldner : IMapProjection
{
    private readonly double _e2, _m0, _lon0, _fe, _fn, _a;
    private readonly MeridianArc _arc;

    public CassiniSoldner(Ellipsoid ellipsoid, double originLatitudeDegrees, double originLongitudeDegrees, double falseEastingMetres, double falseNorthingMetres)
    {
        AngleMath.ValidateLatitude(originLatitudeDegrees, nameof(originLatitudeDegrees));
        _a = ellipsoid.SemiMajorAxisMetres;
        _e2 = ellipsoid.FirstEccentricitySquared;
        _arc = new MeridianArc(ellipsoid);
        _m0 = _arc.Metres(originLatitudeDegrees * AngleMath.RadiansPerDegree);
        _lon0 = originLongitudeDegrees;
        _fe = falseEastingMetres;
        _fn = falseNorthingMetres;
    }

    /// <inheritdoc />
    public string MethodName => "Cassini-Soldner";

    /// <inheritdoc />
    public ProjectedCoordinate Forward(double latitudeDegrees, double longitudeDegrees)
    {
        AngleMath.ValidateLatitude(latitudeDegrees, nameof(latitudeDegrees));
        AngleMath.ValidateFinite(longitudeDegrees, nameof(longitudeDegrees));
        double phi = latitudeDegrees * AngleMath.RadiansPerDegree;
        (double sin, double cos) = Math.SinCos(phi);
        double nu = _a / Math.Sqrt(1 - (_e2 * sin * sin));
        double tan = sin / cos, t = tan * tan;
        double c = _e2 * cos * cos / (1 - _e2);
        double a = AngleMath.LongitudeDifferenceDegrees(longitudeDegrees, _lon0) * AngleMath.RadiansPerDegree * cos, a2 = a * a;
        double x = nu * a * (1 - (a2 * t * ((1.0 / 6) + ((8 - t + (8 * c)) * a2 / 120))));
        double y = _arc.Metres(phi) - _m0 + (nu * tan * a2 * (0.5 + ((5 - t + (6 * c)) * a2 / 24)));
        return new ProjectedCoordinate(_fe + x, _fn + y);
    }

    /// <inheritdoc />
    public (double LatitudeDegrees, double LongitudeDegrees) Inverse(double eastingMetres, double northingMetres)
    {
        AngleMath.ValidateFinite(eastingMetres, nameof(eastingMetres));
        AngleMath.ValidateFinite(northingMetres, nameof(northingMetres));
        (double lat, double lon) = SeriesInverse(eastingMetres, northingMetres);
        if (!double.IsFinite(lat))
            return (double.NaN, double.NaN);
        for (int i = 0; i < MaxNewtonSteps; i++)
        {
            // 2×2 Newton on the forward series, Jacobian by central differences (step 1e-7°, ≈ 1 cm on the ground).
            var f = Forward(lat, lon);
            double rx = eastingMetres - f.EastingMetres, ry = northingMetres - f.NorthingMetres;
            if (double.Hypot(rx, ry) < ResidualToleranceMetres)
                break;
            double hLat = Math.Abs(lat) + JacobianStepDegrees > AngleMath.QuarterTurnDegrees ? -JacobianStepDegrees : JacobianStepDegrees;
            var fLat = Forward(lat + hLat, lon);
            var fLon = Forward(lat, lon + JacobianStepDegrees);
            double xPhi = (fLat.EastingMetres - f.EastingMetres) / hLat, yPhi = (fLat.NorthingMetres - f.NorthingMetres) / hLat;
            double xLam = (fLon.EastingMetres - f.EastingMetres) / JacobianStepDegrees, yLam = (fLon.NorthingMetres - f.NorthingMetres) / JacobianStepDegrees;
            double det = (xPhi * yLam) - (xLam * yPhi);
            if (!(Math.Abs(det) > 0))
                break;
            lat = Math.Clamp(lat + (((rx * yLam) - (ry * xLam)) / det), -AngleMath.QuarterTurnDegrees, AngleMath.QuarterTurnDegrees);
            lon += ((xPhi * ry) - (yPhi * rx)) / det;
        }
        return (lat, Math.IEEERemainder(lon, AngleMath.FullTurnDegrees));
    }

    /// <summary>Newton steps allowed after the series guess (2–4 suffice within the series' range).</summary>
    private const int MaxNewtonSteps = 12;

    /// <summary>Stop when the forward image is this close to the input, metres.</summary>
    private const double ResidualToleranceMetres = 1e-9;

    /// <summary>Step of the difference quotients, degrees.</summary>
    private const double JacobianStepDegrees = 1e-7;

    /// <summary>GN7-2's inverse series: footpoint latitude φ₁ of M₀ + (N − FN), then D = (E − FE)/ν₁.</summary>
    private (double LatitudeDegrees, double LongitudeDegrees) SeriesInverse(double eastingMetres, double northingMetres)
    {
        double phi1 = _arc.Footpoint(_m0 + (northingMetres - _fn));
        (double sin, double cos) = Math.SinCos(phi1);
        double w = 1 - (_e2 * sin * sin);
        double nu1 = _a / Math.Sqrt(w), rho1 = _a * (1 - _e2) / (w * Math.Sqrt(w));
        double tan = sin / cos, t1 = tan * tan;
        double d = (eastingMetres - _fe) / nu1, d2 = d * d;
        double phi = phi1 - (nu1 * tan / rho1 * d2 * (0.5 - ((1 + (3 * t1)) * d2 / 24)));
        double dLambda = d * (1 - (t1 * d2 * ((1.0 / 3) - ((1 + (3 * t1)) * d2 / 15)))) / cos;
        return (phi / AngleMath.RadiansPerDegree, _lon0 + (dLambda / AngleMath.RadiansPerDegree));
    }
}
