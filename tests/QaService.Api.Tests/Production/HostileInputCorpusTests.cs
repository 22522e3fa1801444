using System.Net;
using System.Text;
using System.Text.Json;
using System.Text.Json.Nodes;
using QaService.Api.Tests.Support;

namespace QaService.Api.Tests.Production;

/// <summary>
/// Hostile input (issue "Fault and load tests"): a corpus of named attack classes and seeded random
/// mutants of a valid request. Every answer is a 4xx RFC 9457 problem (or, for the few classes that are
/// legitimate data, a 201) without internals, never a 5xx, and the service stays healthy afterwards.
/// <see cref="MalformedInputSweepTests"/> covers the per-field type sweep; this file does not repeat it.
/// </summary>
public sealed class HostileInputCorpusTests(ServiceHost host) : IClassFixture<ServiceHost>
{
    /// <summary>One hostile request. <paramref name="MayBeAccepted"/>: the input is odd but valid data (stored, escaped on output).</summary>
    public sealed record HostileCase(string Class, string Method, string Path, string? Body, string? MediaType = "application/json", bool MayBeAccepted = false, byte[]? Raw = null)
    {
        public override string ToString() => Class;
    }

    private static string Valid() => Requests.Minimal().ToJsonString();

    private static string WithFix(string field, string rawValue) =>
        Valid().Replace("\"lat\":48.753013", $"\"{field}\":{rawValue}", StringComparison.Ordinal);

