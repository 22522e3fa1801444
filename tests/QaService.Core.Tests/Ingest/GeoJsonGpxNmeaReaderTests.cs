using System.Text;
using QaService.Core.Ingest;
using static QaService.Core.Tests.Ingest.ReaderTestSupport;

namespace QaService.Core.Tests.Ingest;

/// <summary>
/// GeoJSON (RFC 7946), GPX 1.1 and NMEA 0183 readers on files made for the test (invented scenario:
/// Corrow Water's valve survey). NMEA checksums in these files were computed outside the project
/// (Python, XOR of the characters between $ and *), the same rule as NMEA 0183 §5.3.1.
/// </summary>
public sealed class GeoJsonGpxNmeaReaderTests
{
    [Fact]
    public void GeoJson_points_are_lon_lat_h_with_properties()
    {
        const string text = """
            {"type":"FeatureCollection","name":"Corrow valves","features":[
              {"type":"Feature","id":7,"geometry":{"type":"Point","coordinates":[-3.25,55.5,101.5]},"properties":{"mark":"CV-01","time":"2026-04-02T10:00:00Z"}},
              {"type":"Feature","geometry":{"type":"Point","coordinates":[-3.26,55.6]},"properties":{"id":"CV-F2"}},
              {"type":"Feature","geometry":{"type":"LineString","coordinates":[[0,0],[1,1]]},"properties":{}}
            ]}
            """;
        var rows = new GeoJsonFieldReader(PositionAxes.LonLatH).Read(Utf8(text)).Rows();
        Assert.Equal(3, rows.Count);
        Assert.Equal("7", rows[0].Point!.Id);
        Assert.Equal(-3.25, rows[0].Point!.Lon);
        Assert.Equal(55.5, rows[0].Point!.Lat);
        Assert.Equal(101.5, rows[0].Point!.H);
        Assert.Equal("CV-01", rows[0].Point!.Mark);
        Assert.Equal(new DateTimeOffset(2026, 4, 2, 10, 0, 0, TimeSpan.Zero), rows[0].Point!.Time);
        Assert.Null(rows[1].Point!.H);
        Assert.Equal(2L, rows[2].Row);
        Assert.Contains("not a Point", rows[2].Problem!.Message);
    }

    [Fact]
    public void GeoJson_is_read_as_a_stream_across_many_buffer_refills()
    {
        var text = new StringBuilder("{\"type\":\"FeatureCollection\",\"features\":[");
        const int count = 5_000;
        for (var i = 0; i < count; i++)
            text.Append(i == 0 ? "" : ",").Append("{\"type\":\"Feature\",\"geometry\":{\"type\":\"Point\",\"coordinates\":[")
                .Append(i * 1e-5).Append(",55.5,10]},\"properties\":{\"id\":\"F").Append(i).Append("\"}}");
        text.Append("]}");
        var rows = new GeoJsonFieldReader(PositionAxes.LonLatH).Read(Utf8(text.ToString())).Rows();
        Assert.Equal(count, rows.Count);
        Assert.All(rows, r => Assert.Null(r.Problem));
        Assert.Equal("F4999", rows[^1].Point!.Id);
    }

    [Theory]
    [InlineData("{\"type\":\"FeatureCollection\",\"features\":[{\"type\":\"Feature\",\"geometry\":{\"type\":\"Point\",\"coordinates\":[1,2")]
    [InlineData("{\"type\":\"FeatureCollection\"}")]
    [InlineData("{\"type\":\"FeatureCollection\",\"features\":{}}")]
    public void Broken_GeoJson_stops_the_read(string text) =>
        Assert.Throws<FieldFileException>(() => new GeoJsonFieldReader(PositionAxes.LonLatH).Read(Utf8(text)).Rows());

    [Fact]
    public void Gpx_waypoints_and_track_points_with_receiver_fields()
    {
        const string text = """
            <?xml version="1.0" encoding="UTF-8"?>
            <gpx version="1.1" creator="test" xmlns="http://www.topografix.com/GPX/1/1">
              <wpt lat="55.5" lon="-3.25"><ele>101.5</ele><time>2026-04-02T10:00:00Z</time><name>CV-F1</name><fix>dgps</fix><sat>9</sat><hdop>0.8</hdop><extensions><x>1</x></extensions></wpt>
              <trk><trkseg>
                <trkpt lat="55.6" lon="-3.26"><ele>99</ele></trkpt>
              </trkseg></trk>
            </gpx>
            """;
        var rows = new GpxFieldReader().Read(Utf8(text)).Rows();
        Assert.Equal(2, rows.Count);
        Assert.Equal(3L, rows[0].Row);
        Assert.Equal("CV-F1", rows[0].Point!.Id);
        Assert.Equal(101.5, rows[0].Point!.H);
        Assert.Equal(FixQuality.Differential, rows[0].Receiver!.Quality);
        Assert.Equal(9, rows[0].Receiver!.Satellites);
        Assert.Equal(5L, rows[1].Row);
        Assert.Equal(-3.26, rows[1].Point!.Lon);
    }

