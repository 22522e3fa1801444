using System.Globalization;
using System.Text.Json;
using QaService.Core.Assessment;
using QaService.Core.Reporting;
using QaService.Core.Tests.Transform;
using QaService.Core.Transform;

namespace QaService.Core.Tests.Assessment;

/// <summary>
/// The hand-written point reader of assessment requests against System.Text.Json's own record deserialisation (.NET 10,
/// the same strict options without the converters) on the same bodies: equal points, and a failure wherever the
/// serializer fails, naming the field.
/// </summary>
public sealed class PointRecordJsonConverterTests
{
    private static readonly JsonSerializerOptions Serializer = WithoutConverters(ReportJson.Read);

    private static JsonSerializerOptions WithoutConverters(JsonSerializerOptions options)
    {
        var copy = new JsonSerializerOptions(options);
        copy.Converters.Clear();
        return copy;
    }

    private static readonly string[] Numbers = ["lat", "lon", "e", "n", "x", "y", "z", "h", "sigmaH", "sigmaV", "hdop", "vE", "vN", "vU"];
    private static readonly string[] Texts = ["id", "mark", "featureClass", "crew", "receiver", "quality"];

    [Fact]
    public void Reads_what_the_serializer_reads()
    {
        var random = new Random(11);
        var points = Enumerable.Range(0, 2_000).Select(_ =>
        {
            var fields = new List<string>();
            foreach (var name in Numbers.Where(_ => random.Next(3) == 0))
                fields.Add($"\"{TransformPointJsonConverterTests.Spelled(name, random)}\": {(random.Next(10) == 0 ? "null" : ((random.NextDouble() - 0.5) * Math.Pow(10, random.Next(-3, 8))).ToString(random.Next(4) == 0 ? "E3" : "R", CultureInfo.InvariantCulture))}");
            foreach (var name in Texts.Where(_ => random.Next(3) == 0))
                fields.Add($"\"{TransformPointJsonConverterTests.Spelled(name, random)}\": {(random.Next(10) == 0 ? "null" : JsonSerializer.Serialize("v\u00e9\"" + random.Next(100)))}");
            if (random.Next(3) == 0)
                fields.Add($"\"time\": \"{new DateTimeOffset(2026, 5, 1, 8, 0, 0, TimeSpan.FromHours(random.Next(-3, 4))).AddSeconds(random.Next(86_400)):O}\"");
            return "{" + string.Join(", ", fields.OrderBy(_ => random.Next())) + "}";
        });
        var body = "{\"crs\": \"EPSG:4326\", \"points\": [" + string.Join(",", points) + "]}";
        var expected = JsonSerializer.Deserialize<PointSet>(body, Serializer)!;
        var actual = JsonSerializer.Deserialize<PointSet>(body, ReportJson.Read)!;
        Assert.Equal(expected.Points!, actual.Points!);
        // Written back through the converter and read by the serializer: the same points.
        var written = JsonSerializer.Serialize(actual, ReportJson.Read);
        Assert.Equal(expected.Points!, JsonSerializer.Deserialize<PointSet>(written, Serializer)!.Points!);
    }

    [Theory]
    [InlineData("""{ "lat": "1" }""", "lat")]
    [InlineData("""{ "id": 7 }""", "id")]
    [InlineData("""{ "time": 2026 }""", "time")]
    [InlineData("""{ "time": "yesterday" }""", "time")]
    [InlineData("""{ "crew": {} }""", "crew")]
    [InlineData("""{ "lon": 1, "lon": 2 }""", "lon")]
    [InlineData("""{ "Lat": 1 }""", "Lat")]
    [InlineData("""{ "lat": 1, "extra": 2 }""", "extra")]
    [InlineData("""[1, 2]""", null)]
    public void Fails_where_the_serializer_fails_and_names_the_field(string point, string? member)
    {
        var body = $$"""{ "crs": "EPSG:4326", "points": [ {{point}} ] }""";
        Assert.ThrowsAny<JsonException>(() => JsonSerializer.Deserialize<PointSet>(body, Serializer));
        var failure = Assert.ThrowsAny<JsonException>(() => JsonSerializer.Deserialize<PointSet>(body, ReportJson.Read));
        Assert.Equal("$.points[0]", failure.Path);
        Assert.Equal(member, failure.Data[TransformPointJsonConverter.MemberKey] as string);
    }
}
