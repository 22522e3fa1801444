using System.Text;
using QaService.Core.Ingest;

namespace QaService.Core.Tests.Ingest;

/// <summary>The guided upload's preview reads a file as the upload will: same sniffing, same delimiter rule, same header detection.</summary>
public sealed class FilePreviewTests
{
    private static Task<FilePreview> PreviewAsync(string text, int rows = FilePreview.DefaultRows) =>
        FilePreview.ReadAsync(new MemoryStream(Encoding.UTF8.GetBytes(text)), rows, CancellationToken.None);

    [Fact]
    public async Task Csv_shows_headers_first_rows_with_their_line_numbers_and_the_detected_columns()
    {
        var preview = await PreviewAsync("\nPoint;Latitude;LON;h\nA;48,1;15,2;300\n\nB;48,2;15,3;301\nC;1;2;3\nD;1;2;3\nE;1;2;3\nF;1;2;3\n");
        Assert.Equal(FieldFormat.Csv, preview.Format);
        Assert.Equal(["Point", "Latitude", "LON", "h"], preview.Headers);
        Assert.Equal([3L, 5, 6, 7, 8], preview.Rows.Select(r => r.Row));
        Assert.Equal(["B", "48,2", "15,3", "301"], preview.Rows[1].Cells);
        // Only headers equal to a contract name (case-insensitive) are detected, exactly as the reader maps them.
        Assert.Equal(new Dictionary<string, string> { ["lon"] = "LON", ["h"] = "h" }, preview.DetectedColumns);
    }

    [Fact]
    public async Task Detection_agrees_with_the_reader()
    {
        const string csv = "ID,lat,Lat,lon\nA,1,2,3\n";
        var preview = await PreviewAsync(csv);
        var reader = new CsvFieldReader(null, null, null);
        _ = reader.Read(new MemoryStream(Encoding.UTF8.GetBytes(csv))).ToList();
        Assert.Equal(reader.ColumnNames, preview.DetectedColumns);
    }

    [Fact]
    public async Task Other_formats_show_their_first_points()
    {
        var preview = await PreviewAsync("""{"type":"FeatureCollection","features":[{"type":"Feature","id":"P1","geometry":{"type":"Point","coordinates":[15.5,48.25,301.5]},"properties":{}}]}""");
        Assert.Equal(FieldFormat.GeoJson, preview.Format);
        Assert.Equal("48.25", preview.Rows[0].Cells[1]);
        Assert.Equal("15.5", preview.Rows[0].Cells[2]);
        Assert.Empty(preview.DetectedColumns);
    }

    [Theory]
    [InlineData("", "empty")]
    [InlineData("<kml/>", "no <gpx>")]
    [InlineData("just one column\n1\n", "delimiter")]
    public async Task A_file_that_cannot_be_read_says_why(string text, string problem) =>
        Assert.Contains(problem, (await PreviewAsync(text)).Problem);

    [Fact]
    public void Line_returns_the_physical_line_an_error_names() =>
        Assert.Equal("B,2", FilePreview.Line(new MemoryStream("id,x\r\nA,1\r\nB,2\r\n"u8.ToArray()), 3));
}
