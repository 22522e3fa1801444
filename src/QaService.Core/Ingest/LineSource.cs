using System.Buffers;
using System.Text;

namespace QaService.Core.Ingest;

/// <summary>
/// Reads lines one at a time (never the whole file), counting them, with a length limit
/// (<see cref="ReadLimits.MaximumLineCharacters"/>) and no NUL characters (binary content). Lines are cut
/// from one pooled block of decoded text, so a large file costs no string per line unless one is asked for
/// (<see cref="ReadLine"/>); <see cref="TryReadLine"/> hands out the line in place.
/// </summary>
public sealed class LineSource(TextReader reader) : IDisposable
{
    /// <summary>Characters held at once: room for the longest line allowed, its terminator and the next read.</summary>
    private const int BlockCharacters = 2 * ReadLimits.MaximumLineCharacters + 2;

    /// <summary>The characters that stop a line from being read: an undecodable byte (U+FFFD) or NUL.</summary>
    private static readonly SearchValues<char> Refused = SearchValues.Create([TextDecoding.Replacement, '\0']);

    private char[]? block = ArrayPool<char>.Shared.Rent(BlockCharacters);
    private int start, end;
    private bool endOfText;

    /// <summary>Number of the line last returned (1-based).</summary>
    public long LineNumber { get; private set; }

    /// <summary>The next line without its terminator (<c>\n</c>, <c>\r\n</c> or <c>\r</c>), or null at the end.</summary>
    public string? ReadLine() => TryReadLine(out var line) ? line.ToString() : null;

    /// <summary>
    /// The next line in place (valid until the next call), without its terminator; false at the end. A text that
    /// ends with a terminator has no empty last line.
    /// </summary>
    public bool TryReadLine(out ReadOnlySpan<char> line)
    {
        var text = block ?? throw new ObjectDisposedException(nameof(LineSource));
        var number = LineNumber + 1;
        var searched = 0;
        while (true)
        {
            var pending = text.AsSpan(start, end - start);
            var stop = pending[searched..].IndexOfAny('\r', '\n');
            if (stop >= 0)
                stop += searched;
            // A '\r' as the last character read may be the first half of "\r\n": read on before deciding.
            var decided = stop >= 0 && !(pending[stop] == '\r' && stop == pending.Length - 1 && !endOfText);
            var length = stop >= 0 ? stop : pending.Length;
            if (decided || endOfText || length > ReadLimits.MaximumLineCharacters)
            {
                if (length == 0 && stop < 0)
                {
                    line = default;
                    return false;
                }
                line = pending[..length];
                Check(line, number);
                var terminator = stop < 0 ? 0 : pending[stop] == '\r' && stop + 1 < pending.Length && pending[stop + 1] == '\n' ? 2 : 1;
                start += length + terminator;
                LineNumber = number;
                return true;
            }
            searched = stop >= 0 ? stop : pending.Length;
            Fill(text, number);
        }
    }

    /// <summary>The refusals of the character-at-a-time reader, in its order: the first refused character, else the length.</summary>
    private static void Check(ReadOnlySpan<char> line, long number)
    {
        // A character at index MaximumLineCharacters is tested for U+FFFD and NUL before the line is found too long.
        var inspected = line[..Math.Min(line.Length, ReadLimits.MaximumLineCharacters + 1)];
        var refused = inspected.IndexOfAny(Refused);
        if (refused >= 0)
        {
            throw inspected[refused] == TextDecoding.Replacement
                ? new FieldFileException(number, TextDecoding.NotText(number))
                : new FieldFileException(number, InvariantText.Format($"line {number} holds a NUL character: this is binary content, not a text field file"));
        }
        if (line.Length > ReadLimits.MaximumLineCharacters)
            throw new FieldFileException(number, InvariantText.Format($"line {number} is longer than {ReadLimits.MaximumLineCharacters} characters: the file is not one record per line, or is damaged"));
    }

    /// <summary>Moves the unread characters to the front of the block and decodes more after them.</summary>
    private void Fill(char[] text, long number)
    {
        if (start > 0)
        {
            text.AsSpan(start, end - start).CopyTo(text);
            end -= start;
            start = 0;
        }
        try
        {
            var read = reader.Read(text.AsSpan(end));
            if (read == 0)
                endOfText = true;
            end += read;
        }
        catch (DecoderFallbackException)
        {
            throw new FieldFileException(number, TextDecoding.NotText(number));
        }
    }

    public void Dispose()
    {
        if (block is { } text)
            ArrayPool<char>.Shared.Return(text);
        block = null;
    }
}
