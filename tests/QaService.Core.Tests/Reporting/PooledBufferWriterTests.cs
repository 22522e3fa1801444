using QaService.Core.Reporting;

namespace QaService.Core.Tests.Reporting;

/// <summary>The pooled writer must keep every byte across growth, whichever way a caller asks for room.</summary>
public sealed class PooledBufferWriterTests
{
    [Theory]
    [InlineData(1)]
    [InlineData(16)]
    [InlineData(4096)]
    public void Bytes_written_through_spans_memories_and_copies_come_back_in_order(int initialBytes)
    {
        var random = new Random(5);
        var expected = new List<byte>();
        using var writer = new PooledBufferWriter(initialBytes);
        for (var round = 0; round < 2_000; round++)
        {
            var chunk = new byte[random.Next(0, 300)];
            random.NextBytes(chunk);
            switch (round % 3)
            {
                case 0:
                    chunk.CopyTo(writer.GetSpan(chunk.Length));
                    writer.Advance(chunk.Length);
                    break;
                case 1:
                    chunk.CopyTo(writer.GetMemory(chunk.Length).Span);
                    writer.Advance(chunk.Length);
                    break;
                default:
                    writer.Write(chunk);
                    break;
            }
            expected.AddRange(chunk);
        }
        Assert.Equal(expected.Count, writer.WrittenCount);
        Assert.True(expected.ToArray().AsSpan().SequenceEqual(writer.WrittenSpan));
    }

    [Fact]
    public void Advancing_past_the_room_given_is_refused()
    {
        using var writer = new PooledBufferWriter(16);
        var room = writer.GetSpan(8).Length;
        Assert.Throws<ArgumentOutOfRangeException>(() => writer.Advance(room + 1));
    }
}
