namespace QaService.Core.Reporting.Exports;

/// <summary>
/// One CSV field, RFC 4180 §2: fields holding a comma, a double quote, CR or LF are wrapped in double quotes and
/// inner quotes doubled. Text fields are also made inert for spreadsheets (OWASP "CSV Injection"): a field that
/// starts with <c>=</c>, <c>+</c>, <c>-</c>, <c>@</c>, tab or CR gets a leading apostrophe, so
/// <c>=HYPERLINK(...)</c> is shown as text rather than evaluated.
/// </summary>
public static class CsvCell
{
    /// <summary>Leading characters a spreadsheet may read as the start of a formula (OWASP CSV Injection).</summary>
    private static readonly char[] FormulaStarts = ['=', '+', '-', '@', '\t', '\r'];

    /// <summary>Characters that force quoting (RFC 4180 §2, rule 6).</summary>
    private static readonly char[] NeedsQuotes = [',', '"', '\r', '\n'];

    /// <summary>A text field from outside (ids, reasons): neutralised, then quoted as needed.</summary>
    public static string Text(string? value)
    {
        string text = value ?? string.Empty;
        if (text.Length > 0 && Array.IndexOf(FormulaStarts, text[0]) >= 0)
            text = "'" + text;
        return Quote(text);
    }

    /// <summary>A number this service formatted itself (a leading minus is a sign, not a formula).</summary>
    public static string Number(double? value, string format) =>
        value is { } v ? v.ToString(format, System.Globalization.CultureInfo.InvariantCulture) : string.Empty;

    private static string Quote(string text) =>
        text.IndexOfAny(NeedsQuotes) >= 0 ? "\"" + text.Replace("\"", "\"\"", StringComparison.Ordinal) + "\"" : text;
}
