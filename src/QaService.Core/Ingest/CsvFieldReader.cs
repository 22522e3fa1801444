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

    /// <summary>Every row, in file order.</summary>
    public IEnumerable<FieldRow> Read(Stream stream)
    {
        var rows = new FieldRowList();
        ReadInto(stream, rows, CancellationToken.None);
        return rows.Rows;
    }

    /// <summary>Reads every row into <paramref name="sink"/>; a <see cref="FieldFileException"/> stops the file.</summary>
    internal void ReadInto(Stream stream, IFieldRowSink sink, CancellationToken cancellationToken)
    {
        using var text = TextDecoding.Open(stream);
        using var lines = new LineSource(text);
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
        var row = new CsvRowReader(MapColumns(headers, headerLine), columnNames);

        bool? comma = decimalComma ?? (separator == ',' ? false : null);
        var fields = new Range[headers.Count];
        while (lines.TryReadLine(out var line))
        {
            cancellationToken.ThrowIfCancellationRequested();
            var lineNumber = lines.LineNumber;
            if (line.IsWhiteSpace())
                continue;
            ReadOnlySpan<char> record;
            int count;
            if (line.Contains('"'))
            {
                // Quoted fields (RFC 4180 §2) may span lines: the rare case goes through the character-by-character splitter.
                var (quoted, problem) = CsvLine.Split(line.ToString(), separator, lines);
                if (quoted is null)
                {
                    sink.Problem(lineNumber, new FieldProblem(null, problem!));
                    continue;
                }
                count = quoted.Count;
                record = count == headers.Count ? Joined(quoted, fields) : default;
            }
            else
            {
                count = Cut(line, separator, fields);
                record = line;
            }
            if (count != headers.Count)
            {
                sink.Problem(lineNumber, new FieldProblem(null, InvariantText.Format($"the row has {count} fields; the header has {headers.Count} (delimiter '{Show(separator)}')")));
                continue;
            }
            comma ??= row.LooksLikeDecimalComma(record, fields);
            row.Read(lineNumber, record, fields, comma.Value, sink);
        }
    }

    /// <summary>
    /// The field count of a record without quotes, cutting it at each delimiter into <paramref name="fields"/> while
    /// they fit (the ranges matter only when the count is the header's). One pass over the characters: fields are
    /// short, so a search call per field costs more than it saves.
    /// </summary>
    private static int Cut(ReadOnlySpan<char> line, char separator, Range[] fields)
    {
        var count = 0;
        var start = 0;
        for (var i = 0; i < line.Length; i++)
        {
            if (line[i] != separator)
                continue;
            if (count < fields.Length)
                fields[count] = new Range(start, i);
            count++;
            start = i + 1;
        }
        if (count < fields.Length)
            fields[count] = new Range(start, line.Length);
        return count + 1;
    }

    /// <summary>The fields of a quoted record laid end to end, with their ranges.</summary>
    private static string Joined(List<string> quoted, Range[] fields)
    {
        var at = 0;
        for (var i = 0; i < quoted.Count; i++)
        {
            fields[i] = new Range(at, at + quoted[i].Length);
            at += quoted[i].Length;
        }
        return string.Concat(quoted);
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
        AddContractNamed(byHeader, index);
        if (index.Count == 0)
            throw new FieldFileException(headerLine, $"no column of the header row is a contract field ({string.Join(", ", ContractFields.All)}) and no column map was given; name the columns in the options' \"columns\"");
        foreach (var (field, i) in index)
            columnNames[field] = headers[i].Trim();
        return index;
    }

    /// <summary>
    /// What the reader maps without a column map: each contract field to the first header equal to its name
    /// (case-insensitive, trimmed), contract field → header text. The guided upload preselects its column choices from this.
    /// </summary>
    public static IReadOnlyDictionary<string, string> DetectColumns(IReadOnlyList<string> headers)
    {
        var byHeader = new Dictionary<string, int>(StringComparer.OrdinalIgnoreCase);
        for (var i = 0; i < headers.Count; i++)
            byHeader.TryAdd(headers[i].Trim(), i);
        var index = new Dictionary<string, int>(StringComparer.Ordinal);
        AddContractNamed(byHeader, index);
        return index.ToDictionary(p => p.Key, p => headers[p.Value].Trim(), StringComparer.Ordinal);
    }

    /// <summary>Fields not yet mapped take a header that is their own name, unless that column is taken.</summary>
    private static void AddContractNamed(Dictionary<string, int> byHeader, Dictionary<string, int> index)
    {
        foreach (var field in ContractFields.All.Where(f => !index.ContainsKey(f)))
        {
            if (byHeader.TryGetValue(field, out var i) && !index.ContainsValue(i))
                index[field] = i;
        }
    }

    private static string Show(char c) => c == '\t' ? "tab" : c.ToString();

    internal static string Shorten(string text) => text.Length <= 40 ? text : text[..40] + "…";
}
