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

    /// <summary>
    /// The definition, written out with .NET's integer formatting: the units Math.Round(value·10^d, away from zero), as
    /// decimal digits with the point d places from the right, trailing zeros and a bare point dropped, a sign only when
    /// the units are not zero. Every decimals setting, magnitudes up to the 2^53 limit, both signs, exact ties.
    /// </summary>
    [Fact]
    public void Writes_the_rounded_units_with_the_point_placed()
    {
        var random = new Random(7);
        Span<byte> text = stackalloc byte[FixedDecimalUtf8.MaximumBytes];
        for (var i = 0; i < 200_000; i++)
        {
            var decimals = random.Next(0, FixedDecimalUtf8.MaximumDecimals + 1);
            var value = (random.NextDouble() - 0.5) * Math.Pow(10, random.Next(-decimals - 3, 16 - decimals));
            if (i % 7 == 0)
                value = Math.Round(value * Math.Pow(10, decimals + 1)) / Math.Pow(10, decimals + 1); // ties and short fractions
            var scaled = Math.Round(value * Math.Pow(10, decimals), MidpointRounding.AwayFromZero);
            if (!(Math.Abs(scaled) < 9_007_199_254_740_992.0))
                continue;
            Assert.True(FixedDecimalUtf8.TryFormat(value, decimals, text, out var length));
            Assert.Equal(Definition((long)scaled, decimals), Encoding.ASCII.GetString(text[..length]));
        }
    }

    private static string Definition(long units, int decimals)
    {
        var digits = Math.Abs(units).ToString(CultureInfo.InvariantCulture).PadLeft(decimals + 1, '0');
        var whole = digits[..^decimals];
        var fraction = digits[^decimals..].TrimEnd('0');
        return (units < 0 ? "-" : "") + whole + (fraction.Length > 0 ? "." + fraction : "");
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

    [Theory]
    [InlineData("CP-01")]
    [InlineData("=HYPERLINK(\"http://x\",\"y\")")]
    [InlineData("<img src=x onerror=alert(1)>")]
    [InlineData("+SUM(A1) `x` & 'y' \\ ~")]
    [InlineData("M-2 ümlaut 北 😀")]
    [InlineData("tab\tnul\u0000del\u007f")]
    // Each character the default encoder escapes, alone in an otherwise plain id.
    [InlineData("a\"b")]
    [InlineData("a\\b")]
    [InlineData("a&b")]
    [InlineData("a'b")]
    [InlineData("a<b")]
    [InlineData("a>b")]
    [InlineData("a+b")]
    [InlineData("a`b")]
    [InlineData("a\u007fb")]
    [InlineData("a\u0080b")]
    public void Ids_are_escaped_as_the_serializer_escapes_strings(string id)
    {
        // Reference: System.Text.Json writing the bare string with the same options (default encoder).
        var expected = JsonSerializer.Serialize(id, ReportJson.Write);
        var json = JsonSerializer.Serialize(new Residual(id, id, 0, 0, null, 0, "id", id, 0, 0), ReportJson.Write);
        Assert.StartsWith($"{{\"mark\":{expected},\"fix\":{expected},", json);
        Assert.Contains($",\"excluded\":{expected},", json);
    }

    [Theory]
    [InlineData("valve")]
    [InlineData("<b>hydrant</b> & 'co'")]
    [InlineData("Crew \"Nord\" ümlaut 北")]
    public void Attributes_follow_the_mark_position_only_when_given_and_read_back(string text)
    {
        // Reference: System.Text.Json writing each bare string with the same options (default encoder).
        var encoded = JsonSerializer.Serialize(text, ReportJson.Write);
        var plain = new Residual("M1", "F1", 0.01, 0.02, null, 0.022361, "id", null, 48.1, 15.2);
        var withAll = plain with { Attributes = new QaService.Core.Assessment.FixAttributes(text, text, text, 0.0123456789, 1.25, "rtk-fixed") };
        var json = JsonSerializer.Serialize(withAll, ReportJson.Write);
        Assert.Equal(JsonSerializer.Serialize(plain, ReportJson.Write)[..^1] +
            $",\"featureClass\":{encoded},\"crew\":{encoded},\"receiver\":{encoded},\"fixSigmaH\":0.012346,\"hdop\":1.25,\"quality\":\"rtk-fixed\"}}", json);
        var back = JsonSerializer.Deserialize<Residual>(json, ReportJson.Write)!;
        Assert.Equal(withAll.Attributes! with { SigmaHorizontalMetres = 0.012346 }, back.Attributes);

        var onlyCrew = plain with { Attributes = new QaService.Core.Assessment.FixAttributes(null, text, null, null, null, null) };
        Assert.EndsWith($",\"markLongitude\":15.2,\"crew\":{encoded}}}", JsonSerializer.Serialize(onlyCrew, ReportJson.Write));
        Assert.Null(JsonSerializer.Deserialize<Residual>(JsonSerializer.Serialize(plain, ReportJson.Write), ReportJson.Write)!.Attributes);
    }

    [Fact]
    public void Reports_stored_with_full_precision_and_unknown_fields_still_read()
    {
        const string stored = """{"mark":"M1","fix":"F1","dE":-0.031037538976913553,"dN":1E-3,"dU":0.5,"dH":0.03119,"pairedBy":"id","excluded":null,"markLatitude":50.1,"markLongitude":15,"later":{"x":[1]}}""";
        var residual = JsonSerializer.Deserialize<Residual>(stored, ReportJson.Write)!;
        Assert.Equal(new Residual("M1", "F1", -0.031037538976913553, 0.001, 0.5, 0.03119, "id", null, 50.1, 15), residual);
    }
}

