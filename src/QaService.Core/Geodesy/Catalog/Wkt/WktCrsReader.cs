using System.Globalization;
using QaService.Core.Geodesy.Projections;

namespace QaService.Core.Geodesy.Catalog.Wkt;

/// <summary>
/// Builds a <see cref="CoordinateReferenceSystem"/> from OGC WKT: WKT1 (OGC 01-009 §7: <c>GEOGCS</c>,
/// <c>PROJCS</c>, <c>GEOCCS</c>, with <c>TOWGS84</c>) and WKT2 (ISO 19162:2015 and :2019, OGC 18-010r7:
/// <c>GEOGCRS</c>, <c>GEODCRS</c>, <c>PROJCRS</c>, <c>BOUNDCRS</c>). A CRS carrying an EPSG identifier
/// that is in the catalog resolves to the catalog entry; otherwise it is built from its datum, ellipsoid,
/// projection method, parameters and unit. A WKT1 <c>TOWGS84</c> (or a WKT2 <c>BOUNDCRS</c> to WGS 84 by a
/// Helmert method) is kept on the datum as <see cref="GeodeticDatum.HelmertToWgs84"/>.
/// </summary>
public static partial class WktCrsReader
{
    /// <summary>Radians per degree, the angle unit parameters are converted to.</summary>
    private const double RadiansPerDegree = Math.PI / 180;

    /// <summary>Radians per arc-second, π/648000 (rotation parameters of TOWGS84 and Helmert methods).</summary>
    private const double RadiansPerArcSecond = Math.PI / 648_000;

    /// <summary>Unit factors closer than this (relative) to a known unit are taken as that unit exactly.</summary>
    private const double UnitMatchTolerance = 1e-12;

    /// <summary>Helmert methods of a WKT2 BOUNDCRS that map to TOWGS84 (EPSG codes; 9607 has the opposite rotation sign).</summary>
    private const int PositionVector2D = 9606, CoordinateFrame2D = 9607, GeocentricTranslations2D = 9603,
        PositionVectorGeocentric = 1033, CoordinateFrameGeocentric = 1032, GeocentricTranslationsGeocentric = 1031,
        PositionVector3D = 1037, CoordinateFrame3D = 1038, GeocentricTranslations3D = 1035;

    /// <summary>EPSG parameter "Scale difference" (dS) of the Helmert methods.</summary>
    private const int ScaleDifferenceCode = 8611;

    /// <summary>A unitless scale-difference value within this of 1 is read as the multiplier 1 + dS (|dS| of real datums is below 1e-4).</summary>
    private const double ScaleMultiplierBand = 0.01;

    private static readonly string[] GeographicKeywords = ["GEOGCS", "GEOGCRS", "GEOGRAPHICCRS", "BASEGEOGCRS"];
    private static readonly string[] GeodeticKeywords = ["GEODCRS", "GEODETICCRS", "BASEGEODCRS"];
    private static readonly string[] ProjectedKeywords = ["PROJCS", "PROJCRS", "PROJECTEDCRS"];
    private static readonly string[] AllCrsKeywords =
        ["GEOGCS", "PROJCS", "GEOCCS", "GEOGCRS", "GEOGRAPHICCRS", "GEODCRS", "GEODETICCRS", "PROJCRS", "PROJECTEDCRS", "BOUNDCRS",
         "COMPD_CS", "COMPOUNDCRS", "VERT_CS", "VERTCRS", "VERTICALCRS", "LOCAL_CS", "ENGCRS", "ENGINEERINGCRS", "FITTED_CS", "DERIVEDPROJCRS", "BASEGEOGCRS"];

    /// <summary>True when the text starts with a WKT CRS keyword followed by a bracket.</summary>
    public static bool LooksLikeWkt(string text)
    {
        int i = 0;
        while (i < text.Length && (char.IsAsciiLetter(text[i]) || text[i] == '_'))
            i++;
        int bracket = i;
        while (bracket < text.Length && char.IsWhiteSpace(text[bracket]))
            bracket++;
        return i > 0 && bracket < text.Length && text[bracket] is '[' or '('
               && AllCrsKeywords.Contains(text[..i].ToUpperInvariant());
    }