    public static TheoryData<HostileCase> Corpus()
    {
        var deepArrays = new string('[', 100_000) + new string(']', 100_000);
        var deepObjects = string.Concat(Enumerable.Repeat("{\"a\":", 5_000)) + "1" + new string('}', 5_000);
        var cases = new List<HostileCase>
        {
            new("empty body", "POST", "/v1/assessments", ""),
            new("plain text body", "POST", "/v1/assessments", "hello, is this the accuracy service?"),
            new("JSON array at the root", "POST", "/v1/assessments", "[1,2,3]"),
            new("JSON string at the root", "POST", "/v1/assessments", "\"marks\""),
            new("JSON null", "POST", "/v1/assessments", "null"),
            new("truncated JSON", "POST", "/v1/assessments", Valid()[..(Valid().Length / 2)]),
            new("100,000 nested arrays", "POST", "/v1/assessments", deepArrays),
            new("5,000 nested objects in a field", "POST", "/v1/assessments", Valid().Replace("\"title\":\"error-path fixture\"", "\"title\":" + deepObjects, StringComparison.Ordinal)),
            new("NaN literal", "POST", "/v1/assessments", WithFix("lat", "NaN")),
            new("Infinity literal", "POST", "/v1/assessments", WithFix("lat", "Infinity")),
            new("number overflowing to +infinity", "POST", "/v1/assessments", WithFix("lat", "1e400")),
            new("number overflowing to -infinity", "POST", "/v1/assessments", WithFix("lat", "-1e400")),
            new("1,000-digit number", "POST", "/v1/assessments", WithFix("lat", new string('9', 1000))),
            new("infinite epoch", "POST", "/v1/assessments", Valid().Replace("\"crs\":\"EPSG:4326\"", "\"crs\":\"EPSG:4326\",\"epoch\":1e999", StringComparison.Ordinal)),
            new("duplicate keys", "POST", "/v1/assessments", WithFix("lat", "48.753013,\"lat\":10")),
            new("unknown field", "POST", "/v1/assessments", WithFix("lng", "48.753013")),
            new("string where a number belongs", "POST", "/v1/assessments", WithFix("lat", "\"48.75\"")),
            new("object where a number belongs", "POST", "/v1/assessments", WithFix("lat", "{\"$gt\":0}")),
            new("JSON comments", "POST", "/v1/assessments", "/* hi */" + Valid()),
            new("trailing commas", "POST", "/v1/assessments", Valid()[..^1] + ",}"),
            new("invalid UTF-8 bytes", "POST", "/v1/assessments", "", Raw: InvalidUtf8()),
            new("lone surrogate escape", "POST", "/v1/assessments", Valid().Replace("error-path fixture", "\\ud800", StringComparison.Ordinal)),
            new("wrong media type", "POST", "/v1/assessments", Valid(), "text/plain"),
            new("no media type", "POST", "/v1/assessments", Valid(), null),
            new("form-urlencoded", "POST", "/v1/assessments", "marks=1&fixes=2", "application/x-www-form-urlencoded"),
            new("XML with an external entity", "POST", "/v1/assessments",
                "<?xml version=\"1.0\"?><!DOCTYPE x [<!ENTITY e SYSTEM \"file:///etc/passwd\">]><x>&e;</x>", "application/xml"),
            new("XML entity declared as JSON", "POST", "/v1/assessments",
                "<?xml version=\"1.0\"?><!DOCTYPE x [<!ENTITY e SYSTEM \"file:///etc/passwd\">]><x>&e;</x>"),
            new("CRS code beyond any integer", "POST", "/v1/assessments", Valid().Replace("EPSG:4326", "EPSG:99999999999999999999999", StringComparison.Ordinal)),
            new("CRS with SQL", "POST", "/v1/assessments", Valid().Replace("EPSG:4326", "EPSG:4326'; DROP TABLE reports; --", StringComparison.Ordinal)),
            new("nested WKT bomb", "POST", "/v1/assessments", Valid().Replace("\"EPSG:4326\"", JsonSerializer.Serialize(string.Concat(Enumerable.Repeat("GEOGCS[", 20_000)) + new string(']', 20_000)), StringComparison.Ordinal)),
            new("1 MB mark id", "POST", "/v1/assessments", Valid().Replace("\"mark\":\"A\"", "\"mark\":\"" + new string('A', 1_000_000) + "\"", StringComparison.Ordinal)),
            new("20,000 invalid points", "POST", "/v1/assessments", ManyBadPoints(20_000)),
            new("impossible date", "POST", "/v1/assessments", WithFix("time", "\"2026-13-45T25:61:00Z\",\"lat\":48.753013")),
            new("negative sigma", "POST", "/v1/assessments", Valid().Replace("\"h\":200.0}", "\"h\":200.0,\"sigmaH\":-1}", StringComparison.Ordinal)),
            new("transform with an infinite point", "POST", "/v1/transform", """{ "from": "EPSG:4326", "to": "EPSG:32633", "points": [ { "lat": 1e400, "lon": 15 } ] }"""),
            new("transform to an unknown CRS", "POST", "/v1/transform", """{ "from": "EPSG:4326", "to": "EPSG:0", "points": [ { "lat": 48, "lon": 15 } ] }"""),
            new("path traversal in the id", "GET", "/v1/assessments/..%2F..%2F..%2Fetc%2Fpasswd", null),
            new("SQL injection in the id", "GET", "/v1/assessments/x'%20OR%20'1'%3D'1", null),
            new("4,000-character id", "GET", "/v1/assessments/" + new string('a', 4_000), null),
            new("method not allowed", "DELETE", "/v1/assessments/demo", null),
            new("unknown path", "GET", "/v1/../../etc/passwd", null),
            new("CRS search with regex bomb", "GET", "/v1/crs?q=" + Uri.EscapeDataString("(a+)+$" + new string('a', 5_000)), null, MayBeAccepted: true),
            new("CRS search with a negative limit", "GET", "/v1/crs?q=utm&limit=-1&offset=-5", null),
            new("HTML in the title", "POST", "/v1/assessments", Valid().Replace("error-path fixture", "<script>alert(1)</script>", StringComparison.Ordinal), MayBeAccepted: true),
            new("spreadsheet formula in an id", "POST", "/v1/assessments", Valid().Replace("\"id\":\"F1\"", "\"id\":\"=HYPERLINK(\\\"http://example.invalid\\\")\"", StringComparison.Ordinal), MayBeAccepted: true),
            new("admin path without a token", "POST", "/v1/admin/tenants", """{"name":"x"}"""),
        };
        var data = new TheoryData<HostileCase>();
        foreach (var c in cases)
            data.Add(c);
        return data;
    }

