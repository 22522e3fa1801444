namespace QaService.Core.Geodesy.Projections;

/// <summary>
/// An EPSG "(Spherical)" method — 1026 Mercator (Spherical), 1027 Lambert Azimuthal Equal Area (Spherical), 1029
/// Equidistant Cylindrical (Spherical) — evaluated by the ellipsoidal implementation on a sphere, with the latitude
/// and longitude used as they are (no auxiliary latitude). The sphere's radius is the authalic radius
/// R_A = a·√(q_P/2) of the CRS's ellipsoid (EPSG Guidance Note 7-2 (IOGP 373-7-2, 2019), "Lambert Azimuthal Equal
/// Area (Spherical)": used with the authalic sphere; PROJ's <c>+R_A</c>); on a sphere R_A = a. Units: degrees, metres.
/// Note: PROJ 9.1.1 exports method 1027 as the ellipsoidal <c>+proj=laea</c> (EPSG:9311), so its values for that CRS
/// differ from EPSG's definition; the formulas here are checked against PROJ's spherical forms with <c>+R_A</c>.
/// </summary>
public sealed class SphericalForm(string methodName, IMapProjection onSphere) : IMapProjection
{
    /// <inheritdoc />
    public string MethodName => methodName;

    /// <summary>The authalic sphere of an ellipsoid: radius a·√(q_P/2) (Snyder 1987, eq. 3-13, p. 16), flattening 0.</summary>
    public static Ellipsoid AuthalicSphere(Ellipsoid ellipsoid) =>
        new($"{ellipsoid.Name} authalic sphere", ellipsoid.SemiMajorAxisMetres * Math.Sqrt(AuthalicLatitude.QFromSin(1, ellipsoid.FirstEccentricity) / 2), double.PositiveInfinity);

    /// <inheritdoc />
    public ProjectedCoordinate Forward(double latitudeDegrees, double longitudeDegrees) => onSphere.Forward(latitudeDegrees, longitudeDegrees);

    /// <inheritdoc />
    public (double LatitudeDegrees, double LongitudeDegrees) Inverse(double eastingMetres, double northingMetres) => onSphere.Inverse(eastingMetres, northingMetres);
}