    /// <summary>Reads WKT text into a CRS, or a message saying what is wrong or not supported yet.</summary>
    public static CrsResolution Read(string text)
    {
        WktNode root;
        try
        {
            root = WktParser.Parse(text);
        }
        catch (FormatException e)
        {
            return CrsResolution.Failed($"the CRS WKT could not be read: {e.Message}");
        }

        try
        {
            return Build(root);
        }
        catch (ArgumentException e)
        {
            return CrsResolution.Failed($"the CRS WKT could not be used: {e.Message}");
        }
    }

    private static CrsResolution Build(WktNode root)
    {
        HelmertToWgs84? helmert = null;
        if (root.Keyword == "BOUNDCRS")
        {
            var source = root.Child("SOURCECRS")?.Values.OfType<WktNode>().FirstOrDefault();
            if (source is null)
                return CrsResolution.Failed("BOUNDCRS without a SOURCECRS");
            var target = root.Child("TARGETCRS")?.Values.OfType<WktNode>().FirstOrDefault();
            var transformation = root.Child("ABRIDGEDTRANSFORMATION");
            if (target is null || transformation is null || !IsWgs84(target))
                return CrsResolution.Failed("a BOUNDCRS is supported only with an ABRIDGEDTRANSFORMATION to WGS 84");
            helmert = HelmertFromAbridged(transformation);
            if (helmert is null)
                return CrsResolution.Failed($"BOUNDCRS transformation \"{transformation.Name}\" is not supported yet; Helmert (position vector, coordinate frame, geocentric translations) to WGS 84 is");
            root = source;
        }

        if (root.Keyword is "COMPD_CS" or "COMPOUNDCRS")
            return CrsResolution.Failed("compound CRSs (horizontal + vertical) given as WKT are not supported yet; give the horizontal CRS and say the height reference in \"heights\"");

        CrsKind? kind = root.Keyword switch
        {
            _ when ProjectedKeywords.Contains(root.Keyword) => CrsKind.Projected,
            _ when GeographicKeywords.Contains(root.Keyword) => CrsKind.Geographic,
            "GEOCCS" => CrsKind.Geocentric,
            _ when GeodeticKeywords.Contains(root.Keyword) => root.Child("CS")?.Word == "cartesian" ? CrsKind.Geocentric : CrsKind.Geographic,
            _ => null,
        };
        if (kind is null)
            return CrsResolution.Failed($"WKT {root.Keyword} CRSs are not supported yet; geographic, geocentric and projected CRSs are");

        var geodetic = kind == CrsKind.Projected ? root.Child([.. GeographicKeywords, .. GeodeticKeywords]) : root;
        if (geodetic is null)
            return CrsResolution.Failed($"{root.Keyword} has no base geographic CRS");
        var datumNode = geodetic.Child("DATUM", "GEODETICDATUM", "TRF", "ENSEMBLE");
        helmert ??= Towgs84(datumNode?.Child("TOWGS84"));

        if (root.EpsgCode() is { } code && CrsCatalog.ByCode(code) is { } known)
        {
            return CrsResolution.Found(helmert is null ? known : known with { Datum = known.Datum with { HelmertToWgs84 = helmert } });
        }

        if (datumNode is null)
            return CrsResolution.Failed($"{geodetic.Keyword} \"{geodetic.Name}\" has no DATUM");
        if (geodetic.Child("PRIMEM", "PRIMEMERIDIAN") is { } primem && primem.Number(0) is { } pm && pm != 0)
            return CrsResolution.Failed($"prime meridian \"{primem.Name}\" (not Greenwich) is not supported yet");

        var datum = Datum(geodetic, datumNode) with { HelmertToWgs84 = helmert };
        double angleFactor = AngleUnitFactor(geodetic) ?? RadiansPerDegree;
        var unit = kind == CrsKind.Geographic ? LinearUnit.Metre : LengthUnit(root) ?? LinearUnit.Metre;
        var axes = Axes(root, kind.Value, unit);
        bool westOrSouth = axes.Any(a => a.Direction is "west" or "south");
        if (westOrSouth && kind != CrsKind.Projected)
            return CrsResolution.Failed("geographic or geocentric CRSs with west or south axes are not supported; give latitude north and longitude east");
        if (kind == CrsKind.Projected && IsPseudoMercatorExtension(root))
            return BuildPseudoMercator(root, datum, unit, axes);

        IMapProjection? projection = null;
        ProjectionDefinition? definition = null;
        if (kind == CrsKind.Projected)
        {
            var (method, methodName, values, problem) = Conversion(root, angleFactor, unit);
            if (problem is not null)
                return CrsResolution.Failed(problem);
            if (westOrSouth && !CountsWestOrSouth(method, axes))
                return CrsResolution.Failed($"westing or southing axes are supported only where the method itself counts that way (Transverse Mercator (South Orientated): westing, southing; Lambert Conic Conformal (West Orientated): westing, northing); {methodName} counts east and north, and flipping its signs is not supported yet");
            projection = ProjectionFactory.Create(method, datum.Ellipsoid, values);
            definition = new ProjectionDefinition(method, methodName,
                values.Select(p => new ProjectionParameter(p.Key, WktNames.ParameterName(p.Key), p.Value, EpsgCatalogFile.ParameterUnit(p.Key))).ToList());
        }

        var name = root.Name ?? "unnamed";
        return CrsResolution.Found(new CoordinateReferenceSystem($"WKT:{name}", name, kind.Value, datum, unit, projection,
            HasHeightAxis: kind == CrsKind.Geocentric || axes.Count == 3)
        {
            Axes = axes,
            Conversion = definition,
            AreaOfUse = Area(root),
            BaseCrsIdentifier = kind == CrsKind.Projected ? BaseIdentifier(geodetic) : null,
        });
    }

