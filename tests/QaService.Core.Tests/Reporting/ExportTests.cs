using System.Text.Json;
using QaService.Core.Reporting.Exports;

namespace QaService.Core.Tests.Reporting;

public sealed class ExportTests
{
    [Theory]
    // OWASP "CSV Injection": cells starting with = + - @ tab CR get a leading apostrophe.
    [InlineData("=1+2", "'=1+2")]
    [InlineData("+SUM(A1)", "'+SUM(A1)")]
    [InlineData("-2+3", "'-2+3")]
    [InlineData("@cmd", "'@cmd")]
    [InlineData("\tx", "'\tx")]
    [InlineData("CP-01", "CP-01")]
    // RFC 4180 §2 rules 6 and 7: quote fields with comma, quote or line break; double inner quotes.
    [InlineData("a,b", "\"a,b\"")]
    [InlineData("say \"hi\"", "\"say \"\"hi\"\"\"")]
    [InlineData("two\nlines", "\"two\nlines\"")]
    [InlineData("\rx", "\"'\rx\"")]
    [InlineData("=HYPERLINK(\"http://x\",\"y\")", "\"'=HYPERLINK(\"\"http://x\"\",\"\"y\"\")\"")]
    public void Text_cells_are_inert_and_quoted(string value, string expected) => Assert.Equal(expected, CsvCell.Text(value));

    [Fact]
    public void Csv_has_a_header_one_row_per_pair_and_crlf_lines()
    {
        var report = SampleReports.Hostile();
        string csv = ResidualCsv.Write(report);
        var lines = csv.Split("\r\n");
        Assert.Equal(report.Residuals.Count + 2, lines.Length); // header, rows, and the empty string after the last CRLF
        Assert.Equal(string.Join(',', ResidualCsv.Header), lines[0]);
        Assert.StartsWith("<img src=x onerror=alert(1)>,\"'=HYPERLINK(", lines[1]); // '<' starts no formula
        Assert.Contains(",-0.0150,", lines[2]); // a number keeps its minus sign: it is a number, not text
        Assert.Contains("excluded", lines[4]);
        Assert.DoesNotContain(lines, l => l.Length > 0 && "=+-@".Contains(l[0]));
    }

    [Fact]
    public void GeoJson_is_a_feature_collection_of_points_in_longitude_latitude_order()
    {
        // RFC 7946 §3.1.1 (position = longitude, latitude) and §3.3 (FeatureCollection).
        var report = SampleReports.Hostile();
        var root = JsonDocument.Parse(ResidualGeoJson.Write(report)).RootElement;
        Assert.Equal("FeatureCollection", root.GetProperty("type").GetString());
        var features = root.GetProperty("features").EnumerateArray().ToList();
        Assert.Equal(report.Residuals.Count, features.Count);
        for (int i = 0; i < features.Count; i++)
        {
            var f = features[i];
            var r = report.Residuals[i];
            Assert.Equal("Point", f.GetProperty("geometry").GetProperty("type").GetString());
            var position = f.GetProperty("geometry").GetProperty("coordinates").EnumerateArray().Select(c => c.GetDouble()).ToArray();
            Assert.Equal([r.MarkLongitude, r.MarkLatitude], position);
            var p = f.GetProperty("properties");
            Assert.Equal(r.Mark, p.GetProperty("mark").GetString());
            Assert.Equal(r.DE, p.GetProperty("dE").GetDouble());
            Assert.Equal(r.DU is null, p.GetProperty("dU").ValueKind == JsonValueKind.Null);
        }

        Assert.Contains("outliers", features[0].GetProperty("properties").GetProperty("flags").EnumerateArray().Select(x => x.GetString()));
        Assert.Contains("excluded", features[3].GetProperty("properties").GetProperty("flags").EnumerateArray().Select(x => x.GetString()));
    }
}
