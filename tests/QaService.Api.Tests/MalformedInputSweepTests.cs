using System.Net;
using System.Text;
using System.Text.Json.Nodes;
using QaService.Api.Tests.Support;

namespace QaService.Api.Tests;

/// <summary>
/// A deterministic sweep of mutated requests: every value of a valid request replaced in turn by
/// values of other types and extremes, and the body truncated at many points. None may produce a 5xx.
/// </summary>
public sealed class MalformedInputSweepTests : IClassFixture<ServiceHost>
{
    private static readonly string[] Replacements =
        ["null", "\"\"", "\"x\"", "0", "-1", "1e308", "-1e308", "1e-320", "true", "[]", "{}", "[null]", "\"NaN\"", "123456789012345678901234567890", "\"EPSG:4326\""];

    private readonly HttpClient client;

    public MalformedInputSweepTests(ServiceHost host) => client = host.Factory.CreateClient();

    [Fact]
    public async Task No_mutated_value_produces_a_server_error()
    {
        var original = Requests.Minimal();
        original["pairing"] = new JsonObject { ["radius"] = 2 };
        original["exclusions"] = JsonNode.Parse("""[{"fix":"F1","reason":"test"}]""");
        var paths = LeafPaths(original, "").ToList();
        Assert.True(paths.Count > 20, "the sweep should reach every field of the fixture");

        var failures = new List<string>();
        foreach (var path in paths)
        foreach (var replacement in Replacements)
        {
            var mutated = original.DeepClone().AsObject();
            Replace(mutated, path, JsonNode.Parse(replacement));
            var response = await client.PostJsonAsync(mutated);
            if ((int)response.StatusCode >= 500)
                failures.Add($"{path} = {replacement}: {(int)response.StatusCode}");
        }
        Assert.True(failures.Count == 0, string.Join("\n", failures));
    }

    [Fact]
    public async Task No_truncation_produces_a_server_error()
    {
        var text = Requests.Minimal().ToJsonString();
        for (var length = 0; length < text.Length; length += 7)
        {
            var response = await client.PostAsync("/v1/assessments", new StringContent(text[..length], Encoding.UTF8, "application/json"));
            Assert.Equal(HttpStatusCode.BadRequest, response.StatusCode);
        }
    }

    private static IEnumerable<string> LeafPaths(JsonNode node, string path)
    {
        yield return path;
        switch (node)
        {
            case JsonObject obj:
                foreach (var (key, child) in obj)
                    if (child is not null)
                        foreach (var p in LeafPaths(child, $"{path}/{key}")) yield return p;
                break;
            case JsonArray array:
                for (var i = 0; i < array.Count; i++)
                    if (array[i] is { } child)
                        foreach (var p in LeafPaths(child, $"{path}/{i}")) yield return p;
                break;
        }
    }

    private static void Replace(JsonObject root, string path, JsonNode? value)
    {
        if (path.Length == 0)
            return;
        var parts = path.Split('/', StringSplitOptions.RemoveEmptyEntries);
        JsonNode parent = root;
        foreach (var part in parts[..^1])
            parent = parent is JsonArray a ? a[int.Parse(part)]! : parent[part]!;
        if (parent is JsonArray array)
            array[int.Parse(parts[^1])] = value;
        else
            parent[parts[^1]] = value;
    }
}
