using System.Globalization;
using QaService.Core.Geodesy.Projections;

namespace QaService.Core.Geodesy.Catalog;

/// <summary>
/// Reads the embedded <c>epsg-catalog.tsv</c> (written by <c>make-epsg-catalog.py</c> from the EPSG
/// Geodetic Parameter Dataset in PROJ's proj.db; attribution "EPSG Geodetic Parameter Dataset, IOGP")
/// into CRS records. Runs once, lazily, on first use of <see cref="CrsCatalog"/>.
/// </summary>
internal static class EpsgCatalogFile
{
    private const string ResourceName = "QaService.Core.Geodesy.Catalog.epsg-catalog.tsv";
    private const int MetreCode = 9001, InternationalFootCode = 9002, UsSurveyFootCode = 9003;

    /// <summary>Parameter codes whose values are angles (degrees) or scales (unity); the rest are lengths (metres).</summary>
    private static readonly HashSet<int> AngleParameters = [8801, 8802, 8811, 8812, 8813, 8814, 8821, 8822, 8823, 8824, 8830, 8831, 8832, 8833];
    private static readonly HashSet<int> ScaleParameters = [8805, 8815, 1038];

    internal static IReadOnlyList<CoordinateReferenceSystem> Load()
    {
        using var stream = typeof(EpsgCatalogFile).Assembly.GetManifestResourceStream(ResourceName)
            ?? throw new InvalidOperationException($"embedded resource {ResourceName} is missing");
        using var reader = new StreamReader(stream);
        var datums = new Dictionary<string, GeodeticDatum>();
        var areas = new Dictionary<string, AreaOfUse>();
        var units = new Dictionary<string, LinearUnit>();
        var methods = new Dictionary<int, string>();
        var parameterNames = new Dictionary<int, string>();
        var result = new List<CoordinateReferenceSystem>(2048);
        while (reader.ReadLine() is { } line)
        {
            if (line.Length == 0 || line[0] == '#')
                continue;
            var f = line.Split('\t');
            switch (f[0])
            {
                case "D":
                    datums[f[1]] = new GeodeticDatum($"EPSG:{f[1]}", f[2], new Ellipsoid(f[3], D(f[4]), D(f[5])),
                        f[6].Length == 0 ? null : D(f[6])) { EnsembleAccuracyMetres = f[7].Length == 0 ? null : D(f[7]) };
                    break;
                case "A":
                    areas[f[1]] = new AreaOfUse(f[6], D(f[2]), D(f[3]), D(f[4]), D(f[5]));
                    break;
                case "U":
                    units[f[1]] = Unit(int.Parse(f[1], CultureInfo.InvariantCulture), f[2], D(f[3]));
                    break;
                case "M":
                    methods[int.Parse(f[1], CultureInfo.InvariantCulture)] = f[2];
                    break;
                case "P":
                    parameterNames[int.Parse(f[1], CultureInfo.InvariantCulture)] = f[2];
                    break;
                case "C":
                    result.Add(Crs(f, datums, areas, units, methods, parameterNames));
                    break;
                default:
                    throw new InvalidDataException($"unknown record type \"{f[0]}\" in {ResourceName}");
            }
        }

        return result;
    }

    private static CoordinateReferenceSystem Crs(string[] f, Dictionary<string, GeodeticDatum> datums, Dictionary<string, AreaOfUse> areas,
        Dictionary<string, LinearUnit> units, Dictionary<int, string> methods, Dictionary<int, string> parameterNames)
    {
        var kind = f[2] switch
        {
            "geog2d" or "geog3d" => CrsKind.Geographic,
            "geocen" => CrsKind.Geocentric,
            _ => CrsKind.Projected,
        };
        var datum = datums[f[4]];
        var unit = units[f[8]];
        IMapProjection? projection = null;
        ProjectionDefinition? definition = null;
        if (kind == CrsKind.Projected)
        {
            int method = int.Parse(f[6], CultureInfo.InvariantCulture);
            var values = new Dictionary<int, double>();
            var list = new List<ProjectionParameter>();
            foreach (var pair in f[7].Split(';'))
            {
                int eq = pair.IndexOf('=');
                int code = int.Parse(pair.AsSpan(0, eq), CultureInfo.InvariantCulture);
                double value = D(pair[(eq + 1)..]);
                values[code] = value;
                list.Add(new ProjectionParameter(code, parameterNames[code], value, ParameterUnit(code)));
            }

            projection = ProjectionFactory.Create(method, datum.Ellipsoid, values)
                ?? throw new InvalidDataException($"EPSG:{f[1]} uses method {method}, which is not implemented");
            definition = new ProjectionDefinition(method, methods[method], list);
        }

        var axisTexts = f[9].Split(';');
        var axes = new CrsAxis[axisTexts.Length];
        for (int i = 0; i < axisTexts.Length; i++)
        {
            int colon = axisTexts[i].IndexOf(':');
            string abbrev = axisTexts[i][..colon], direction = axisTexts[i][(colon + 1)..];
            axes[i] = new CrsAxis(abbrev, direction, AxisUnit(kind, direction, unit), AxisField(kind, direction, i, abbrev));
        }

        return new CoordinateReferenceSystem($"EPSG:{f[1]}", f[3], kind, datum, unit, projection, HasHeightAxis: f[2] is "geog3d" or "geocen")
        {
            AreaOfUse = areas[f[10]],
            Axes = axes,
            Conversion = definition,
            BaseCrsIdentifier = f[5].Length == 0 ? null : $"EPSG:{f[5]}",
        };
    }

    /// <summary>Unit of a projection parameter after the generator's conversion.</summary>
    internal static string ParameterUnit(int code) =>
        AngleParameters.Contains(code) ? "degree" : ScaleParameters.Contains(code) ? "unity" : "metre";

    private static string AxisUnit(CrsKind kind, string direction, LinearUnit unit) =>
        kind == CrsKind.Geographic && direction is "north" or "east" ? "degree" : unit.Name;

    /// <summary>
    /// API field of an axis: by direction where it is a plain compass direction; polar grids ("South along
    /// 90°E") by abbreviation (E/N, as EPSG:32661 lists N first), else by position (x then y).
    /// </summary>
    internal static string AxisField(CrsKind kind, string direction, int index, string abbreviation = "") => kind switch
    {
        CrsKind.Geographic => direction switch { "north" => "lat", "east" => "lon", _ => "h" },
        CrsKind.Geocentric => index switch { 0 => "x", 1 => "y", _ => "z" },
        _ => direction switch
        {
            "east" or "west" => "e", // a westing is the east-west coordinate, counted the other way (EPSG 9808, 9826)
            "north" or "south" => "n",
            "up" => "h",
            _ when abbreviation.StartsWith('E') => "e",
            _ when abbreviation.StartsWith('N') => "n",
            _ => index == 0 ? "e" : "n",
        },
    };

    /// <summary>The shared unit instances for metre and the two feet (exact factors; their report names), others as read.</summary>
    internal static LinearUnit Unit(int code, string name, double metresPerUnit) => code switch
    {
        MetreCode => LinearUnit.Metre,
        InternationalFootCode => LinearUnit.InternationalFoot,
        UsSurveyFootCode => LinearUnit.UsSurveyFoot,
        _ => new LinearUnit(name, name + "s", metresPerUnit),
    };

    private static double D(string text) => double.Parse(text, NumberStyles.Float, CultureInfo.InvariantCulture);
}
