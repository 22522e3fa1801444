using System.Text;
using System.Text.Json;
using QaService.Core.Projects;
using QaService.Core.Reporting;
using QaService.Core.Tests.Reporting;

namespace QaService.Core.Tests.Projects;

/// <summary>
/// A project's trend reads only the head of each stored report: the figures must be the report's own (compared with a
/// full System.Text.Json deserialisation of the same bytes) and a large report must not be read to its end.
/// </summary>
public sealed class DeliveryFiguresTests
{
    private static AssessmentReport Sample(int pairs, bool heights = true) => SampleReports.With(Enumerable.Range(0, pairs)
        .Select(i => ($"M-{i}", $"F-{i}", 0.01 * Math.Sin(i), 0.012 * Math.Cos(i * 1.3), heights ? (double?)(0.02 * Math.Sin(i * 0.7)) : null, (string?)null)).ToArray());

    private static async Task<DeliveryFigures> ReadAsync(byte[] json, int chunk = int.MaxValue) =>
        await DeliveryFigures.ReadAsync(new TrickleStream(json, chunk), CancellationToken.None);

    [Theory]
    [InlineData(24, true)]
    [InlineData(24, false)]
    [InlineData(3, true)]
    public async Task The_figures_are_those_of_the_stored_report(int pairs, bool heights)
    {
        var bytes = JsonSerializer.SerializeToUtf8Bytes(Sample(pairs, heights), ReportJson.Write);
        var stored = JsonSerializer.Deserialize<AssessmentReport>(bytes, ReportJson.StoredReport)!;
        // Read in 7-byte steps too, so a block split across reads is handled.
        foreach (var figures in new[] { await ReadAsync(bytes), await ReadAsync(bytes, 7) })
        {
            Assert.Equal(stored.Horizontal!.N, figures.HorizontalN);
            Assert.Equal(stored.Horizontal.Nssda95, figures.HorizontalNssda95);
            Assert.Equal(stored.Horizontal.RmseR, figures.RmseH);
            Assert.Equal(stored.Vertical?.N, figures.VerticalN);
            Assert.Equal(stored.Vertical?.Nssda95, figures.VerticalNssda95);
            Assert.Equal(stored.Vertical?.Rmse, figures.RmseV);
        }
    }

    [Fact]
    public async Task A_large_report_is_read_only_to_its_figures()
    {
        var bytes = JsonSerializer.SerializeToUtf8Bytes(Sample(100_000), ReportJson.Write);
        Assert.True(bytes.Length > 10_000_000, $"{bytes.Length} bytes");
        var stream = new TrickleStream(bytes, int.MaxValue);
        var figures = await DeliveryFigures.ReadAsync(stream, CancellationToken.None);
        Assert.Equal(100_000, figures.HorizontalN);
        Assert.True(stream.Position <= 64 * 1024, $"read {stream.Position} bytes");
    }

    [Fact]
    public async Task A_report_is_read_in_one_small_read_when_its_head_fits()
    {
        // A project page reads every delivery's head: one small read per delivery (a page or two of SQLite), not 16 KiB.
        var bytes = JsonSerializer.SerializeToUtf8Bytes(Sample(200), ReportJson.Write);
        var stream = new TrickleStream(bytes, int.MaxValue);
        var figures = await DeliveryFigures.ReadAsync(stream, CancellationToken.None);
        Assert.Equal(200, figures.HorizontalN);
        Assert.Equal(DeliveryFigures.FirstReadBytes, stream.Position);
        Assert.Equal(1, stream.Reads);
    }

    [Fact]
    public async Task Block_order_and_unknown_fields_do_not_matter()
    {
        var json = """{"residuals":[{"a":[1,2,{"b":3}]}],"extra":{"horizontal":{"n":1}},"vertical":null,"horizontal":{"n":5,"rmseR":0.25,"nssda95":0.43,"future":[1]}}""";
        var figures = await ReadAsync(Encoding.UTF8.GetBytes(json), 5);
        Assert.Equal(new DeliveryFigures(5, 0.43, 0.25, null, null, null), figures);
    }

    [Fact]
    public async Task A_truncated_report_is_an_error_not_a_guess() =>
        await Assert.ThrowsAnyAsync<JsonException>(() => ReadAsync("""{"id":"x","horizontal":{"n":5"""u8.ToArray()));

    /// <summary>Hands out at most <c>chunk</c> bytes per read, like a network or BLOB stream.</summary>
    private sealed class TrickleStream(byte[] data, int chunk) : MemoryStream(data, writable: false)
    {
        /// <summary>Reads asked for so far.</summary>
        public int Reads { get; private set; }

        public override int Read(Span<byte> buffer)
        {
            Reads++;
            return base.Read(buffer[..Math.Min(buffer.Length, chunk)]);
        }

        public override ValueTask<int> ReadAsync(Memory<byte> buffer, CancellationToken cancellationToken = default)
        {
            Reads++;
            return base.ReadAsync(buffer[..Math.Min(buffer.Length, chunk)], cancellationToken);
        }
    }
}