    /// <summary>True when the west/south axes are the method's own grid directions (EPSG 9808: W, S; 9826: W, N).</summary>
    private static bool CountsWestOrSouth(int method, List<CrsAxis> axes)
    {
        bool west = axes.Any(a => a.Direction == "west"), south = axes.Any(a => a.Direction == "south");
        return method switch
        {
            ProjectionMethodCodes.TransverseMercatorSouthOrientated => west && south,
            ProjectionMethodCodes.LambertConicConformalWestOrientated => west && !south,
            _ => false,
        };
    }

    /// <summary>
    /// GDAL's WKT1 for EPSG:3857 says <c>Mercator_1SP</c> and adds <c>EXTENSION["PROJ4","+proj=merc +a=6378137
    /// +b=6378137 …"]</c>: the spherical formulas on ellipsoidal coordinates, i.e. EPSG method 1024.
    /// </summary>
    private static bool IsPseudoMercatorExtension(WktNode root) =>
        root.Child("EXTENSION")?.Values.OfType<string>().LastOrDefault() is { } proj4
        && proj4.Contains("+proj=merc", StringComparison.Ordinal)
        && SphereInExtension().Match(proj4) is { Success: true } m && m.Groups[1].Value == m.Groups[2].Value;

    private static CrsResolution BuildPseudoMercator(WktNode root, GeodeticDatum datum, LinearUnit unit, List<CrsAxis> axes)
    {
        double Get(string wkt1Name) => root.Children("PARAMETER").FirstOrDefault(p => WktNames.Normalise(p.Name ?? "") == wkt1Name)?.Number(0) ?? 0;
        var values = new Dictionary<int, double>
        {
            [ProjectionParameterCodes.LatitudeOfNaturalOrigin] = 0,
            [ProjectionParameterCodes.LongitudeOfNaturalOrigin] = Get("centralmeridian"),
            [ProjectionParameterCodes.FalseEasting] = Get("falseeasting") * unit.MetresPerUnit,
            [ProjectionParameterCodes.FalseNorthing] = Get("falsenorthing") * unit.MetresPerUnit,
        };
        var projection = ProjectionFactory.Create(ProjectionMethodCodes.PseudoMercator, datum.Ellipsoid, values)!;
        var name = root.Name ?? "unnamed";
        return CrsResolution.Found(new CoordinateReferenceSystem($"WKT:{name}", name, CrsKind.Projected, datum, unit, projection, HasHeightAxis: false)
        {
            Axes = axes,
            Conversion = new ProjectionDefinition(ProjectionMethodCodes.PseudoMercator, WktNames.MethodName(ProjectionMethodCodes.PseudoMercator),
                values.Select(p => new ProjectionParameter(p.Key, WktNames.ParameterName(p.Key), p.Value, EpsgCatalogFile.ParameterUnit(p.Key))).ToList()),
        });
    }

    [System.Text.RegularExpressions.GeneratedRegex(@"\+a=(\S+)\s+\+b=(\S+)")]
    private static partial System.Text.RegularExpressions.Regex SphereInExtension();

