using P = QaService.Core.Geodesy.Projections.ProjectionParameterCodes;

namespace QaService.Core.Geodesy.Projections;

/// <summary>
/// Builds a bound <see cref="IMapProjection"/> from an EPSG method code and its parameters (angles in
/// degrees, lengths in metres, scales unitless), the form of the EPSG catalog and of parsed WKT.
/// </summary>
public static class ProjectionFactory
{
    /// <summary>Method codes <see cref="Create"/> accepts.</summary>
    public static IReadOnlySet<int> SupportedMethods { get; } = new HashSet<int>
    {
        ProjectionMethodCodes.TransverseMercator, ProjectionMethodCodes.LambertConicConformal1SP, ProjectionMethodCodes.LambertConicConformal2SP,
        ProjectionMethodCodes.MercatorA, ProjectionMethodCodes.MercatorB, ProjectionMethodCodes.PseudoMercator,
        ProjectionMethodCodes.ObliqueStereographic, ProjectionMethodCodes.PolarStereographicA, ProjectionMethodCodes.PolarStereographicB,
        ProjectionMethodCodes.LambertAzimuthalEqualArea, ProjectionMethodCodes.AlbersEqualArea,
        ProjectionMethodCodes.HotineObliqueMercatorA, ProjectionMethodCodes.HotineObliqueMercatorB,
        ProjectionMethodCodes.MercatorSpherical, ProjectionMethodCodes.LambertAzimuthalEqualAreaSpherical,
        ProjectionMethodCodes.EquidistantCylindrical, ProjectionMethodCodes.EquidistantCylindricalSpherical,
        ProjectionMethodCodes.LambertConicConformal2SPMichigan, ProjectionMethodCodes.EqualEarth, ProjectionMethodCodes.CassiniSoldner,
        ProjectionMethodCodes.TransverseMercatorSouthOrientated, ProjectionMethodCodes.TransverseMercatorZoned,
        ProjectionMethodCodes.LambertConicConformalWestOrientated, ProjectionMethodCodes.LambertCylindricalEqualArea, ProjectionMethodCodes.ColombiaUrban,
    };

