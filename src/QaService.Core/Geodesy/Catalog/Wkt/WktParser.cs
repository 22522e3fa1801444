using static QaService.Core.InvariantText;
using System.Globalization;
using System.Text;

namespace QaService.Core.Geodesy.Catalog.Wkt;

/// <summary>
/// Tokenises OGC WKT text (WKT1, OGC 01-009 §7.2; WKT2, ISO 19162:2019 / OGC 18-010r7 §6) into a
/// <see cref="WktNode"/> tree. Both bracket pairs <c>[ ]</c> and <c>( )</c> are accepted; quotes inside
/// text are doubled (<c>""</c>). Errors say where (character offset) and what was expected.
/// </summary>
public static class WktParser
{
    /// <summary>Deepest nesting accepted (real CRS definitions nest about 6 deep).</summary>
    public const int MaximumDepth = 32;

    /// <summary>Parses one WKT element; the text must hold nothing else but white space.</summary>
    /// <exception cref="FormatException">Malformed WKT, with the character offset.</exception>
    public static WktNode Parse(string text)
    {
        int position = 0;
        var node = ParseNode(text, ref position, 0);
        SkipSpace(text, ref position);
        if (position != text.Length)
            throw new FormatException(Format($"unexpected text after the closing bracket at character {position}"));
        return node;
    }

    private static WktNode ParseNode(string text, ref int position, int depth)
    {
        if (depth > MaximumDepth)
            throw new FormatException(Format($"WKT nests deeper than {MaximumDepth} levels at character {position}"));
        SkipSpace(text, ref position);
        int start = position;
        while (position < text.Length && (char.IsAsciiLetterOrDigit(text[position]) || text[position] == '_'))
            position++;
        if (position == start)
            throw new FormatException(Format($"expected a WKT keyword at character {position}"));
        string keyword = text[start..position].ToUpperInvariant();
        SkipSpace(text, ref position);
        if (position >= text.Length || (text[position] != '[' && text[position] != '('))
            throw new FormatException(Format($"expected '[' after {keyword} at character {position}"));
        char close = text[position] == '[' ? ']' : ')';
        position++;
        var values = new List<object>();
        while (true)
        {
            SkipSpace(text, ref position);
            if (position >= text.Length)
                throw new FormatException($"{keyword}[ is not closed");
            char c = text[position];
            if (c == close && values.Count == 0)
            {
                position++;
                break;
            }

            values.Add(ParseValue(text, ref position, depth));
            SkipSpace(text, ref position);
            if (position >= text.Length)
                throw new FormatException($"{keyword}[ is not closed");
            if (text[position] == ',')
            {
                position++;
                continue;
            }

            if (text[position] == close)
            {
                position++;
                break;
            }

            throw new FormatException(Format($"expected ',' or '{close}' in {keyword} at character {position}"));
        }

        return new WktNode(keyword, values);
    }

    private static object ParseValue(string text, ref int position, int depth)
    {
        char c = text[position];
        if (c == '"')
            return ParseQuoted(text, ref position);
        if (c == '-' || c == '+' || c == '.' || char.IsAsciiDigit(c))
        {
            int start = position;
            position++;
            while (position < text.Length && (char.IsAsciiDigit(text[position]) || text[position] is '.' or 'e' or 'E' or '-' or '+'))
                position++;
            if (!double.TryParse(text.AsSpan(start, position - start), NumberStyles.Float, CultureInfo.InvariantCulture, out var number))
                throw new FormatException(Format($"\"{text[start..position]}\" at character {start} is not a number"));
            return new WktNumber(number);
        }

        if (char.IsAsciiLetter(c))
        {
            int start = position;
            while (position < text.Length && (char.IsAsciiLetterOrDigit(text[position]) || text[position] == '_'))
                position++;
            int after = position;
            SkipSpace(text, ref after);
            if (after < text.Length && text[after] is '[' or '(')
            {
                position = start;
                return ParseNode(text, ref position, depth + 1);
            }

            return new WktWord(text[start..position]);
        }

        throw new FormatException(Format($"unexpected '{c}' at character {position}"));
    }

    private static string ParseQuoted(string text, ref int position)
    {
        var builder = new StringBuilder();
        position++; // opening quote
        while (position < text.Length)
        {
            char c = text[position++];
            if (c != '"')
            {
                builder.Append(c);
                continue;
            }

            if (position < text.Length && text[position] == '"')
            {
                builder.Append('"');
                position++;
                continue;
            }

            return builder.ToString();
        }

        throw new FormatException("a quoted text is not closed");
    }

    private static void SkipSpace(string text, ref int position)
    {
        while (position < text.Length && char.IsWhiteSpace(text[position]))
            position++;
    }

}
