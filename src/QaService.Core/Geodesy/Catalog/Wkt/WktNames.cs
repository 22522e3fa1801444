using M = QaService.Core.Geodesy.Projections.ProjectionMethodCodes;
using P = QaService.Core.Geodesy.Projections.ProjectionParameterCodes;

namespace QaService.Core.Geodesy.Catalog.Wkt;

/// <summary>
/// Method and parameter names as WKT writes them, mapped to EPSG codes: the EPSG names (WKT2, ISO 19162
/// uses them) and the WKT1 names of OGC 01-009 as GDAL and PROJ 9.1.1 write them (<c>projinfo -o WKT1_GDAL</c>).
/// Names are compared after removing everything but letters and digits, lower case.
/// </summary>
internal static class WktNames
{
    private static readonly Dictionary<string, int> Methods = new()
    {
        ["transversemercator"] = M.TransverseMercator,
        ["lambertconicconformal1sp"] = M.LambertConicConformal1SP,
        ["lambertconformalconic1sp"] = M.LambertConicConformal1SP,
        ["lambertconicconformal2sp"] = M.LambertConicConformal2SP,
        ["lambertconformalconic2sp"] = M.LambertConicConformal2SP,
        ["mercatorvarianta"] = M.MercatorA,
        ["mercator1sp"] = M.MercatorA,
        ["mercatorvariantb"] = M.MercatorB,
        ["mercator2sp"] = M.MercatorB,
        ["popularvisualisationpseudomercator"] = M.PseudoMercator,
        ["obliquestereographic"] = M.ObliqueStereographic,
        ["polarstereographicvarianta"] = M.PolarStereographicA,
        ["polarstereographic"] = M.PolarStereographicA, // WKT1: variant B when the latitude of origin is not a pole
        ["polarstereographicvariantb"] = M.PolarStereographicB,
        ["lambertazimuthalequalarea"] = M.LambertAzimuthalEqualArea,
        ["albersequalarea"] = M.AlbersEqualArea,
        ["albersconicequalarea"] = M.AlbersEqualArea,
        ["hotineobliquemercatorvarianta"] = M.HotineObliqueMercatorA,
        ["hotineobliquemercator"] = M.HotineObliqueMercatorA,
        ["hotineobliquemercatorvariantb"] = M.HotineObliqueMercatorB,
        ["hotineobliquemercatorazimuthcenter"] = M.HotineObliqueMercatorB,
        ["mercatorspherical"] = M.MercatorSpherical,
        ["lambertazimuthalequalareaspherical"] = M.LambertAzimuthalEqualAreaSpherical,
        ["equidistantcylindrical"] = M.EquidistantCylindrical,
        ["equirectangular"] = M.EquidistantCylindrical,
        ["equidistantcylindricalspherical"] = M.EquidistantCylindricalSpherical,
        ["lambertconicconformal2spmichigan"] = M.LambertConicConformal2SPMichigan,
        ["equalearth"] = M.EqualEarth,
        ["cassinisoldner"] = M.CassiniSoldner,
        ["transversemercatorsouthorientated"] = M.TransverseMercatorSouthOrientated,
        ["transversemercatorzonedgridsystem"] = M.TransverseMercatorZoned,
        ["lambertconicconformalwestorientated"] = M.LambertConicConformalWestOrientated,
        ["lambertcylindricalequalarea"] = M.LambertCylindricalEqualArea,
        ["lambertcylindricalequalareaellipsoidal"] = M.LambertCylindricalEqualArea,
        ["cylindricalequalarea"] = M.LambertCylindricalEqualArea,
        ["colombiaurban"] = M.ColombiaUrban,
    };