    /// <summary>Creates the projection, or null when the method is not implemented.</summary>
    /// <param name="methodCode">EPSG method code.</param>
    /// <param name="ellipsoid">Ellipsoid of the base geographic CRS.</param>
    /// <param name="parameters">EPSG parameter code → value (degrees, metres or unity).</param>
    /// <exception cref="ArgumentException">A required parameter is missing or a value is out of range.</exception>
    public static IMapProjection? Create(int methodCode, Ellipsoid ellipsoid, IReadOnlyDictionary<int, double> parameters)
    {
        double Get(int code, double? fallback = null) =>
            parameters.TryGetValue(code, out var v) ? v
            : fallback ?? throw new ArgumentException($"parameter EPSG:{code} is required by method EPSG:{methodCode}", nameof(parameters));

        return methodCode switch
        {
            ProjectionMethodCodes.TransverseMercator => new TransverseMercator(ellipsoid, Get(P.LongitudeOfNaturalOrigin),
                Get(P.ScaleFactorAtNaturalOrigin), Get(P.FalseEasting, 0), Get(P.FalseNorthing, 0), Get(P.LatitudeOfNaturalOrigin, 0)),
            ProjectionMethodCodes.LambertConicConformal1SP => LambertConicConformal.OneParallel(ellipsoid, Get(P.LatitudeOfNaturalOrigin),
                Get(P.LongitudeOfNaturalOrigin), Get(P.ScaleFactorAtNaturalOrigin, 1), Get(P.FalseEasting, 0), Get(P.FalseNorthing, 0)),
            ProjectionMethodCodes.LambertConicConformal2SP => LambertConicConformal.TwoParallels(ellipsoid, Get(P.LatitudeOfFalseOrigin),
                Get(P.LongitudeOfFalseOrigin), Get(P.LatitudeOf1stStandardParallel), Get(P.LatitudeOf2ndStandardParallel),
                Get(P.EastingAtFalseOrigin, 0), Get(P.NorthingAtFalseOrigin, 0)),
            ProjectionMethodCodes.MercatorA => Mercator.VariantA(ellipsoid, Get(P.LongitudeOfNaturalOrigin),
                Get(P.ScaleFactorAtNaturalOrigin, 1), Get(P.FalseEasting, 0), Get(P.FalseNorthing, 0)),
            ProjectionMethodCodes.MercatorB => Mercator.VariantB(ellipsoid, Get(P.LatitudeOf1stStandardParallel),
                Get(P.LongitudeOfNaturalOrigin), Get(P.FalseEasting, 0), Get(P.FalseNorthing, 0)),
            ProjectionMethodCodes.PseudoMercator => Mercator.PseudoMercator(ellipsoid, Get(P.LongitudeOfNaturalOrigin, 0),
                Get(P.FalseEasting, 0), Get(P.FalseNorthing, 0)),
            ProjectionMethodCodes.ObliqueStereographic => new ObliqueStereographic(ellipsoid, Get(P.LatitudeOfNaturalOrigin),
                Get(P.LongitudeOfNaturalOrigin), Get(P.ScaleFactorAtNaturalOrigin, 1), Get(P.FalseEasting, 0), Get(P.FalseNorthing, 0)),
            ProjectionMethodCodes.PolarStereographicA => PolarStereographic.VariantA(ellipsoid, Get(P.LatitudeOfNaturalOrigin),
                Get(P.LongitudeOfNaturalOrigin), Get(P.ScaleFactorAtNaturalOrigin, 1), Get(P.FalseEasting, 0), Get(P.FalseNorthing, 0)),
            ProjectionMethodCodes.PolarStereographicB => PolarStereographic.VariantB(ellipsoid, Get(P.LatitudeOfStandardParallel),
                Get(P.LongitudeOfOrigin), Get(P.FalseEasting, 0), Get(P.FalseNorthing, 0)),
            ProjectionMethodCodes.LambertAzimuthalEqualArea => new LambertAzimuthalEqualArea(ellipsoid, Get(P.LatitudeOfNaturalOrigin),
                Get(P.LongitudeOfNaturalOrigin), Get(P.FalseEasting, 0), Get(P.FalseNorthing, 0)),
            ProjectionMethodCodes.AlbersEqualArea => new AlbersEqualArea(ellipsoid, Get(P.LatitudeOfFalseOrigin),
                Get(P.LongitudeOfFalseOrigin), Get(P.LatitudeOf1stStandardParallel), Get(P.LatitudeOf2ndStandardParallel),
                Get(P.EastingAtFalseOrigin, 0), Get(P.NorthingAtFalseOrigin, 0)),
            ProjectionMethodCodes.HotineObliqueMercatorA or ProjectionMethodCodes.HotineObliqueMercatorB => new HotineObliqueMercator(
                ellipsoid, methodCode == ProjectionMethodCodes.HotineObliqueMercatorB,
                Get(P.LatitudeOfProjectionCentre), Get(P.LongitudeOfProjectionCentre), Get(P.AzimuthOfInitialLine),
                Get(P.AngleFromRectifiedToSkewGrid), Get(P.ScaleFactorOnInitialLine),
                methodCode == ProjectionMethodCodes.HotineObliqueMercatorB ? Get(P.EastingAtProjectionCentre, 0) : Get(P.FalseEasting, 0),
                methodCode == ProjectionMethodCodes.HotineObliqueMercatorB ? Get(P.NorthingAtProjectionCentre, 0) : Get(P.FalseNorthing, 0)),
            ProjectionMethodCodes.MercatorSpherical => new SphericalForm("Mercator (Spherical)", Mercator.VariantA(SphericalForm.AuthalicSphere(ellipsoid),
                Get(P.LongitudeOfNaturalOrigin), 1, Get(P.FalseEasting, 0), Get(P.FalseNorthing, 0))),
            ProjectionMethodCodes.LambertAzimuthalEqualAreaSpherical => new SphericalForm("Lambert Azimuthal Equal Area (Spherical)",
                new LambertAzimuthalEqualArea(SphericalForm.AuthalicSphere(ellipsoid), Get(P.LatitudeOfNaturalOrigin), Get(P.LongitudeOfNaturalOrigin),
                    Get(P.FalseEasting, 0), Get(P.FalseNorthing, 0))),
            ProjectionMethodCodes.EquidistantCylindrical => new EquidistantCylindrical("Equidistant Cylindrical", ellipsoid,
                Get(P.LatitudeOf1stStandardParallel, 0), Get(P.LongitudeOfNaturalOrigin), Get(P.FalseEasting, 0), Get(P.FalseNorthing, 0)),
            ProjectionMethodCodes.EquidistantCylindricalSpherical => new SphericalForm("Equidistant Cylindrical (Spherical)", new EquidistantCylindrical(
                "Equidistant Cylindrical (Spherical)", SphericalForm.AuthalicSphere(ellipsoid), Get(P.LatitudeOf1stStandardParallel, 0),
                Get(P.LongitudeOfNaturalOrigin), Get(P.FalseEasting, 0), Get(P.FalseNorthing, 0))),
            ProjectionMethodCodes.LambertConicConformal2SPMichigan => LambertConicConformal.TwoParallels(
                ellipsoid with { SemiMajorAxisMetres = ellipsoid.SemiMajorAxisMetres * Get(P.EllipsoidScalingFactor) }, Get(P.LatitudeOfFalseOrigin),
                Get(P.LongitudeOfFalseOrigin), Get(P.LatitudeOf1stStandardParallel), Get(P.LatitudeOf2ndStandardParallel),
                Get(P.EastingAtFalseOrigin, 0), Get(P.NorthingAtFalseOrigin, 0), "Lambert Conic Conformal (2SP Michigan)"),
            ProjectionMethodCodes.EqualEarth => new EqualEarth(ellipsoid, Get(P.LongitudeOfNaturalOrigin, 0), Get(P.FalseEasting, 0), Get(P.FalseNorthing, 0)),
            ProjectionMethodCodes.CassiniSoldner => new CassiniSoldner(ellipsoid, Get(P.LatitudeOfNaturalOrigin), Get(P.LongitudeOfNaturalOrigin),
                Get(P.FalseEasting, 0), Get(P.FalseNorthing, 0)),
            ProjectionMethodCodes.TransverseMercatorSouthOrientated => new OrientedAxes("Transverse Mercator (South Orientated)",
                new TransverseMercator(ellipsoid, Get(P.LongitudeOfNaturalOrigin), Get(P.ScaleFactorAtNaturalOrigin), 0, 0, Get(P.LatitudeOfNaturalOrigin, 0)),
                westing: true, southing: true, Get(P.FalseEasting, 0), Get(P.FalseNorthing, 0)),
            ProjectionMethodCodes.TransverseMercatorZoned => new TransverseMercatorZoned(ellipsoid, Get(P.LatitudeOfNaturalOrigin, 0), Get(P.InitialLongitude),
                Get(P.ZoneWidth), Get(P.ScaleFactorAtNaturalOrigin), Get(P.FalseEasting, 0), Get(P.FalseNorthing, 0)),
            ProjectionMethodCodes.LambertConicConformalWestOrientated => new OrientedAxes("Lambert Conic Conformal (West Orientated)",
                LambertConicConformal.OneParallel(ellipsoid, Get(P.LatitudeOfNaturalOrigin), Get(P.LongitudeOfNaturalOrigin), Get(P.ScaleFactorAtNaturalOrigin, 1), 0, 0),
                westing: true, southing: false, Get(P.FalseEasting, 0), Get(P.FalseNorthing, 0)),
            ProjectionMethodCodes.LambertCylindricalEqualArea => new LambertCylindricalEqualArea(ellipsoid, Get(P.LatitudeOf1stStandardParallel, 0),
                Get(P.LongitudeOfNaturalOrigin), Get(P.FalseEasting, 0), Get(P.FalseNorthing, 0)),
            ProjectionMethodCodes.ColombiaUrban => new ColombiaUrban(ellipsoid, Get(P.LatitudeOfNaturalOrigin), Get(P.LongitudeOfNaturalOrigin),
                Get(P.FalseEasting, 0), Get(P.FalseNorthing, 0), Get(P.ProjectionPlaneOriginHeight, 0)),
            _ => null,
        };
    }
}