    private static (int Method, string MethodName, Dictionary<int, double> Values, string? Problem) Conversion(WktNode root, double angleFactor, LinearUnit unit)
    {
        var conversion = root.Child("CONVERSION");
        var methodNode = conversion is null ? root.Child("PROJECTION") : conversion.Child("METHOD", "PROJECTION");
        if (methodNode?.Name is not { } methodText)
            return (0, "", [], "the projected CRS has no projection method");
        int? method = methodNode.EpsgCode() ?? WktNames.Method(methodText);
        var parameterNodes = (conversion ?? root).Children("PARAMETER").ToList();
        if (method == ProjectionMethodCodes.MercatorA && parameterNodes.Any(p => p.Name is { } n && WktNames.Normalise(n) == "standardparallel1"))
            method = ProjectionMethodCodes.MercatorB; // GDAL writes some variant B definitions as Mercator_1SP with a standard parallel
        if (method is null || !ProjectionFactory.SupportedMethods.Contains(method.Value))
            return (0, "", [], UnsupportedMethod(methodText, method ?? WktNames.RefusedMethod(methodText)));
        if (method == ProjectionMethodCodes.PolarStereographicA && parameterNodes.Any(p => p.Name is { } n && WktNames.Normalise(n) == "latitudeoforigin" && p.Number(0) is { } lat && Math.Abs(lat * angleFactor / RadiansPerDegree) != 90))
            method = ProjectionMethodCodes.PolarStereographicB; // WKT1 "Polar_Stereographic" with a non-polar latitude of origin is variant B (GDAL)

        var values = new Dictionary<int, double>();
        foreach (var p in parameterNodes)
        {
            if (p.Name is null || p.Number(0) is not { } raw)
                continue;
            int? code = p.EpsgCode() ?? (conversion is null ? WktNames.Wkt1Parameter(p.Name, method.Value) : WktNames.EpsgParameter(p.Name) ?? WktNames.Wkt1Parameter(p.Name, method.Value));
            if (code is null)
                return (0, "", [], $"projection parameter \"{p.Name}\" is not supported yet for {WktNames.MethodName(method.Value)}");
            var unitNode = p.Child("ANGLEUNIT", "LENGTHUNIT", "SCALEUNIT", "UNIT");
            double? factor = unitNode?.Number(0);
            values[code.Value] = WktNames.IsAngle(code.Value) ? raw * SnapAngle(factor ?? angleFactor) / RadiansPerDegree
                : WktNames.IsScale(code.Value) ? raw * (factor ?? 1)
                : raw * (factor is { } f ? SnapLength(f) : unit.MetresPerUnit);
        }

        return (method.Value, WktNames.MethodName(method.Value), values, null);
    }

    private static string UnsupportedMethod(string methodText, int? code)
    {
        var supported = string.Join(", ", ProjectionFactory.SupportedMethods.Order().Select(WktNames.MethodName));
        return code is { } c && RefusedProjectionMethods.All.TryGetValue(c, out var refused)
            ? $"projection method \"{methodText}\" (EPSG:{c} {refused.Name}) is not supported: {refused.Reason}; supported: {supported}"
            : $"projection method \"{methodText}\" is not one the service knows (neither an EPSG method name nor a WKT1 name it reads); supported: {supported}";
    }

    private static GeodeticDatum Datum(WktNode geodetic, WktNode datumNode)
    {
        var ellipsoidNode = datumNode.Child("SPHEROID", "ELLIPSOID")
            ?? throw new ArgumentException($"DATUM \"{datumNode.Name}\" has no ELLIPSOID/SPHEROID");
        double a = (ellipsoidNode.Number(0) ?? throw new ArgumentException("the ellipsoid has no semi-major axis"))
                   * (ellipsoidNode.Child("LENGTHUNIT", "UNIT")?.Number(0) ?? 1);
        double rf = ellipsoidNode.Number(1) ?? throw new ArgumentException("the ellipsoid has no inverse flattening");
        var ellipsoid = new Ellipsoid(ellipsoidNode.Name ?? "unnamed", a, rf == 0 ? double.PositiveInfinity : rf);
        ellipsoid.Validate("ellipsoid");
        double? epoch = geodetic.Child("DYNAMIC")?.Child("FRAMEEPOCH")?.Number(0);

        var catalogDatum = CatalogDatum(datumNode);
        if (catalogDatum is not null && SameEllipsoid(catalogDatum.Ellipsoid, ellipsoid))
            return catalogDatum;
        var name = datumNode.Name ?? "unnamed";
        return new GeodeticDatum($"WKT:{name}", name, ellipsoid, epoch);
    }