    [Fact]
    public void The_corpus_has_at_least_25_classes() => Assert.True(Corpus().Count >= 25);

    [Theory]
    [MemberData(nameof(Corpus))]
    public async Task Each_hostile_class_gets_a_4xx_problem_without_internals(HostileCase hostile)
    {
        var client = host.Factory.CreateClient();
        var request = new HttpRequestMessage(new HttpMethod(hostile.Method), hostile.Path);
        if (hostile.Body is not null)
        {
            request.Content = new ByteArrayContent(hostile.Raw ?? Encoding.UTF8.GetBytes(hostile.Body));
            if (hostile.MediaType is not null)
                request.Content.Headers.ContentType = new System.Net.Http.Headers.MediaTypeHeaderValue(hostile.MediaType) { CharSet = "utf-8" };
        }
        var response = await client.SendAsync(request);
        var status = (int)response.StatusCode;
        var text = await response.Content.ReadAsStringAsync();
        if (hostile.MayBeAccepted && status < 300)
            return;
        Assert.True(status is >= 400 and < 500, $"{hostile.Class}: {status} {Shorten(text)}");
        Assert.Equal("application/problem+json", response.Content.Headers.ContentType?.MediaType);
        AssertNoInternals(text, hostile.Class);

        Assert.Equal(HttpStatusCode.OK, (await client.GetAsync("/healthz")).StatusCode);
    }

    /// <summary>Seeded random mutants of a valid request: byte edits and grafted random JSON values.</summary>
    [Fact]
    public async Task Generated_mutants_never_get_a_5xx()
    {
        const int seed = 20_261_125;
        const int mutants = 400;
        var random = new Random(seed);
        var client = host.Factory.CreateClient();
        var failures = new List<string>();
        var statuses = new SortedDictionary<int, int>();
        for (var i = 0; i < mutants; i++)
        {
            var body = i % 2 == 0 ? MutateBytes(random, Encoding.UTF8.GetBytes(Valid())) : Encoding.UTF8.GetBytes(Graft(random));
            var content = new ByteArrayContent(body);
            content.Headers.ContentType = new System.Net.Http.Headers.MediaTypeHeaderValue("application/json");
            var response = await client.PostAsync(i % 5 == 4 ? "/v1/transform" : "/v1/assessments", content);
            var status = (int)response.StatusCode;
            statuses[status] = statuses.GetValueOrDefault(status) + 1;
            if (status >= 500)
                failures.Add($"mutant {i} (seed {seed}): {status} for {Shorten(Encoding.UTF8.GetString(body))}");
            else if (status >= 400)
            {
                var text = await response.Content.ReadAsStringAsync();
                if (response.Content.Headers.ContentType?.MediaType != "application/problem+json" || text.Contains(" at ", StringComparison.Ordinal) && text.Contains(".cs:line", StringComparison.Ordinal))
                    failures.Add($"mutant {i} (seed {seed}): {status} is not a clean problem: {Shorten(text)}");
            }
        }
        Assert.True(failures.Count == 0, string.Join("\n", failures));
        Assert.True(statuses.Keys.Any(s => s >= 400), "the mutants should include bad requests");
        Assert.Equal(HttpStatusCode.Created, (await client.PostJsonAsync(Requests.Minimal())).StatusCode);
    }

    private static readonly string[] Tokens =
        ["{", "}", "[", "]", ",", ":", "\"", "null", "true", "1e999", "-0", "NaN", "\\u0000", "\\ud800", "\u00e9", "9999999999999999999999", "\"EPSG:", "<!ENTITY", "=cmd|", "\t\n"];

    private static byte[] MutateBytes(Random random, byte[] valid)
    {
        var bytes = new List<byte>(valid);
        var edits = random.Next(1, 5);
        for (var e = 0; e < edits && bytes.Count > 0; e++)
        {
            var at = random.Next(bytes.Count);
            switch (random.Next(4))
            {
                case 0: bytes[at] = (byte)random.Next(256); break;
                case 1: bytes.RemoveRange(at, Math.Min(random.Next(1, 16), bytes.Count - at)); break;
                case 2: bytes.InsertRange(at, Encoding.UTF8.GetBytes(Tokens[random.Next(Tokens.Length)])); break;
                default:
                    var length = Math.Min(random.Next(1, 40), bytes.Count - at);
                    bytes.InsertRange(at, bytes.GetRange(at, length));
                    break;
            }
        }
        return bytes.ToArray();
    }

