using System.Text;

namespace QaService.Core.Ingest;

/// <summary>
/// Opens a field file as text: UTF-8 by default, UTF-16/32 when a byte-order mark says so. Bytes that
/// are not valid in the encoding decode to U+FFFD, which <see cref="LineSource"/> refuses with the line
/// it is on (a decoder that throws would name only the 64 KiB block, not the line).
/// </summary>
public static class TextDecoding
{
    private const int BufferBytes = 65_536;

    /// <summary>What the decoders put where bytes are not valid text (Unicode REPLACEMENT CHARACTER).</summary>
    public const char Replacement = '\uFFFD';

    public static StreamReader Open(Stream stream) =>
        new(stream, new UTF8Encoding(encoderShouldEmitUTF8Identifier: false, throwOnInvalidBytes: false),
            detectEncodingFromByteOrderMarks: true, BufferBytes, leaveOpen: true);

    internal static string NotText(long line) =>
        InvariantText.Format($"line {line} has bytes that are not valid UTF-8 (or the encoding its byte-order mark names); save the file as UTF-8");
}

/// <summary>
/// Reads lines one at a time (never the whole file), counting them, with a length limit
/// (<see cref="ReadLimits.MaximumLineCharacters"/>) and no NUL characters (binary content).
/// </summary>
public sealed class LineSource(TextReader reader)
{
    private readonly StringBuilder line = new(256);

    /// <summary>Number of the line last returned (1-based).</summary>
    public long LineNumber { get; private set; }

    /// <summary>The next line without its terminator (<c>\n</c>, <c>\r\n</c> or <c>\r</c>), or null at the end.</summary>
    public string? ReadLine()
    {
        line.Clear();
        var number = LineNumber + 1;
        try
        {
            while (true)
            {
                var c = reader.Read();
                if (c < 0)
                {
                    if (line.Length == 0)
                        return null;
                    break;
                }
                if (c == '\n')
                    break;
                if (c == '\r')
                {
                    if (reader.Peek() == '\n')
                        reader.Read();
                    break;
                }
                if (c == TextDecoding.Replacement)
                    throw new FieldFileException(number, TextDecoding.NotText(number));
                if (c == '\0')
                    throw new FieldFileException(number, InvariantText.Format($"line {number} holds a NUL character: this is binary content, not a text field file"));
                if (line.Length >= ReadLimits.MaximumLineCharacters)
                    throw new FieldFileException(number, InvariantText.Format($"line {number} is longer than {ReadLimits.MaximumLineCharacters} characters: the file is not one record per line, or is damaged"));
                line.Append((char)c);
            }
        }
        catch (DecoderFallbackException)
        {
            throw new FieldFileException(number, TextDecoding.NotText(number));
        }
        LineNumber = number;
        return line.ToString();
    }
}
