using System.Globalization;
using QaService.Core.Assessment;

namespace QaService.Core.Ingest;

/// <summary>
/// The first rows of a field file as a person sees them before a test: the format (recognised by
/// <see cref="FormatSniffer"/>, as the upload will be), for CSV the header cells, the first data rows cut by the same
/// delimiter rule and the columns the reader would map by itself (<see cref="CsvFieldReader.DetectColumns"/>); for the
/// other formats the first points their reader yields. Reads no more than it shows.
/// </summary>
/// <param name="Format">The recognised format, or null with <paramref name="Problem"/>.</param>
/// <param name="Headers">CSV header cells; for the other formats the point fields shown.</param>
/// <param name="Rows">The first rows: line (or feature) number and the cells under <paramref name="Headers"/>.</param>
/// <param name="DetectedColumns">CSV: contract field → header the reader maps without a column map; empty otherwise.</param>
/// <param name="Problem">Why the file cannot be previewed (empty, unknown XML, no delimiter…).</param>
public sealed record FilePreview(
    FieldFormat? Format,
    IReadOnlyList<string> Headers,
    IReadOnlyList<PreviewRow> Rows,
    IReadOnlyDictionary<string, string> DetectedColumns,
    string? Problem)
{
    /// <summary>Rows shown by default.</summary>
    public const int DefaultRows = 5;

    private static readonly string[] PointHeaders = ["id", "lat", "lon", "h", "time"];

    public static async Task<FilePreview> ReadAsync(Stream stream, int rows, CancellationToken cancellationToken)
    {
        var (format, content, problem) = await FormatSniffer.DetectAsync(stream, cancellationToken);
        if (format is null)
            return Failed(null, problem!);
        try
        {
            return format == FieldFormat.Csv ? ReadCsv(content, rows) : ReadPoints(format.Value, content, rows);
        }
        catch (FieldFileException exception)
        {
            return Failed(format, InvariantText.Format($"line {exception.Row}: {exception.Message}"));
        }
    }

    /// <summary>The text of one physical line (1-based) of a file, for showing the row an error names; null past the end.</summary>
    public static string? Line(Stream stream, long lineNumber)
    {
        using var text = TextDecoding.Open(stream);
        using var lines = new LineSource(text);
        try
        {
            while (lines.TryReadLine(out var line))
            {
                if (lines.LineNumber == lineNumber)
                    return line.ToString();
            }
        }
        catch (FieldFileException)
        {
            // The reader's own error names that line already.
        }
        return null;
    }

    private static FilePreview Failed(FieldFormat? format, string problem) =>
        new(format, [], [], new Dictionary<string, string>(), problem);

    private static FilePreview ReadCsv(Stream content, int rows)
    {
        using var text = TextDecoding.Open(content);
        using var lines = new LineSource(text);
        var header = lines.ReadLine();
        while (header is not null && header.Trim().Length == 0)
            header = lines.ReadLine();
        if (header is null)
            return Failed(FieldFormat.Csv, "the file has no header row");
        if (CsvLine.DetectDelimiter(header) is not { } separator)
            return Failed(FieldFormat.Csv, "the header row has no , ; or tab delimiter: a CSV needs at least two columns");
        var (headers, problem) = CsvLine.Split(header, separator, lines);
        if (headers is null)
            return Failed(FieldFormat.Csv, problem!);
        var shown = new List<PreviewRow>(rows);
        while (shown.Count < rows && lines.ReadLine() is { } line)
        {
            if (line.Trim().Length == 0)
                continue;
            var number = lines.LineNumber;
            var (cells, _) = CsvLine.Split(line, separator, lines);
            shown.Add(new PreviewRow(number, cells ?? [line]));
        }
        var trimmed = headers.Select(h => h.Trim()).ToList();
        return new FilePreview(FieldFormat.Csv, trimmed, shown, CsvFieldReader.DetectColumns(trimmed), null);
    }

    private static FilePreview ReadPoints(FieldFormat format, Stream content, int rows)
    {
        IEnumerable<FieldRow> read = format switch
        {
            FieldFormat.GeoJson => new GeoJsonFieldReader(PositionAxes.LonLatH).Read(content),
            FieldFormat.Gpx => new GpxFieldReader().Read(content),
            _ => new NmeaFieldReader(wantHeights: true).Read(content),
        };
        var shown = read.Take(rows).Select(r => new PreviewRow(r.Row, r.Point is { } p
            ? [p.Id ?? "", Number(p.Lat), Number(p.Lon), Number(p.H), p.Time?.ToString("O", CultureInfo.InvariantCulture) ?? ""]
            : [r.Problem?.Message ?? "", "", "", "", ""])).ToList();
        return new FilePreview(format, PointHeaders, shown, new Dictionary<string, string>(), null);
    }

    private static string Number(double? value) => value?.ToString("R", CultureInfo.InvariantCulture) ?? "";
}

/// <summary>One previewed row.</summary>
/// <param name="Row">Physical line (CSV, GPX, NMEA; 1-based) or feature index (GeoJSON; 0-based), as error pointers count.</param>
/// <param name="Cells">The row's cells as written.</param>
public sealed record PreviewRow(long Row, IReadOnlyList<string> Cells);
