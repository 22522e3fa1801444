using System.Globalization;
using System.Text;
using System.Text.Json;
using QaService.Core.Reporting;

namespace QaService.Core.Tests.Reporting;

/// <summary>
/// The fixed-resolution residual JSON. Reference: .NET's own invariant custom numeric format "0.######"
/// (System.Globalization, .NET 10 base library), which rounds the exact decimal expansion of the double, and
/// RFC 8259 §6 for what a JSON number may look like.
/// </summary>
public sealed class ResidualJsonTests
{
    [Theory]
    [InlineData(0.0, 6, "0")]
    [InlineData(-1e-9, 6, "0")]
    [InlineData(-0.0000004, 6, "0")]
    [InlineData(0.681000009199291, 6, "0.681")]
    [InlineData(-0.031037538976913553, 6, "-0.031038")]
    [InlineData(0.000123, 6, "0.000123")]
    [InlineData(15.0, 9, "15")]
    [InlineData(50.01231551862301, 9, "50.012315519")]
    [InlineData(-179.999999999, 9, "-179.999999999")]
    [InlineData(1234567.5, 0, "1234568")]
    public void Writes_plain_decimals_without_trailing_zeros(double value, int decimals, string expected)
    {
        Span<byte> text = stackalloc byte[FixedDecimalUtf8.MaximumBytes];
        Assert.True(FixedDecimalUtf8.TryFormat(value, decimals, text, out var length));
        Assert.Equal(expected, Encoding.ASCII.GetString(text[..length]));
    }

    [Fact]
    public void Agrees_with_the_base_library_format_on_seeded_values()
    {
        var random = new Random(20261202);
        Span<byte> text = stackalloc byte[FixedDecimalUtf8.MaximumBytes];
        var differing = 0;
        for (var i = 0; i < 20_000; i++)
        {
            // Residual-like magnitudes from micrometres to kilometres, both signs.
            var value = (random.NextDouble() - 0.5) * Math.Pow(10, random.Next(-5, 4));
            Assert.True(FixedDecimalUtf8.TryFormat(value, 6, text, out var length));
            var written = Encoding.ASCII.GetString(text[..length]);
            var expected = value.ToString("0.######", CultureInfo.InvariantCulture);
            if (expected == "-0")
                expected = "0";
            // Ties of the exact expansion may round the other way once value × 10^6 is itself rounded: at most one unit apart.
            if (written != expected)
            {
                differing++;
                Assert.True(Math.Abs(double.Parse(written, CultureInfo.InvariantCulture) - double.Parse(expected, CultureInfo.InvariantCulture)) <= 1.0000001e-6, $"{value:R}: {written} vs {expected}");
            }
            Assert.True(Math.Abs(double.Parse(written, CultureInfo.InvariantCulture) - value) <= 0.5e-6 + 1e-15 * Math.Abs(value), $"{value:R} written {written}");
        }
        Assert.True(differing < 20, $"{differing} of 20,000 differ from the base library by one unit");
    }

    [Theory]
    [InlineData(double.NaN)]
    [InlineData(double.PositiveInfinity)]
    [InlineData(1e12)]
    public void Refuses_what_it_cannot_write_exactly(double value)
    {
        Span<byte> text = stackalloc byte[FixedDecimalUtf8.MaximumBytes];
        Assert.False(FixedDecimalUtf8.TryFormat(value, 6, text, out _));
    }

    [Fact]
    public void A_residual_round_trips_to_the_written_resolution()
    {
        var residual = new Residual("CP-7 \"north\"", "F-001", -0.031037538976913553, 0.33118451792467196, null, 0.3326357072515529, "proximity",
            "operator note", 50.01231551862301, -1.5e-10);
        var json = JsonSerializer.Serialize(residual, ReportJson.Write);
        Assert.Equal("""{"mark":"CP-7 \u0022north\u0022","fix":"F-001","dE":-0.031038,"dN":0.331185,"dU":null,"dH":0.332636,"pairedBy":"proximity","excluded":"operator note","markLatitude":50.012315519,"markLongitude":0}""", json);
        var back = JsonSerializer.Deserialize<Residual>(json, ReportJson.Write)!;
        Assert.Equal(residual with { DE = -0.031038, DN = 0.331185, DH = 0.332636, MarkLatitude = 50.012315519, MarkLongitude = 0 }, back);
    }

    [Fact]
    public void Reports_stored_with_full_precision_and_unknown_fields_still_read()
    {
        const string stored = """{"mark":"M1","fix":"F1","dE":-0.031037538976913553,"dN":1E-3,"dU":0.5,"dH":0.03119,"pairedBy":"id","excluded":null,"markLatitude":50.1,"markLongitude":15,"later":{"x":[1]}}""";
        var residual = JsonSerializer.Deserialize<Residual>(stored, ReportJson.Write)!;
        Assert.Equal(new Residual("M1", "F1", -0.031037538976913553, 0.001, 0.5, 0.03119, "id", null, 50.1, 15), residual);
    }
}