    [Theory]
    [InlineData("<?xml version=\"1.0\"?><!DOCTYPE gpx [<!ENTITY x SYSTEM \"file:///etc/passwd\">]><gpx><wpt lat=\"1\" lon=\"2\"><name>&x;</name></wpt></gpx>", "DTD")]
    [InlineData("<?xml version=\"1.0\"?><!DOCTYPE gpx [<!ENTITY a \"aaaaaaaaaa\"><!ENTITY b \"&a;&a;&a;&a;&a;&a;&a;&a;\">]><gpx><wpt lat=\"1\" lon=\"2\"><name>&b;</name></wpt></gpx>", "DTD")]
    [InlineData("<gpx version=\"1.1\"><wpt lat=\"1\" lon=\"2\"><name>cut", "not well-formed")]
    [InlineData("<kml><Placemark/></kml>", "<gpx>")]
    public void Hostile_or_broken_gpx_stops_the_read_without_resolving_anything(string text, string fragment)
    {
        var error = Assert.Throws<FieldFileException>(() => new GpxFieldReader().Read(Utf8(text)).Rows());
        Assert.Contains(fragment, error.Message);
    }

    [Fact]
    public void Nmea_gga_with_gst_gsa_rmc_gives_one_fix_with_ellipsoidal_height()
    {
        // GGA altitude 52.300 m above the geoid + separation 48.100 m = 100.400 m above WGS 84 (NMEA 0183 GGA fields 9, 11).
        const string log = """
            $GNRMC,101500.00,A,5530.00000000,N,00315.00000000,W,0.0,0.0,020426,,,R*42
            $GNGGA,101500.00,5530.00000000,N,00315.00000000,W,4,17,0.6,52.300,M,48.100,M,1.2,0012*73
            $GNGSA,A,3,01,02,03,04,05,06,07,08,,,,,1.2,0.6,1.0*20
            $GNGST,101500.00,0.010,0.012,0.009,45.0,0.011,0.010,0.018*7E
            """;
        var reader = new NmeaFieldReader(wantHeights: true);
        var row = Assert.Single(reader.Read(Utf8(log)).Rows());
        Assert.Null(row.Problem);
        Assert.Equal(55.5, row.Point!.Lat!.Value, 1e-12);
        Assert.Equal(-3.25, row.Point!.Lon!.Value, 1e-12);
        Assert.Equal(100.4, row.Point!.H!.Value, 1e-9);
        Assert.Equal(new DateTimeOffset(2026, 4, 2, 10, 15, 0, TimeSpan.Zero), row.Point!.Time);
        var receiver = row.Receiver!;
        Assert.Equal(FixQuality.RtkFixed, receiver.Quality);
        Assert.Equal(17, receiver.Satellites);
        Assert.Equal(0.6, receiver.Hdop);
        Assert.Equal(1.2, receiver.Pdop);
        Assert.Equal(1.0, receiver.Vdop);
        Assert.Equal(0.011, receiver.SigmaLatitudeMetres);
        Assert.Equal(0.018, receiver.SigmaAltitudeMetres);
        Assert.Equal(1.2, receiver.CorrectionAgeSeconds);
    }

    [Theory]
    [InlineData("GP")]
    [InlineData("GL")]
    [InlineData("GA")]
    [InlineData("GB")]
    [InlineData("BD")]
    [InlineData("GI")]
    [InlineData("GQ")]
    [InlineData("GN")]
    public void Every_talker_id_is_read(string talker)
    {
        var body = $"{talker}GGA,101500.00,5530.00000000,N,00315.00000000,W,1,08,1.1,52.3,M,48.1,M,,";
        var row = Assert.Single(new NmeaFieldReader(true).Read(Utf8(WithChecksum(body))).Rows());
        Assert.Equal(FixQuality.Autonomous, row.Receiver!.Quality);
    }

    [Theory]
    [InlineData("$GNGGA,101500.00,5530.00000000,N,00315.00000000,W,4,17,0.6,52.300,M,48.100,M,1.2,0012*74", "checksum mismatch")]
    [InlineData("$GNGGA,101500.00,5530.00000000,N,00315.00000000,W,4,17,0.6,52.300,M,48.100,M,1.2,0012", "no *hh checksum")]
    [InlineData("hello", "not an NMEA")]
    public void Bad_sentences_are_row_problems(string line, string fragment)
    {
        var row = Assert.Single(new NmeaFieldReader(true).Read(Utf8(line + "\n")).Rows());
        Assert.Contains(fragment, row.Problem!.Message);
        Assert.Equal(1L, row.Row);
    }

    [Fact]
    public void Gga_without_geoid_separation_cannot_give_an_ellipsoidal_height()
    {
        var row = Assert.Single(new NmeaFieldReader(true).Read(Utf8(WithChecksum("GPGGA,101500.00,5530.0,N,00315.0,W,1,08,1.1,52.3,M,,M,,"))).Rows());
        Assert.Contains("geoid separation", row.Problem!.Message);
        var horizontalOnly = Assert.Single(new NmeaFieldReader(false).Read(Utf8(WithChecksum("GPGGA,101500.00,5530.0,N,00315.0,W,1,08,1.1,52.3,M,,M,,"))).Rows());
        Assert.Null(horizontalOnly.Point!.H);
    }

    [Theory]
    [InlineData("<gpx></gpx>", FieldFormat.Gpx)]
    [InlineData("\uFEFF  {\"type\":\"FeatureCollection\"}", FieldFormat.GeoJson)]
    [InlineData("$GPGGA,", FieldFormat.Nmea)]
    [InlineData("id,lat,lon", FieldFormat.Csv)]
    public async Task Format_is_recognised_from_content(string text, FieldFormat expected)
    {
        var (format, _, _) = await FormatSniffer.DetectAsync(Utf8(text), CancellationToken.None);
        Assert.Equal(expected, format);
    }

    private static string WithChecksum(string body)
    {
        byte c = 0;
        foreach (var ch in body)
            c ^= (byte)ch;
        return $"${body}*{c:X2}\n";
    }
}
