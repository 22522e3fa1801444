using System.Net;
using System.Text.Json;
using QaService.Api.Tests.Support;

namespace QaService.Api.Tests;

/// <summary>GET /v1/crs and /v1/crs/{id}: definitions as `projinfo EPSG:xxxx` (PROJ 9.1.1) prints them; every error a problem.</summary>
public sealed class CrsApiTests : IClassFixture<CrsApiTests.Host>
{
    public sealed class Host : IDisposable
    {
        public QaServiceFactory Factory { get; } = new();
        public void Dispose() => Factory.Dispose();
    }

    private readonly HttpClient client;

    public CrsApiTests(Host host) => client = host.Factory.CreateClient();

    [Theory]
    [InlineData("EPSG:2227")]
    [InlineData("2227")]
    public async Task Describes_a_state_plane_crs(string id)
    {
        var response = await client.GetAsync($"/v1/crs/{id}");
        Assert.Equal(HttpStatusCode.OK, response.StatusCode);
        var crs = JsonDocument.Parse(await response.Content.ReadAsStringAsync()).RootElement;
        // projinfo EPSG:2227: NAD83 / California zone 3 (ftUS), Lambert Conic Conformal (2SP), US survey foot, datum EPSG:6269.
        Assert.Equal("EPSG:2227", crs.GetProperty("id").GetString());
        Assert.Equal("NAD83 / California zone 3 (ftUS)", crs.GetProperty("name").GetString());
        Assert.Equal("projected", crs.GetProperty("kind").GetString());
        Assert.Equal("EPSG:6269", crs.GetProperty("datum").GetProperty("code").GetString());
        Assert.Equal(298.257222101, crs.GetProperty("datum").GetProperty("ellipsoid").GetProperty("inverseFlattening").GetDouble());
        Assert.Equal("EPSG:9802", crs.GetProperty("projection").GetProperty("method").GetString());
        Assert.Equal(1200.0 / 3937.0, crs.GetProperty("unit").GetProperty("metresPerUnit").GetDouble());
        Assert.Equal("e", crs.GetProperty("axes")[0].GetProperty("field").GetString());
        Assert.Contains("IOGP", crs.GetProperty("source").GetString());
        Assert.True(crs.GetProperty("areaOfUse").GetProperty("south").GetDouble() > 36);
    }

    [Fact]
    public async Task Searches_by_words_and_pages()
    {
        var page = JsonDocument.Parse(await client.GetStringAsync("/v1/crs?q=UTM%20zone%2033&limit=2")).RootElement;
        Assert.True(page.GetProperty("total").GetInt32() > 2);
        Assert.Equal(2, page.GetProperty("items").GetArrayLength());
        Assert.All(page.GetProperty("items").EnumerateArray(), i => Assert.Contains("UTM zone 33", i.GetProperty("name").GetString()));
    }

    [Theory]
    [InlineData("EPSG:27572")]
    [InlineData("99999")]
    [InlineData("banana")]
    public async Task Unknown_crs_is_a_404_problem(string id) =>
        await ProblemAssert.IsProblemAsync(await client.GetAsync($"/v1/crs/{id}"), HttpStatusCode.NotFound);

    [Theory]
    [InlineData("limit=0", "/limit")]
    [InlineData("limit=101", "/limit")]
    [InlineData("limit=ten", "/limit")]
    [InlineData("offset=-1", "/offset")]
    public async Task Bad_query_is_a_400_problem(string query, string pointer) =>
        await ProblemAssert.IsBadInputAsync(await client.GetAsync($"/v1/crs?{query}"), pointer, "whole number");

    [Fact]
    public async Task Overlong_query_is_a_400_problem() =>
        await ProblemAssert.IsBadInputAsync(await client.GetAsync($"/v1/crs?q={new string('a', 201)}"), "/q", "longer");
}