/// <summary>
/// The parallel report writer against System.Text.Json itself (the .NET 10 serialiser, default encoder) writing the
/// same report in one piece: the bytes must be identical, whatever the ids contain and however many batches there are.
/// </summary>
public sealed class ReportJsonStreamTests
{
    [Fact]
    public async Task Hostile_strings_come_out_as_the_serialiser_writes_them()
    {
        var report = SampleReports.With(
            ("<img src=x onerror=alert(1)>", "=HYPERLINK(\"http://x\",\"y\")", 0.01, -0.02, 0.03, null),
            ("M-2 ümlaut 北", "+SUM(A1) `x` & 'y'", -0.015, 0.004, -0.01, null),
            ("M-3\ttab\u0001", "\\back\\slash", 0.02, 0.011, null, null),
            ("M-3\ttab\u0001", "emoji 😀", 0.3, 0.2, 0.5, "blunder, \"re-observed\""),
            ("M-4", "F,\"q\"", 0.1, -1e-300, 0.2, null));
        // Numbers outside the fixed range take the serialiser's own form.
        report = report with { Residuals = [.. report.Residuals, new Residual("M-5", "F-5", 3e12, -1e-300, double.MaxValue, 3e12, "proximity", null, 1e20, -0.0)] };
        // Each character the default encoder escapes, alone in an otherwise plain id.
        var alone = "\"\\&'<>+`\u007f\u0080é\u001f".Select((c, i) => new Residual($"M{c}", $"F-{i}{c}x", 0.001 * i, 0, null, 0.001 * i, "id", null, 48, 15));
        report = report with { Residuals = [.. report.Residuals, .. alone] };
        // Attributes, hostile ones too, on some residuals.
        var attributed = new QaService.Core.Assessment.FixAttributes("<valve>", "crew \"A\" & B", "北-7 😀", 0.02, 1.1, "rtk-float");
        report = report with { Residuals = [.. report.Residuals.Select((r, i) => i % 2 == 0 ? r with { Attributes = attributed } : r)] };
        Assert.Equal(JsonSerializer.Serialize(report, ReportJson.Write), await WrittenAsync(report));
    }

    [Theory]
    [InlineData(0)]
    [InlineData(1)]
    [InlineData(4_096)]
    [InlineData(4_097)]
    [InlineData(70_001)]
    public async Task Any_number_of_residuals_comes_out_whole_and_in_order(int count)
    {
        var random = new Random(count);
        var pairs = Enumerable.Range(0, Math.Max(count, 1))
            .Select(i => ($"M{i % 97}", $"F{i:D6}", random.NextDouble() - 0.5, random.NextDouble() - 0.5, i % 5 == 0 ? (double?)null : random.NextDouble(),
                i % 11 == 3 ? "left out" : null))
            .ToArray();
        var report = SampleReports.With(pairs);
        if (count == 0)
            report = report with { Residuals = [] };
        Assert.Equal(JsonSerializer.Serialize(report, ReportJson.Write), await WrittenAsync(report));
    }

    private static async Task<string> WrittenAsync(AssessmentReport report)
    {
        using var stream = new MemoryStream();
        await ReportJsonStream.WriteAsync(report, stream, CancellationToken.None);
        return Encoding.UTF8.GetString(stream.ToArray());
    }
}
