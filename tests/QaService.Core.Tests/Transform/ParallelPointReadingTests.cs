using System.Text;
using System.Text.Json;
using QaService.Core.Reporting;
using QaService.Core.Transform;

namespace QaService.Core.Tests.Transform;

/// <summary>
/// The side-by-side reading of a large transform body must give exactly the request System.Text.Json's single pass
/// gives with the service's options, or step aside (null) so that pass reads it and reports any error.
/// </summary>
public sealed class ParallelPointReadingTests
{
    /// <summary>~2.5 MB of points: geographic with and without height, projected, nulls, varied whitespace.</summary>
    private static string Body(int count, Func<int, string?>? special = null, string tail = "")
    {
        var random = new Random(17);
        var text = new StringBuilder("{ \"from\": \"EPSG:4326\", \"epoch\": 2024.5,\n \"points\": [");
        for (var i = 0; i < count; i++)
        {
            if (i > 0)
                text.Append(i % 7 == 0 ? ",\n  " : i % 11 == 0 ? " , " : ",");
            var point = special?.Invoke(i) ?? (i % 13) switch
            {
                0 => "null",
                1 => $"{{\"e\":{random.NextDouble() * 1e6:R},\"n\":{random.NextDouble() * 6e6:R}}}",
                2 => $"{{ \"lat\" : {random.NextDouble() * 90:R} , \"lon\" : {random.NextDouble() * 180:R} }}",
                3 => $"{{\"lon\":{random.NextDouble() * 180:R},\"lat\":{random.NextDouble() * 90:R},\"h\":null}}",
                _ => $"{{\"lat\":{random.NextDouble() * 90:R},\"lon\":{random.NextDouble() * 180:R},\"h\":{random.NextDouble() * 1000:R}}}",
            };
            text.Append(point);
        }
        return text.Append("],\n \"to\": \"EPSG:32633\"").Append(tail).Append(" }").ToString();
    }

    private static TransformRequest? Quick(string json) => ParallelPointReading.TryRead(Encoding.UTF8.GetBytes(json), ReportJson.Read);

    [Fact]
    public void A_large_body_reads_to_the_request_of_the_single_pass()
    {
        var json = Body(40_000, tail: ", \"operationCode\": \"EPSG:1149\"");
        Assert.True(Encoding.UTF8.GetByteCount(json) >= ParallelPointReading.MinimumBodyBytes);
        var expected = JsonSerializer.Deserialize<TransformRequest>(json, ReportJson.Read)!;

        var quick = Quick(json);

        Assert.NotNull(quick);
        Assert.Equal((expected.From, expected.To, expected.Epoch, expected.OperationCode), (quick.From, quick.To, quick.Epoch, quick.OperationCode));
        Assert.Equal(expected.Points!.Count, quick.Points!.Count);
        Assert.Equal(expected.Points, quick.Points); // TransformPoint records (null where the point was null), in order
    }

    [Theory]
    [InlineData("{\"lat\":1,\"lon\":2,}")]           // trailing comma in a point
    [InlineData("{\"lat\":1,\"lon\":2,\"lat\":3}")]  // repeated field
    [InlineData("{\"lat\":1,\"lng\":2}")]            // unknown field
    [InlineData("{\"lat\":\"1\",\"lon\":2}")]        // a string for a number
    [InlineData("{\"lat\":1,\"lon\":2")]             // not closed
    [InlineData("[1,2]")]                            // not an object
    [InlineData("{\"la},{t\":1}")]                   // the piece separator inside a field name
    public void A_bad_point_in_the_middle_leaves_the_body_to_the_single_pass(string badPoint)
    {
        Assert.Null(Quick(Body(40_000, i => i == 23_456 ? badPoint : null)));
    }

    [Fact]
    public void A_bad_member_outside_the_points_leaves_the_body_to_the_single_pass()
    {
        Assert.Null(Quick(Body(40_000, tail: ", \"epoch\": 2020.0")));        // repeated member
        Assert.Null(Quick(Body(40_000, tail: ", \"colour\": \"red\"")));      // unknown member
        Assert.Null(Quick(Body(40_000, tail: ", \"points\": []")));           // points twice
        Assert.Null(Quick(Body(40_000).Replace("\"points\": [", "\"points\": [[", StringComparison.Ordinal))); // not a point list
    }

    [Fact]
    public void A_small_body_is_left_to_the_single_pass()
    {
        Assert.Null(Quick(Body(10)));
    }
}
