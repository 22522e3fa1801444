using System.Text;
using QaService.Core.Ingest;

namespace QaService.Core.Tests.Ingest;

/// <summary>
/// Line splitting and numbering of text files. Terminators are CRLF (RFC 4180 §2), LF and a lone CR (common
/// practice: classic Mac OS files); expected lines are counted by hand. A stream that hands out one byte per read
/// puts every terminator, and the CR–LF pair, across a read boundary.
/// </summary>
public sealed class LineSourceTests
{
    [Fact]
    public void Every_terminator_ends_a_line_even_across_reads()
    {
        var lines = ReadAll("a\r\nb\rc\n\nd\r\r\ne");
        Assert.Equal(["1:a", "2:b", "3:c", "4:", "5:d", "6:", "7:e"], lines);
    }

    [Fact]
    public void A_final_terminator_makes_no_empty_last_line() =>
        Assert.Equal(["1:x", "2:y"], ReadAll("x\ny\r\n"));

    [Fact]
    public void A_line_at_the_limit_is_read_and_one_past_it_is_refused_with_its_number()
    {
        var atLimit = new string('9', ReadLimits.MaximumLineCharacters);
        Assert.Equal(ReadLimits.MaximumLineCharacters + 2, ReadAll($"h\n{atLimit}\n")[1].Length);
        var error = Assert.Throws<FieldFileException>(() => ReadAll($"h\n{atLimit}9\nz\n"));
        Assert.Equal(2L, error.Row);
        Assert.Contains("longer than", error.Message);
    }

    [Fact]
    public void A_nul_character_is_refused_with_its_line() =>
        Assert.Equal(3L, Assert.Throws<FieldFileException>(() => ReadAll("a\nb\nc\0d\n")).Row);

    private static List<string> ReadAll(string text)
    {
        using var reader = new StreamReader(new OneByteStream(Encoding.UTF8.GetBytes(text)));
        using var lines = new LineSource(reader);
        var result = new List<string>();
        while (lines.ReadLine() is { } line)
            result.Add($"{lines.LineNumber}:{line}");
        return result;
    }

    private sealed class OneByteStream(byte[] bytes) : MemoryStream(bytes)
    {
        public override int Read(byte[] buffer, int offset, int count) => base.Read(buffer, offset, Math.Min(count, 1));

        public override int Read(Span<byte> buffer) => base.Read(buffer[..Math.Min(buffer.Length, 1)]);
    }
}
