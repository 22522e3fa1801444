using QaService.Core.Assessment;
using QaService.Core.Geodesy.Catalog;

namespace QaService.Core.Ingest;

/// <summary>
/// Reads one file part: recognises its format from content, runs the format's reader over it as a
/// stream and keeps the points in a compact column store. Readers only read; the one step after them
/// here is the CSV length unit (feet → the CRS unit), named in the options.
/// </summary>
public static class FieldPartReader
{
    /// <summary>CRS assumed for formats that fix WGS 84 latitude/longitude (RFC 7946 §4, GPX 1.1, NMEA 0183) when the options name none.</summary>
    public const string DefaultGeographicCrs = "EPSG:4979";

    public static async Task<(PartReading? Reading, InputError? Error)> ReadAsync(string part, Stream stream, FilePartOptions? options, CancellationToken cancellationToken)
    {
        var (format, content, problem) = await FormatSniffer.DetectAsync(stream, cancellationToken);
        if (format is null)
            return (null, new InputError($"/{part}", problem!));
        var crs = CrsCatalog.Resolve(options?.Crs ?? (format == FieldFormat.Csv ? null : DefaultGeographicCrs)).Crs;
        var points = new PointColumns();
        var problems = new List<InputError>();
        var segment = format == FieldFormat.GeoJson ? "features" : "line";
        IReadOnlyDictionary<string, string> columns = new Dictionary<string, string>();
        long withoutFix = 0;
        try
        {
            var unitProblem = LengthFactor(options, crs, out var factor);
            if (unitProblem is not null)
                return (null, new InputError($"/options/{part}/lengthUnit", unitProblem));
            var sink = new PartSink(part, segment, points, problems);
            var (rows, csv, nmea) = Reader(format.Value, options, crs);
            if (csv is not null)
                csv.ReadInto(content, sink, cancellationToken);
            else
            {
                foreach (var row in rows!(content))
                {
                    cancellationToken.ThrowIfCancellationRequested();
                    if (row.Problem is { } p)
                        sink.Problem(row.Row, p);
                    else
                        points.Add(row.Row, ReceiverFields.Onto(row.Point!, row.Receiver));
                }
            }
            if (factor != 1.0)
                points.ScaleLengths(factor);
            columns = csv?.ColumnNames ?? columns;
            withoutFix = nmea?.SkippedWithoutFix ?? 0;
        }
        catch (FieldFileException exception)
        {
            return (null, new InputError(InvariantText.Format($"/{part}/{segment}/{exception.Row}"), exception.Message));
        }
        return (new PartReading(part, format.Value, points, problems, columns, withoutFix), null);
    }

    /// <summary>The format's reader: a CSV reader works in place (no rows), the others yield rows.</summary>
    private static (Func<Stream, IEnumerable<FieldRow>>? Rows, CsvFieldReader? Csv, NmeaFieldReader? Nmea) Reader(FieldFormat format, FilePartOptions? options, CoordinateReferenceSystem? crs)
    {
        switch (format)
        {
            case FieldFormat.Csv:
                var csv = new CsvFieldReader(options?.Columns, DecimalComma(options?.DecimalSeparator), Delimiter(options?.Delimiter));
                return (null, csv, null);
            case FieldFormat.GeoJson:
                var axes = crs?.Kind switch { CrsKind.Projected => PositionAxes.EastNorthH, CrsKind.Geocentric => PositionAxes.Xyz, _ => PositionAxes.LonLatH };
                return (new GeoJsonFieldReader(axes).Read, null, null);
            case FieldFormat.Gpx:
                return (new GpxFieldReader().Read, null, null);
            default:
                var nmea = new NmeaFieldReader(wantHeights: !string.Equals(options?.Heights?.Trim(), "none", StringComparison.OrdinalIgnoreCase));
                return (nmea.Read, null, nmea);
        }
    }

    private static bool? DecimalComma(string? separator) => separator?.Trim().ToLowerInvariant() switch
    {
        "comma" or "," => true,
        "point" or "." => false,
        _ => null,
    };

    private static char? Delimiter(string? delimiter) => delimiter switch
    {
        "," => ',',
        ";" => ';',
        "tab" or "\t" => '\t',
        _ => null,
    };

    /// <summary>Factor from the file's length unit to the CRS unit (1 when none is named).</summary>
    private static string? LengthFactor(FilePartOptions? options, CoordinateReferenceSystem? crs, out double factor)
    {
        factor = 1.0;
        if (options?.LengthUnit is not { } name)
            return null;
        LinearUnit? unit = name.Trim().ToLowerInvariant() switch
        {
            "metre" or "meter" or "m" => LinearUnit.Metre,
            "foot" or "ft" or "international-foot" => LinearUnit.InternationalFoot,
            "us-survey-foot" or "usft" or "ftus" => LinearUnit.UsSurveyFoot,
            _ => null,
        };
        if (unit is null)
            return $"length unit \"{name}\" is not one of \"metre\", \"foot\" (international, 0.3048 m), \"us-survey-foot\" (1200/3937 m)";
        if (crs is not null)
            factor = unit.MetresPerUnit / crs.Unit.MetresPerUnit;
        return null;
    }

    /// <summary>Points go to the part's column store; problems get the part's row pointer.</summary>
    private sealed class PartSink(string part, string segment, PointColumns points, List<InputError> problems) : IFieldRowSink
    {
        public void Point(long row, ReadOnlySpan<char> id, ReadOnlySpan<char> mark, ReadOnlySpan<double> numbers, DateTimeOffset? time,
            AttributeTexts attributes) =>
            points.Add(row, id, mark, numbers, time, attributes);

        public void Problem(long row, FieldProblem problem)
        {
            var pointer = InvariantText.Format($"/{part}/{segment}/{row}") + (problem.Field is null ? "" : "/" + problem.Field);
            problems.Add(new InputError(pointer, problem.Message));
        }
    }
}
