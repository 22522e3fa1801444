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

    /// <summary>Line terminators and the characters that stop a line from being read (an undecodable byte, U+FFFD, or NUL), found in one pass.</summary>
    private static readonly SearchValues<char> Stops = SearchValues.Create(['\r', '\n', TextDecoding.Replacement, '\0']);

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
            var stop = pending[searched..].IndexOfAny(Stops);
            if (stop >= 0)
                stop += searched;
            if (stop >= 0 && pending[stop] is TextDecoding.Replacement or '\0')
                throw Refusal(pending[stop], stop, number);
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
                if (length > ReadLimits.MaximumLineCharacters)
                    throw TooLong(number);
                line = pending[..length];
                var terminator = stop < 0 ? 0 : pending[stop] == '\r' && stop + 1 < pending.Length && pending[stop + 1] == '\n' ? 2 : 1;
                start += length + terminator;
                LineNumber = number;
                return true;
            }
            searched = stop >= 0 ? stop : pending.Length;
            Fill(text, number);
        }
    }

    /// <summary>
    /// The refusal of a line whose first refused character (U+FFFD, NUL) is at <paramref name="index"/>: characters are
    /// judged one at a time, so one past the length limit makes the line too long before it is looked at.
    /// </summary>
    private static FieldFileException Refusal(char refused, int index, long number) =>
        index > ReadLimits.MaximumLineCharacters ? TooLong(number)
        : refused == TextDecoding.Replacement ? new FieldFileException(number, TextDecoding.NotText(number))
        : new FieldFileException(number, InvariantText.Format($"line {number} holds a NUL character: this is binary content, not a text field file"));

    private static FieldFileException TooLong(long number) =>
        new(number, InvariantText.Format($"line {number} is longer than {ReadLimits.MaximumLineCharacters} characters: the file is not one record per line, or is damaged"));

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