    private static readonly Dictionary<string, int> EpsgParameters = new()
    {
        ["latitudeofnaturalorigin"] = P.LatitudeOfNaturalOrigin,
        ["longitudeofnaturalorigin"] = P.LongitudeOfNaturalOrigin,
        ["scalefactoratnaturalorigin"] = P.ScaleFactorAtNaturalOrigin,
        ["falseeasting"] = P.FalseEasting,
        ["falsenorthing"] = P.FalseNorthing,
        ["latitudeofprojectioncentre"] = P.LatitudeOfProjectionCentre,
        ["longitudeofprojectioncentre"] = P.LongitudeOfProjectionCentre,
        ["azimuthofinitialline"] = P.AzimuthOfInitialLine,
        ["anglefromrectifiedtoskewgrid"] = P.AngleFromRectifiedToSkewGrid,
        ["scalefactoroninitialline"] = P.ScaleFactorOnInitialLine,
        ["eastingatprojectioncentre"] = P.EastingAtProjectionCentre,
        ["northingatprojectioncentre"] = P.NorthingAtProjectionCentre,
        ["latitudeoffalseorigin"] = P.LatitudeOfFalseOrigin,
        ["longitudeoffalseorigin"] = P.LongitudeOfFalseOrigin,
        ["latitudeof1ststandardparallel"] = P.LatitudeOf1stStandardParallel,
        ["latitudeof2ndstandardparallel"] = P.LatitudeOf2ndStandardParallel,
        ["eastingatfalseorigin"] = P.EastingAtFalseOrigin,
        ["northingatfalseorigin"] = P.NorthingAtFalseOrigin,
        ["latitudeofstandardparallel"] = P.LatitudeOfStandardParallel,
        ["longitudeoforigin"] = P.LongitudeOfOrigin,
        ["initiallongitude"] = P.InitialLongitude,
        ["zonewidth"] = P.ZoneWidth,
        ["ellipsoidscalingfactor"] = P.EllipsoidScalingFactor,
        ["projectionplaneoriginheight"] = P.ProjectionPlaneOriginHeight,
    };

    /// <summary>Lower-case letters and digits only.</summary>
    internal static string Normalise(string name) =>
        string.Concat(name.Where(char.IsAsciiLetterOrDigit)).ToLowerInvariant();

    /// <summary>EPSG method code for a WKT1 or EPSG method name, or null.</summary>
    internal static int? Method(string name) => Methods.TryGetValue(Normalise(name), out var code) ? code : null;

    /// <summary>EPSG code of a method the service refuses (<see cref="Projections.RefusedProjectionMethods"/>), by EPSG or WKT1 name, or null.</summary>
    internal static int? RefusedMethod(string name)
    {
        var key = Normalise(name);
        foreach (var (code, refused) in Projections.RefusedProjectionMethods.All)
        {
            if (Normalise(refused.Name) == key || refused.WktNames.Any(n => Normalise(n) == key))
                return code;
        }
        return null;
    }

    /// <summary>EPSG parameter code for an EPSG parameter name (WKT2), or null.</summary>
    internal static int? EpsgParameter(string name) => EpsgParameters.TryGetValue(Normalise(name), out var code) ? code : null;

    /// <summary>
    /// EPSG parameter code for a WKT1 parameter name under a method (OGC 01-009 names; the same WKT1 name
    /// means different EPSG parameters for natural-origin and false-origin methods), or null.
    /// </summary>
    internal static int? Wkt1Parameter(string name, int method)
    {
        bool falseOrigin = method is M.LambertConicConformal2SP or M.LambertConicConformal2SPMichigan or M.AlbersEqualArea;
        bool hotine = method is M.HotineObliqueMercatorA or M.HotineObliqueMercatorB;
        return Normalise(name) switch
        {
            "latitudeoforigin" => falseOrigin ? P.LatitudeOfFalseOrigin : method == M.PolarStereographicB ? P.LatitudeOfStandardParallel : P.LatitudeOfNaturalOrigin,
            "centralmeridian" => falseOrigin ? P.LongitudeOfFalseOrigin : method == M.PolarStereographicB ? P.LongitudeOfOrigin : P.LongitudeOfNaturalOrigin,
            "latitudeofcenter" => hotine ? P.LatitudeOfProjectionCentre : falseOrigin ? P.LatitudeOfFalseOrigin : P.LatitudeOfNaturalOrigin,
            "longitudeofcenter" => hotine ? P.LongitudeOfProjectionCentre : falseOrigin ? P.LongitudeOfFalseOrigin : P.LongitudeOfNaturalOrigin,
            "scalefactor" => hotine ? P.ScaleFactorOnInitialLine : P.ScaleFactorAtNaturalOrigin,
            "falseeasting" => falseOrigin ? P.EastingAtFalseOrigin : method == M.HotineObliqueMercatorB ? P.EastingAtProjectionCentre : P.FalseEasting,
            "falsenorthing" => falseOrigin ? P.NorthingAtFalseOrigin : method == M.HotineObliqueMercatorB ? P.NorthingAtProjectionCentre : P.FalseNorthing,
            "standardparallel1" => P.LatitudeOf1stStandardParallel,
            "standardparallel2" => P.LatitudeOf2ndStandardParallel,
            "azimuth" => P.AzimuthOfInitialLine,
            "rectifiedgridangle" => P.AngleFromRectifiedToSkewGrid,
            _ => EpsgParameter(name),
        };
    }

