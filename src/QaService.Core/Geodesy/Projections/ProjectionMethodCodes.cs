namespace QaService.Core.Geodesy.Projections;

/// <summary>EPSG coordinate-operation method codes implemented here (EPSG dataset, table "Coordinate_Operation Method").</summary>
public static class ProjectionMethodCodes
{
    /// <summary>Popular Visualisation Pseudo Mercator.</summary>
    public const int PseudoMercator = 1024;
    /// <summary>Lambert Conic Conformal (1SP).</summary>
    public const int LambertConicConformal1SP = 9801;
    /// <summary>Lambert Conic Conformal (2SP).</summary>
    public const int LambertConicConformal2SP = 9802;
    /// <summary>Mercator (variant A).</summary>
    public const int MercatorA = 9804;
    /// <summary>Mercator (variant B).</summary>
    public const int MercatorB = 9805;
    /// <summary>Transverse Mercator.</summary>
    public const int TransverseMercator = 9807;
    /// <summary>Oblique Stereographic.</summary>
    public const int ObliqueStereographic = 9809;
    /// <summary>Polar Stereographic (variant A).</summary>
    public const int PolarStereographicA = 9810;
    /// <summary>Hotine Oblique Mercator (variant A).</summary>
    public const int HotineObliqueMercatorA = 9812;
    /// <summary>Hotine Oblique Mercator (variant B).</summary>
    public const int HotineObliqueMercatorB = 9815;
    /// <summary>Lambert Azimuthal Equal Area.</summary>
    public const int LambertAzimuthalEqualArea = 9820;
    /// <summary>Albers Equal Area.</summary>
    public const int AlbersEqualArea = 9822;
    /// <summary>Polar Stereographic (variant B).</summary>
    public const int PolarStereographicB = 9829;
    /// <summary>Mercator (Spherical).</summary>
    public const int MercatorSpherical = 1026;
    /// <summary>Lambert Azimuthal Equal Area (Spherical).</summary>
    public const int LambertAzimuthalEqualAreaSpherical = 1027;
    /// <summary>Equidistant Cylindrical (ellipsoidal).</summary>
    public const int EquidistantCylindrical = 1028;
    /// <summary>Equidistant Cylindrical (Spherical).</summary>
    public const int EquidistantCylindricalSpherical = 1029;
    /// <summary>Lambert Conic Conformal (2SP Michigan).</summary>
    public const int LambertConicConformal2SPMichigan = 1051;
    /// <summary>Colombia Urban.</summary>
    public const int ColombiaUrban = 1052;
    /// <summary>Equal Earth.</summary>
    public const int EqualEarth = 1078;
    /// <summary>Cassini-Soldner.</summary>
    public const int CassiniSoldner = 9806;
    /// <summary>Transverse Mercator (South Orientated).</summary>
    public const int TransverseMercatorSouthOrientated = 9808;
    /// <summary>Transverse Mercator Zoned Grid System.</summary>
    public const int TransverseMercatorZoned = 9824;
    /// <summary>Lambert Conic Conformal (West Orientated).</summary>
    public const int LambertConicConformalWestOrientated = 9826;
    /// <summary>Lambert Cylindrical Equal Area (ellipsoidal).</summary>
    public const int LambertCylindricalEqualArea = 9835;
}