    /// <summary>The catalog datum with the WKT datum's EPSG code, else with its name (EPSG or WKT1 underscore form).</summary>
    private static GeodeticDatum? CatalogDatum(WktNode datumNode)
    {
        var datums = CrsCatalog.All.Select(c => c.Datum).DistinctBy(d => d.Code).ToList();
        if (datumNode.EpsgCode() is { } code)
            return datums.FirstOrDefault(d => d.Code == $"EPSG:{code}");
        var name = WktNames.Normalise(datumNode.Name ?? string.Empty);
        return datums.FirstOrDefault(d => WktNames.Normalise(d.Name) == name);
    }

    private static bool SameEllipsoid(Ellipsoid x, Ellipsoid y) =>
        Math.Abs(x.SemiMajorAxisMetres - y.SemiMajorAxisMetres) < 1e-3 && Math.Abs(x.InverseFlattening - y.InverseFlattening) < 1e-9;

    private static HelmertToWgs84? Towgs84(WktNode? node)
    {
        if (node is null)
            return null;
        var n = node.Values.OfType<WktNumber>().Select(v => v.Value).ToArray();
        if (n.Length != 3 && n.Length != 7)
            throw new ArgumentException($"TOWGS84 needs 3 or 7 numbers, got {n.Length}");
        return n.Length == 3 ? new HelmertToWgs84(n[0], n[1], n[2], 0, 0, 0, 0) : new HelmertToWgs84(n[0], n[1], n[2], n[3], n[4], n[5], n[6]);
    }

    private static HelmertToWgs84? HelmertFromAbridged(WktNode transformation)
    {
        var methodNode = transformation.Child("METHOD");
        int? method = methodNode?.EpsgCode();
        string methodName = WktNames.Normalise(methodNode?.Name ?? string.Empty);
        bool frame = method is CoordinateFrame2D or CoordinateFrameGeocentric or CoordinateFrame3D || methodName.StartsWith("coordinateframe", StringComparison.Ordinal);
        bool vector = method is PositionVector2D or PositionVectorGeocentric or PositionVector3D || methodName.StartsWith("positionvector", StringComparison.Ordinal);
        bool translations = method is GeocentricTranslations2D or GeocentricTranslationsGeocentric or GeocentricTranslations3D || methodName.StartsWith("geocentrictranslations", StringComparison.Ordinal);
        if (!frame && !vector && !translations)
            return null;
        double Get(int code, double toUnit)
        {
            var p = transformation.Children("PARAMETER").FirstOrDefault(x => x.EpsgCode() == code);
            if (p?.Number(0) is not { } value)
                return 0;
            var unitNode = p.Child("ANGLEUNIT", "LENGTHUNIT", "SCALEUNIT", "UNIT");
            if (code == ScaleDifferenceCode && unitNode is null && Math.Abs(value - 1) < ScaleMultiplierBand)
                return (value - 1) / toUnit; // PROJ 9.1.1 writes the unitless scale difference as the multiplier 1 + dS
            return value * (unitNode?.Number(0) ?? toUnit) / toUnit;
        }

        const double PartsPerMillion = 1e-6;
        double sign = frame ? -1 : 1; // coordinate frame → position vector: rotations change sign (GN7-2, Helmert 7-parameter)
        var given = frame ? "coordinate frame rotations, applied with their signs reversed as position vector"
            : vector ? "position vector rotations" : "geocentric translations";
        return new HelmertToWgs84(Get(8605, 1), Get(8606, 1), Get(8607, 1),
            sign * Get(8608, RadiansPerArcSecond), sign * Get(8609, RadiansPerArcSecond), sign * Get(8610, RadiansPerArcSecond),
            Get(8611, PartsPerMillion))
        {
            GivenAs = $"WKT2 BOUNDCRS ABRIDGEDTRANSFORMATION \"{transformation.Name}\" ({given})",
        };
    }

    private static bool IsWgs84(WktNode crs) =>
        crs.EpsgCode() is 4326 or 4979 or 4978 || WktNames.Normalise(crs.Name ?? string.Empty) is "wgs84";

