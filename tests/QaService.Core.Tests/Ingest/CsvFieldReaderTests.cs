using System.Text;
using QaService.Core.Ingest;
using static QaService.Core.Tests.Ingest.ReaderTestSupport;

namespace QaService.Core.Tests.Ingest;

/// <summary>
/// CSV reading on files made for the test (invented scenario: Wrenfield Borough street-light survey).
/// Quoting follows RFC 4180 §2; DMS values are checked against hand arithmetic (d + m/60 + s/3600).
/// </summary>
public sealed class CsvFieldReaderTests
{
    [Fact]
    public void Contract_headers_need_no_map_and_lines_are_numbered()
    {
        var rows = new CsvFieldReader(null, null, null).Read(Utf8("id,mark,lat,lon,h\n\nWB-F1,WB-01,51.5,-0.25,45.2\nWB-F2,WB-02,51.6,-0.26,\n")).Rows();
        Assert.Equal([3L, 4L], rows.Select(r => r.Row));
        Assert.Equal("WB-01", rows[0].Point!.Mark);
        Assert.Equal(51.5, rows[0].Point!.Lat);
        Assert.Equal(-0.25, rows[0].Point!.Lon);
        Assert.Null(rows[1].Point!.H);
    }

    [Theory]
    [InlineData("Name;Lat;Lon\nWB-F1;51,5;-0,25\n", ';')]
    [InlineData("Name\tLat\tLon\nWB-F1\t51,5\t-0,25\n", '\t')]
    public void Semicolon_and_tab_with_decimal_comma_are_detected(string text, char delimiter)
    {
        _ = delimiter;
        var columns = new Dictionary<string, string> { ["id"] = "Name", ["lat"] = "Lat", ["lon"] = "Lon" };
        var row = Assert.Single(new CsvFieldReader(columns, null, null).Read(Utf8(text)).Rows());
        Assert.Equal(51.5, row.Point!.Lat);
        Assert.Equal(-0.25, row.Point!.Lon);
        Assert.Equal("WB-F1", row.Point!.Id);
    }

    [Fact]
    public void Semicolon_with_decimal_point_stays_decimal_point()
    {
        var row = Assert.Single(new CsvFieldReader(null, null, null).Read(Utf8("lat;lon\n51.5;-0.25\n")).Rows());
        Assert.Equal(51.5, row.Point!.Lat);
    }

    [Fact]
    public void Quoted_fields_hold_delimiters_quotes_and_line_breaks()
    {
        var rows = new CsvFieldReader(null, null, null).Read(Utf8("id,lat,lon\n\"WB, \"\"north\"\"\nlamp\",51.5,-0.25\nWB-2,51.6,-0.3\n")).Rows();
        Assert.Equal("WB, \"north\"\nlamp", rows[0].Point!.Id);
        Assert.Equal(4L, rows[1].Row);
    }

    [Theory]
    [InlineData("51°30'36\"N", 51.51)]
    [InlineData("51 30 36 N", 51.51)]
    [InlineData("S 51 30 36", -51.51)]
    [InlineData("-51:30:36", -51.51)]
    [InlineData("0°15'00\"W", -0.25)]
    [InlineData("51°30.6'", 51.51)]
    public void Angles_in_degrees_minutes_seconds_are_read(string text, double degrees)
    {
        Assert.True(FieldText.TryAngle(text, decimalComma: false, out var value));
        Assert.Equal(degrees, value, 1e-12);
    }

    [Theory]
    [InlineData("51°75'00\"N")]
    [InlineData("N 51 30 36 S")]
    [InlineData("fifty-one")]
    public void Malformed_angles_are_refused(string text) => Assert.False(FieldText.TryAngle(text, decimalComma: false, out _));

    [Fact]
    public void A_bad_value_names_its_column_and_the_rest_is_read()
    {
        var rows = new CsvFieldReader(null, null, null).Read(Utf8("id,lat,lon\nA,51.5,-0.25\nB,5l.5,-0.25\nC,51.7,-0.25\n")).Rows();
        Assert.Equal(3, rows.Count);
        var bad = rows[1];
        Assert.Equal(3L, bad.Row);
        Assert.Equal("lat", bad.Problem!.Field);
        Assert.Contains("column 2 (\"lat\")", bad.Problem.Message);
        Assert.NotNull(rows[2].Point);
    }

    [Fact]
    public void A_row_with_the_wrong_field_count_is_a_row_problem()
    {
        var row = Assert.Single(new CsvFieldReader(null, null, null).Read(Utf8("id,lat,lon\nA,51.5\n")).Rows());
        Assert.Contains("2 fields; the header has 3", row.Problem!.Message);
    }

    [Fact]
    public void A_column_map_naming_a_missing_header_stops_the_read()
    {
        var reader = new CsvFieldReader(new Dictionary<string, string> { ["lat"] = "Breite" }, null, null);
        var error = Assert.Throws<FieldFileException>(() => reader.Read(Utf8("id,lat,lon\nA,1,2\n")).Rows());
        Assert.Contains("Breite", error.Message);
    }

    [Fact]
    public void Utf16_with_byte_order_mark_is_read()
    {
        var bytes = Encoding.Unicode.GetPreamble().Concat(Encoding.Unicode.GetBytes("id\tlat\tlon\r\nWB-1\t51,5\t-0,25\r\n")).ToArray();
        var row = Assert.Single(new CsvFieldReader(null, null, null).Read(new MemoryStream(bytes)).Rows());
        Assert.Equal(51.5, row.Point!.Lat);
    }

    [Fact]
    public void Bytes_that_are_not_utf8_stop_the_read_at_their_line()
    {
        var bytes = Encoding.ASCII.GetBytes("id,lat,lon\nA,1,2\n").Concat(new byte[] { (byte)'B', 0xE9, (byte)',', (byte)'1', (byte)',', (byte)'2', (byte)'\n' }).ToArray();
        var error = Assert.Throws<FieldFileException>(() => new CsvFieldReader(null, null, null).Read(new MemoryStream(bytes)).Rows());
        Assert.Equal(3L, error.Row);
    }

    [Fact]
    public void A_line_beyond_the_limit_stops_the_read()
    {
        var text = "id,lat,lon\nA,1," + new string('9', ReadLimits.MaximumLineCharacters + 10) + "\n";
        var error = Assert.Throws<FieldFileException>(() => new CsvFieldReader(null, null, null).Read(Utf8(text)).Rows());
        Assert.Equal(2L, error.Row);
    }
}
