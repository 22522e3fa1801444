using QaService.Core.Assessment;

namespace QaService.Core.Ingest;

/// <summary>
/// Reads delimited text with a header row, one record at a time. The delimiter (<c>,</c> <c>;</c> tab)
/// comes from the header line; a decimal comma is recognised when the delimiter is not a comma and the
/// first data row writes a number as <c>12,5</c> (or when the options say so). Headers equal to a
/// contract field name (case-insensitive) need no map; others are named in <paramref name="columns"/>
/// (contract field → header). Unmapped columns are ignored. Rows are numbered by physical line.
/// </summary>
public sealed class CsvFieldReader(IReadOnlyDictionary<string, string>? columns, bool? decimalComma, char? delimiter)
{
    /// <summary>Contract field → header text, as resolved from the header row (for messages).</summary>
    public IReadOnlyDictionary<string, string> ColumnNames => columnNames;

    private readonly Dictionary<string, string> columnNames = new(StringComparer.Ordinal);

    public IEnumerable<FieldRow> Read(Stream stream)
    {
        using var text = TextDecoding.Open(stream);
        var lines = new LineSource(text);
        var header = lines.ReadLine();
        while (header is not null && header.Trim().Length == 0)
            header = lines.ReadLine();
        if (header is null)
            throw new FieldFileException(lines.LineNumber, "the file has no header row");
        var headerLine = lines.LineNumber;
        var separator = delimiter ?? CsvLine.DetectDelimiter(header)
            ?? throw new FieldFileException(headerLine, "the header row has no , ; or tab delimiter: a CSV needs at least two columns (e.g. lat and lon)");
        var (headers, quoteProblem) = CsvLine.Split(header, separator, lines);
        if (headers is null)
            throw new FieldFileException(headerLine, quoteProblem!);
        var index = MapColumns(headers, headerLine);

        bool? comma = decimalComma ?? (separator == ',' ? false : null);
        while (lines.ReadLine() is { } line)
        {
            var lineNumber = lines.LineNumber;
            if (line.Trim().Length == 0)
                continue;
            var (fields, problem) = CsvLine.Split(line, separator, lines);
            if (fields is null)
            {
                yield return FieldRow.Bad(lineNumber, null, problem!);
                continue;
            }
            if (fields.Count != headers.Count)
            {
                yield return FieldRow.Bad(lineNumber, null, InvariantText.Format($"the row has {fields.Count} fields; the header has {headers.Count} (delimiter '{Show(separator)}')"));
                continue;
            }
            comma ??= LooksLikeDecimalComma(fields, index);
            yield return ReadRow(lineNumber, fields, index, comma.Value);
        }
    }

    private Dictionary<string, int> MapColumns(List<string> headers, long headerLine)
    {
        var byHeader = new Dictionary<string, int>(StringComparer.OrdinalIgnoreCase);
        for (var i = 0; i < headers.Count; i++)
            byHeader.TryAdd(headers[i].Trim(), i);

        var index = new Dictionary<string, int>(StringComparer.Ordinal);
        foreach (var (field, header) in columns ?? new Dictionary<string, string>())
        {
            if (!byHeader.TryGetValue(header.Trim(), out var i))
                throw new FieldFileException(headerLine, $"the column map names \"{header}\" for {field}, but the header row has no such column (it has: {string.Join(", ", headers.Select(h => h.Trim()))})");
            index[field] = i;
        }
        foreach (var field in ContractFields.All.Where(f => !index.ContainsKey(f)))
        {
            if (byHeader.TryGetValue(field, out var i) && !index.ContainsValue(i))
                index[field] = i;
        }
        if (index.Count == 0)
            throw new FieldFileException(headerLine, $"no column of the header row is a contract field ({string.Join(", ", ContractFields.All)}) and no column map was given; name the columns in the options' \"columns\"");
        foreach (var (field, i) in index)
            columnNames[field] = headers[i].Trim();
        return index;
    }

    private static bool LooksLikeDecimalComma(List<string> fields, Dictionary<string, int> index) =>
        index.Where(kv => kv.Key is not (ContractFields.Id or ContractFields.Mark or ContractFields.Time))
            .Select(kv => fields[kv.Value].Trim())
            .Any(v => v.Contains(',') && !v.Contains('.') && FieldText.TryNumber(v, decimalComma: true, out _));

    private FieldRow ReadRow(long line, List<string> fields, Dictionary<string, int> index, bool comma)
    {
        string? Text(string field) => index.TryGetValue(field, out var i) && fields[i].Trim() is { Length: > 0 } t ? t : null;

        FieldProblem? problem = null;
        double? Number(string field, bool angle = false)
        {
            if (Text(field) is not { } t)
                return null;
            var ok = angle ? FieldText.TryAngle(t, comma, out var value) : FieldText.TryNumber(t, comma, out value);
            if (ok)
                return value;
            var kind = angle ? "an angle (decimal degrees or degrees-minutes-seconds)" : comma ? "a number with a decimal comma" : "a number";
            problem ??= new FieldProblem(field, InvariantText.Format($"column {index[field] + 1} (\"{columnNames[field]}\"): \"{Shorten(t)}\" is not {kind}"));
            return null;
        }

        DateTimeOffset? time = null;
        if (Text(ContractFields.Time) is { } timeText)
        {
            if (FieldText.TryTime(timeText, out var parsed))
                time = parsed;
            else
                problem ??= new FieldProblem(ContractFields.Time, InvariantText.Format($"column {index[ContractFields.Time] + 1} (\"{columnNames[ContractFields.Time]}\"): \"{Shorten(timeText)}\" is not an ISO 8601 time"));
        }
        var point = new PointRecord(
            Id: Text(ContractFields.Id), Mark: Text(ContractFields.Mark),
            Lat: Number(ContractFields.Lat, angle: true), Lon: Number(ContractFields.Lon, angle: true),
            E: Number(ContractFields.E), N: Number(ContractFields.N),
            X: Number(ContractFields.X), Y: Number(ContractFields.Y), Z: Number(ContractFields.Z),
            H: Number(ContractFields.H), SigmaH: Number(ContractFields.SigmaH), SigmaV: Number(ContractFields.SigmaV),
            Time: time);
        return problem is null ? new FieldRow(line, point) : new FieldRow(line, null, null, problem);
    }

    private static string Show(char c) => c == '\t' ? "tab" : c.ToString();

    internal static string Shorten(string text) => text.Length <= 40 ? text : text[..40] + "…";
}
