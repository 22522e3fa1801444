using System.Text;

namespace QaService.Core.Ingest;

/// <summary>
/// Splits one delimited record into fields following RFC 4180 §2: fields may be enclosed in double
/// quotes, a quote inside a quoted field is doubled, and a quoted field may span lines (the next lines
/// are pulled from the <see cref="LineSource"/>).
/// </summary>
public static class CsvLine
{
    /// <summary>The fields, or null with a problem when a quote is never closed.</summary>
    public static (List<string>? Fields, string? Problem) Split(string first, char delimiter, LineSource more)
    {
        if (!first.Contains('"'))
            return (SplitUnquoted(first, delimiter), null);
        var fields = new List<string>();
        var field = new StringBuilder();
        var line = first;
        var i = 0;
        var quoted = false;
        var startLine = more.LineNumber;
        while (true)
        {
            if (i >= line.Length)
            {
                if (!quoted)
                {
                    fields.Add(field.ToString());
                    return (fields, null);
                }
                var next = more.ReadLine();
                if (next is null || field.Length > ReadLimits.MaximumLineCharacters)
                    return (null, InvariantText.Format($"a quoted field opened on line {startLine} is never closed"));
                field.Append('\n');
                line = next;
                i = 0;
                continue;
            }
            var c = line[i++];
            if (quoted)
            {
                if (c != '"')
                    field.Append(c);
                else if (i < line.Length && line[i] == '"')
                {
                    field.Append('"');
                    i++;
                }
                else
                    quoted = false;
            }
            else if (c == '"' && field.Length == 0)
                quoted = true;
            else if (c == delimiter)
            {
                fields.Add(field.ToString());
                field.Clear();
            }
            else
                field.Append(c);
        }
    }

    /// <summary>
    /// The common case, a line without quotes: fields are the text between delimiters, cut directly from the line
    /// (the same result as the character loop, without copying every character through a builder).
    /// </summary>
    private static List<string> SplitUnquoted(string line, char delimiter)
    {
        var fields = new List<string>();
        var start = 0;
        int end;
        while ((end = line.IndexOf(delimiter, start)) >= 0)
        {
            fields.Add(line[start..end]);
            start = end + 1;
        }
        fields.Add(line[start..]);
        return fields;
    }

    /// <summary>Delimiter of a header line: the most frequent of <c>,</c> <c>;</c> tab outside quotes; null when none occurs.</summary>
    public static char? DetectDelimiter(string header)
    {
        int comma = 0, semicolon = 0, tab = 0;
        var quoted = false;
        foreach (var c in header)
        {
            if (c == '"')
                quoted = !quoted;
            else if (!quoted)
            {
                if (c == ',') comma++;
                else if (c == ';') semicolon++;
                else if (c == '\t') tab++;
            }
        }
        if (comma == 0 && semicolon == 0 && tab == 0)
            return null;
        return tab >= comma && tab >= semicolon ? '\t' : semicolon > comma ? ';' : ',';
    }
}
