using System.Globalization;
using System.Text.Json;
using QaService.Core.Reporting;
using QaService.Core.Transform;

namespace QaService.Core.Tests.Transform;

/// <summary>
/// The hand-written point reader against System.Text.Json's own record deserialisation (.NET 10, the same strict
/// options without the converter) on the same bodies: equal points, and a failure wherever the serializer fails.
/// </summary>
public sealed class TransformPointJsonConverterTests
{
    /// <summary>The service's reading options without the converter: the serializer's own path.</summary>
    private static readonly JsonSerializerOptions Serializer = WithoutConverters(ReportJson.Read);

    private static JsonSerializerOptions WithoutConverters(JsonSerializerOptions options)
    {
        var copy = new JsonSerializerOptions(options);
        copy.Converters.Clear();
        return copy;
    }

    [Fact]
    public void Reads_what_the_serializer_reads()
    {
        var random = new Random(7);
        string[] names = ["lat", "lon", "e", "n", "x", "y", "z", "h"];
        var points = Enumerable.Range(0, 2_000).Select(_ =>
        {
            var fields = names.Where(_ => random.Next(3) == 0)
                .Select(n => $"\"{Spelled(n, random)}\": {(random.Next(10) == 0 ? "null" : ((random.NextDouble() - 0.5) * Math.Pow(10, random.Next(-3, 8))).ToString("R", CultureInfo.InvariantCulture))}");
            return random.Next(50) == 0 ? "null" : "{" + string.Join(", ", fields) + "}";
        });
        var body = "{\"from\": \"EPSG:4326\", \"to\": \"EPSG:32633\", \"points\": [" + string.Join(",", points) + "]}";
        var expected = JsonSerializer.Deserialize<TransformRequest>(body, Serializer)!;
        var actual = JsonSerializer.Deserialize<TransformRequest>(body, ReportJson.Read)!;
        Assert.Equal(expected.Points!, actual.Points!);
        // Written back through the converter and read by the serializer: the same points.
        var written = JsonSerializer.Serialize(actual, ReportJson.Read);
        Assert.Equal(expected.Points!, JsonSerializer.Deserialize<TransformRequest>(written, Serializer)!.Points!);
    }

    /// <summary>A name as a client may spell it: now and then with its first letter escaped (<c>\u006cat</c>), which JSON allows (RFC 8259 §7).</summary>
    internal static string Spelled(string name, Random random) =>
        random.Next(8) == 0 ? $"\\u{(int)name[0]:x4}{name[1..]}" : name;

    [Theory]
    [InlineData("""{ "lat": "1" }""", "lat")]
    [InlineData("""{ "lat": true }""", "lat")]
    [InlineData("""{ "lat": {} }""", "lat")]
    [InlineData("""{ "lon": 1, "lon": 2 }""", "lon")]
    [InlineData("""{ "LAT": 1 }""", "LAT")]
    [InlineData("""{ "lat": 1, "extra": 2 }""", "extra")]
    [InlineData("""[1, 2]""", null)]
    [InlineData("\"north\"", null)]
    public void Fails_where_the_serializer_fails_and_names_the_field(string point, string? member)
    {
        var body = $$"""{ "from": "EPSG:4326", "to": "EPSG:32633", "points": [ {{point}} ] }""";
        Assert.ThrowsAny<JsonException>(() => JsonSerializer.Deserialize<TransformRequest>(body, Serializer));
        var failure = Assert.ThrowsAny<JsonException>(() => JsonSerializer.Deserialize<TransformRequest>(body, ReportJson.Read));
        Assert.Equal("$.points", failure.Path);
        Assert.Equal(0, failure.Data[TransformPointListJsonConverter.IndexKey]);
        Assert.Equal(member, failure.Data[TransformPointJsonConverter.MemberKey] as string);
    }
}