    /// <summary>EPSG parameter name for display.</summary>
    internal static string ParameterName(int code) => DisplayNames.TryGetValue(code, out var name) ? name : $"EPSG:{code}";

    private static readonly Dictionary<int, string> DisplayNames = new()
    {
        [P.LatitudeOfNaturalOrigin] = "Latitude of natural origin",
        [P.LongitudeOfNaturalOrigin] = "Longitude of natural origin",
        [P.ScaleFactorAtNaturalOrigin] = "Scale factor at natural origin",
        [P.FalseEasting] = "False easting",
        [P.FalseNorthing] = "False northing",
        [P.LatitudeOfProjectionCentre] = "Latitude of projection centre",
        [P.LongitudeOfProjectionCentre] = "Longitude of projection centre",
        [P.AzimuthOfInitialLine] = "Azimuth of initial line",
        [P.AngleFromRectifiedToSkewGrid] = "Angle from Rectified to Skew Grid",
        [P.ScaleFactorOnInitialLine] = "Scale factor on initial line",
        [P.EastingAtProjectionCentre] = "Easting at projection centre",
        [P.NorthingAtProjectionCentre] = "Northing at projection centre",
        [P.LatitudeOfFalseOrigin] = "Latitude of false origin",
        [P.LongitudeOfFalseOrigin] = "Longitude of false origin",
        [P.LatitudeOf1stStandardParallel] = "Latitude of 1st standard parallel",
        [P.LatitudeOf2ndStandardParallel] = "Latitude of 2nd standard parallel",
        [P.EastingAtFalseOrigin] = "Easting at false origin",
        [P.NorthingAtFalseOrigin] = "Northing at false origin",
        [P.LatitudeOfStandardParallel] = "Latitude of standard parallel",
        [P.LongitudeOfOrigin] = "Longitude of origin",
        [P.InitialLongitude] = "Initial longitude",
        [P.ZoneWidth] = "Zone width",
        [P.EllipsoidScalingFactor] = "Ellipsoid scaling factor",
        [P.ProjectionPlaneOriginHeight] = "Projection plane origin height",
    };

    /// <summary>EPSG method name for display.</summary>
    internal static string MethodName(int code) => code switch
    {
        M.TransverseMercator => "Transverse Mercator",
        M.LambertConicConformal1SP => "Lambert Conic Conformal (1SP)",
        M.LambertConicConformal2SP => "Lambert Conic Conformal (2SP)",
        M.MercatorA => "Mercator (variant A)",
        M.MercatorB => "Mercator (variant B)",
        M.PseudoMercator => "Popular Visualisation Pseudo Mercator",
        M.ObliqueStereographic => "Oblique Stereographic",
        M.PolarStereographicA => "Polar Stereographic (variant A)",
        M.PolarStereographicB => "Polar Stereographic (variant B)",
        M.LambertAzimuthalEqualArea => "Lambert Azimuthal Equal Area",
        M.AlbersEqualArea => "Albers Equal Area",
        M.HotineObliqueMercatorA => "Hotine Oblique Mercator (variant A)",
        M.HotineObliqueMercatorB => "Hotine Oblique Mercator (variant B)",
        M.MercatorSpherical => "Mercator (Spherical)",
        M.LambertAzimuthalEqualAreaSpherical => "Lambert Azimuthal Equal Area (Spherical)",
        M.EquidistantCylindrical => "Equidistant Cylindrical",
        M.EquidistantCylindricalSpherical => "Equidistant Cylindrical (Spherical)",
        M.LambertConicConformal2SPMichigan => "Lambert Conic Conformal (2SP Michigan)",
        M.EqualEarth => "Equal Earth",
        M.CassiniSoldner => "Cassini-Soldner",
        M.TransverseMercatorSouthOrientated => "Transverse Mercator (South Orientated)",
        M.TransverseMercatorZoned => "Transverse Mercator Zoned Grid System",
        M.LambertConicConformalWestOrientated => "Lambert Conic Conformal (West Orientated)",
        M.LambertCylindricalEqualArea => "Lambert Cylindrical Equal Area",
        M.ColombiaUrban => "Colombia Urban",
        _ => $"EPSG:{code}",
    };

    /// <summary>True for angle parameters (degrees), false for lengths and scales.</summary>
    internal static bool IsAngle(int code) => EpsgCatalogFile.ParameterUnit(code) == "degree";

    /// <summary>True for scale parameters (unity).</summary>
    internal static bool IsScale(int code) => EpsgCatalogFile.ParameterUnit(code) == "unity";
}
