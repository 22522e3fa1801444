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