    private static string Graft(Random random)
    {
        var root = Requests.Minimal();
        var leaves = new List<(JsonNode Parent, string? Key, int Index)>();
        Collect(root, leaves);
        var (parent, key, index) = leaves[random.Next(leaves.Count)];
        var value = RandomValue(random, depth: 0);
        if (key is not null)
            parent[key] = value;
        else
            parent.AsArray()[index] = value;
        return root.ToJsonString();
    }

    private static void Collect(JsonNode node, List<(JsonNode, string?, int)> leaves)
    {
        if (node is JsonObject obj)
            foreach (var (key, child) in obj.ToList())
            {
                leaves.Add((obj, key, -1));
                if (child is not null) Collect(child, leaves);
            }
        else if (node is JsonArray array)
            for (var i = 0; i < array.Count; i++)
            {
                leaves.Add((array, null, i));
                if (array[i] is { } child) Collect(child, leaves);
            }
    }

    private static JsonNode? RandomValue(Random random, int depth) => random.Next(depth > 6 ? 6 : 9) switch
    {
        0 => null,
        1 => JsonValue.Create(random.Next(2) == 0),
        2 => JsonValue.Create((random.NextDouble() - 0.5) * Math.Pow(10, random.Next(-320, 309))),
        3 => JsonValue.Create(random.Next(int.MinValue, int.MaxValue)),
        4 => JsonValue.Create(RandomText(random)),
        5 => JsonValue.Create(new[] { "EPSG:4326", "EPSG:32633", "EPSG:0", "GEOGCS[", "ellipsoidal", "orthometric", "none", "nssda", "" }[random.Next(9)]),
        6 => new JsonArray(Enumerable.Range(0, random.Next(4)).Select(_ => RandomValue(random, depth + 1)).ToArray()),
        _ => new JsonObject(Enumerable.Range(0, random.Next(4)).Select(k =>
            KeyValuePair.Create(new[] { "id", "lat", "lon", "e", "n", "h", "crs", "points", "x" }[random.Next(9)] + (k == 0 ? "" : k.ToString()), RandomValue(random, depth + 1)))),
    };

    private static string RandomText(Random random)
    {
        var length = random.Next(0, 40);
        var chars = new char[length];
        for (var i = 0; i < length; i++)
            chars[i] = (char)random.Next(0x20, 0x2FFF);
        return new string(chars);
    }

    /// <summary>The valid request with the title's bytes replaced by 0xFF 0xFE, which UTF-8 never contains (RFC 3629 §1).</summary>
    private static byte[] InvalidUtf8()
    {
        var text = Valid();
        var at = text.IndexOf("error-path fixture", StringComparison.Ordinal);
        return [.. Encoding.UTF8.GetBytes(text[..at]), 0xFF, 0xFE, .. Encoding.UTF8.GetBytes(text[at..])];
    }

    private static string ManyBadPoints(int count)
    {
        var body = Requests.Minimal();
        var points = new JsonArray();
        for (var i = 0; i < count; i++)
            points.Add(new JsonObject { ["id"] = $"F{i}", ["mark"] = "A", ["lat"] = 95.0, ["lon"] = 15.0 });
        body["fixes"]!["points"] = points;
        return body.ToJsonString();
    }

    internal static void AssertNoInternals(string text, string what)
    {
        foreach (var marker in new[] { ".cs:line", "   at ", "/work/", "/root/", "System.", "Exception", "Npgsql", "SQLite Error" })
            Assert.False(text.Contains(marker, StringComparison.Ordinal), $"{what}: the answer shows internals ({marker}): {Shorten(text)}");
    }

    private static string Shorten(string text) => text.Length <= 300 ? text : text[..300] + "…";
}