    private static double? AngleUnitFactor(WktNode geodetic) =>
        (geodetic.Child("UNIT", "ANGLEUNIT") ?? geodetic.Children("AXIS").Select(a => a.Child("ANGLEUNIT")).FirstOrDefault(u => u is not null))?.Number(0);

    private static double SnapAngle(double factor) => Math.Abs((factor / RadiansPerDegree) - 1) < UnitMatchTolerance ? RadiansPerDegree : factor;

    private static double SnapLength(double metresPerUnit) => metresPerUnit switch
    {
        _ when Math.Abs(metresPerUnit - 1) < UnitMatchTolerance => 1,
        _ when Math.Abs((metresPerUnit / LinearUnit.InternationalFoot.MetresPerUnit) - 1) < UnitMatchTolerance => LinearUnit.InternationalFoot.MetresPerUnit,
        _ when Math.Abs((metresPerUnit / LinearUnit.UsSurveyFoot.MetresPerUnit) - 1) < UnitMatchTolerance => LinearUnit.UsSurveyFoot.MetresPerUnit,
        _ => metresPerUnit,
    };

    private static LinearUnit? LengthUnit(WktNode root)
    {
        var unitNode = root.Child("UNIT", "LENGTHUNIT") ?? root.Children("AXIS").Select(a => a.Child("LENGTHUNIT", "UNIT")).FirstOrDefault(u => u is not null);
        if (unitNode?.Number(0) is not { } factor)
            return null;
        double exact = SnapLength(factor);
        if (exact == 1)
            return LinearUnit.Metre;
        if (exact == LinearUnit.InternationalFoot.MetresPerUnit)
            return LinearUnit.InternationalFoot;
        if (exact == LinearUnit.UsSurveyFoot.MetresPerUnit)
            return LinearUnit.UsSurveyFoot;
        string name = unitNode.Name ?? "unit";
        return new LinearUnit(name, name + "s", factor);
    }

    private static List<CrsAxis> Axes(WktNode root, CrsKind kind, LinearUnit unit)
    {
        var nodes = root.Children("AXIS").ToList();
        var axes = new List<CrsAxis>();
        for (int i = 0; i < nodes.Count; i++)
        {
            string text = nodes[i].Name ?? string.Empty;
            int open = text.LastIndexOf('('), close = text.LastIndexOf(')');
            string abbreviation = open >= 0 && close > open ? text[(open + 1)..close] : text;
            string direction = nodes[i].Word ?? "unknown";
            if (nodes[i].Child("MERIDIAN")?.Number(0) is { } meridian)
                direction = string.Create(CultureInfo.InvariantCulture, $"{direction} along {meridian}°"); // WKT2 polar grid axis
            else if (nodes.Count == 2 && nodes[0].Word is { } d0 && d0 == nodes[1].Word && d0 is "north" or "south")
                direction = $"{direction} (polar grid)"; // WKT1 writes polar grid axes as two equal directions
            string field = EpsgCatalogFile.AxisField(kind, direction, i, abbreviation);
            string unitName = kind == CrsKind.Geographic && field is "lat" or "lon" ? "degree" : unit.Name;
            axes.Add(new CrsAxis(abbreviation, direction, unitName, field));
        }

        if (axes.Count > 0)
            return axes;
        return kind switch
        {
            CrsKind.Geographic => [new("Lat", "north", "degree", "lat"), new("Lon", "east", "degree", "lon")],
            CrsKind.Geocentric => [new("X", "geocentricX", unit.Name, "x"), new("Y", "geocentricY", unit.Name, "y"), new("Z", "geocentricZ", unit.Name, "z")],
            _ => [new("E", "east", unit.Name, "e"), new("N", "north", unit.Name, "n")],
        };
    }

    private static AreaOfUse? Area(WktNode root)
    {
        var usage = root.Child("USAGE") ?? root;
        var box = usage.Child("BBOX");
        if (box?.Number(3) is null)
            return null;
        string name = usage.Child("AREA")?.Name ?? "given in the WKT";
        return new AreaOfUse(name, box.Number(0)!.Value, box.Number(2)!.Value, box.Number(1)!.Value, box.Number(3)!.Value);
    }

    private static string? BaseIdentifier(WktNode geodetic) =>
        geodetic.EpsgCode() is { } code ? string.Create(CultureInfo.InvariantCulture, $"EPSG:{code}") : null;
}
