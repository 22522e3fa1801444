namespace QaService.Core.Ingest;

/// <summary>
/// Reads the contract fields of one CSV record in place: fields are ranges of the line, numbers are parsed from
/// the text itself, and only the id (and each distinct mark id, once) becomes a string. The first problem is kept,
/// in the order time, lat, lon, e, n, x, y, z, h, sigmaH, sigmaV.
/// </summary>
/// <param name="index">Contract field → column (0-based), from the header row.</param>
/// <param name="columnNames">Contract field → the file's header text, for messages.</param>
internal sealed class CsvRowReader(IReadOnlyDictionary<string, int> index, IReadOnlyDictionary<string, string> columnNames)
{
    private const int NotInFile = -1;

    /// <summary>Latitude and longitude (the first two number fields) may be written in degrees-minutes-seconds.</summary>
    private const int AngleFields = 2;

    private readonly int idColumn = ColumnOf(index, ContractFields.Id);
    private readonly int markColumn = ColumnOf(index, ContractFields.Mark);
    private readonly int timeColumn = ColumnOf(index, ContractFields.Time);
    private readonly int[] attributeColumns = ContractFields.Attributes.Select(field => ColumnOf(index, field)).ToArray();

    /// <summary>The number fields the file has (position in <see cref="PointColumns.NumberFieldNames"/>) and their columns, in that order.</summary>
    private readonly (int Field, int Column)[] numbersInFile = Enumerable.Range(0, PointColumns.NumberFieldNames.Count)
        .Select(field => (field, ColumnOf(index, PointColumns.NumberFieldNames[field])))
        .Where(number => number.Item2 != NotInFile)
        .ToArray();

    /// <summary>Columns that may hold a number (every mapped one but id, mark and time), probed for a decimal comma.</summary>
    private readonly int[] probedColumns = index
        .Where(kv => !ContractFields.Texts.Contains(kv.Key))
        .Select(kv => kv.Value).ToArray();

    /// <summary>True when a number column of this record writes a number as <c>12,5</c>.</summary>
    public bool LooksLikeDecimalComma(ReadOnlySpan<char> record, ReadOnlySpan<Range> fields)
    {
        foreach (var column in probedColumns)
        {
            var v = record[fields[column]].Trim();
            if (v.Contains(',') && !v.Contains('.') && FieldText.TryNumber(v, decimalComma: true, out _))
                return true;
        }
        return false;
    }

    public void Read(long line, ReadOnlySpan<char> record, ReadOnlySpan<Range> fields, bool comma, IFieldRowSink sink)
    {
        FieldProblem? problem = null;
        DateTimeOffset? time = null;
        if (Text(record, fields, timeColumn) is { IsEmpty: false } timeText)
        {
            if (FieldText.TryTime(timeText, out var parsed))
                time = parsed;
            else
                problem = new FieldProblem(ContractFields.Time, Refusal(ContractFields.Time, timeText, "an ISO 8601 time"));
        }
        Span<double> numbers = stackalloc double[PointColumns.NumberFields];
        numbers.Fill(double.NaN);
        foreach (var (field, column) in numbersInFile)
        {
            if (Text(record, fields, column) is not { IsEmpty: false } text)
                continue;
            var angle = field < AngleFields;
            var ok = angle ? FieldText.TryAngle(text, comma, out var value) : FieldText.TryNumber(text, comma, out value);
            if (ok)
                numbers[field] = value;
            else if (problem is null)
            {
                var name = PointColumns.NumberFieldNames[field];
                var kind = angle ? "an angle (decimal degrees or degrees-minutes-seconds)" : comma ? "a number with a decimal comma" : "a number";
                problem = new FieldProblem(name, Refusal(name, text, kind));
            }
        }
        if (problem is null)
            sink.Point(line, Text(record, fields, idColumn), Text(record, fields, markColumn), numbers, time,
                new AttributeTexts(Text(record, fields, attributeColumns[0]), Text(record, fields, attributeColumns[1]),
                    Text(record, fields, attributeColumns[2]), Text(record, fields, attributeColumns[3])));
        else
            sink.Problem(line, problem);
    }

    /// <summary>The trimmed text of a column; empty when the file has no such column.</summary>
    private static ReadOnlySpan<char> Text(ReadOnlySpan<char> record, ReadOnlySpan<Range> fields, int column) =>
        column == NotInFile ? default : record[fields[column]].Trim();

    private string Refusal(string field, ReadOnlySpan<char> text, string kind) =>
        InvariantText.Format($"column {index[field] + 1} (\"{columnNames[field]}\"): \"{CsvFieldReader.Shorten(text.ToString())}\" is not {kind}");

    private static int ColumnOf(IReadOnlyDictionary<string, int> index, string field) => index.TryGetValue(field, out var column) ? column : NotInFile;
}
