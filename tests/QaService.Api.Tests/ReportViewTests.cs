using System.Net;
using System.Text.Json;
using QaService.Api.Tests.Support;

namespace QaService.Api.Tests;

/// <summary>The report's views (api-v1 "report.html, residuals.csv, residuals.geojson"), negotiation and the web UI's list.</summary>
public sealed class ReportViewTests : IClassFixture<DemoServiceHost>
{
    private readonly HttpClient client;

    public ReportViewTests(DemoServiceHost host) => client = host.Factory.CreateClient();

    [Fact]
    public async Task Html_report_is_served_with_a_policy_that_blocks_scripts_and_external_loads()
    {
        var response = await client.GetAsync("/v1/assessments/demo/report.html");
        Assert.Equal(HttpStatusCode.OK, response.StatusCode);
        Assert.Equal("text/html", response.Content.Headers.ContentType?.MediaType);
        var policy = response.Headers.GetValues("Content-Security-Policy").Single();
        Assert.Contains("default-src 'none'", policy);
        Assert.DoesNotContain("script-src", policy);
        Assert.Equal("nosniff", response.Headers.GetValues("X-Content-Type-Options").Single());
        Assert.Equal("no-referrer", response.Headers.GetValues("Referrer-Policy").Single());
        var html = await response.Content.ReadAsStringAsync();
        Assert.Contains("Millbrook Ferry", html);
        Assert.Contains("<svg id=\"plot-scatter\"", html);
    }

    [Theory]
    [InlineData("text/html,application/xhtml+xml,application/xml;q=0.9,*/*;q=0.8", "text/html")] // a browser
    [InlineData("application/json", "application/json")]
    [InlineData("*/*", "application/json")]
    [InlineData("application/json, text/html;q=0.5", "application/json")]
    public async Task Get_by_id_follows_the_accept_header(string accept, string expected)
    {
        using var request = new HttpRequestMessage(HttpMethod.Get, "/v1/assessments/demo");
        request.Headers.Accept.ParseAdd(accept);
        var response = await client.SendAsync(request);
        Assert.Equal(HttpStatusCode.OK, response.StatusCode);
        Assert.Equal(expected, response.Content.Headers.ContentType?.MediaType);
    }

    [Fact]
    public async Task Csv_and_geojson_are_downloads_with_one_row_or_feature_per_pair()
    {
        var report = JsonDocument.Parse(await client.GetStringAsync("/v1/assessments/demo")).RootElement;
        int pairs = report.GetProperty("residuals").GetArrayLength();

        var csv = await client.GetAsync("/v1/assessments/demo/residuals.csv");
        Assert.Equal("text/csv", csv.Content.Headers.ContentType?.MediaType);
        Assert.Equal("attachment", csv.Content.Headers.ContentDisposition?.DispositionType);
        var lines = (await csv.Content.ReadAsStringAsync()).Split("\r\n", StringSplitOptions.RemoveEmptyEntries);
        Assert.Equal(pairs + 1, lines.Length);

        var geojson = await client.GetAsync("/v1/assessments/demo/residuals.geojson");
        Assert.Equal("application/geo+json", geojson.Content.Headers.ContentType?.MediaType);
        var collection = JsonDocument.Parse(await geojson.Content.ReadAsStringAsync()).RootElement;
        Assert.Equal(pairs, collection.GetProperty("features").GetArrayLength());
    }

    [Theory]
    [InlineData("/v1/assessments/no-such-report/report.html")]
    [InlineData("/v1/assessments/no-such-report/residuals.csv")]
    [InlineData("/v1/assessments/no-such-report/residuals.geojson")]
    public async Task Unknown_id_is_a_404_problem(string path)
    {
        var response = await client.GetAsync(path);
        Assert.Equal(HttpStatusCode.NotFound, response.StatusCode);
        Assert.Equal("application/problem+json", response.Content.Headers.ContentType?.MediaType);
    }

    [Fact]
    public async Task Home_lists_recent_assessments_newest_first_and_offers_the_upload_form()
    {
        var body = Requests.Minimal();
        body["title"] = "Second <batch>";
        var created = await client.PostJsonAsync(body);
        Assert.Equal(HttpStatusCode.Created, created.StatusCode);

        var html = await client.GetStringAsync("/");
        int newest = html.IndexOf("Second &lt;batch&gt;", StringComparison.Ordinal);
        int demo = html.IndexOf("Millbrook Ferry", StringComparison.Ordinal);
        Assert.True(newest > 0 && demo > newest, "the new assessment is listed above the demo");
        Assert.Matches("action=\"/ui/assessments\\?af=[^\"]+\" enctype=\"multipart/form-data\"", html);
        foreach (var part in new[] { "name=\"options\"", "name=\"marks\"", "name=\"fixes\"" })
            Assert.Contains(part, html);
    }

    [Fact]
    public async Task A_form_post_without_the_pages_antiforgery_token_is_refused()
    {
        using var request = new HttpRequestMessage(HttpMethod.Post, "/ui/assessments?af=forged") { Content = new MultipartFormDataContent() };
        var response = await client.SendAsync(request);
        Assert.Equal(HttpStatusCode.BadRequest, response.StatusCode);
        Assert.Contains("The form was not accepted", await response.Content.ReadAsStringAsync());
    }

    [Fact]
    public async Task A_cross_site_form_post_is_refused()
    {
        // A page elsewhere has no antiforgery token of this service: refused before anything is read (400).
        using var request = new HttpRequestMessage(HttpMethod.Post, "/ui/assessments") { Content = new MultipartFormDataContent() };
        request.Headers.Add("Sec-Fetch-Site", "cross-site");
        var response = await client.SendAsync(request);
        Assert.Equal(HttpStatusCode.BadRequest, response.StatusCode);
        // Even with a token taken from the form, a cross-site post is refused by the Fetch Metadata check (403).
        var token = BrowserLike.UploadToken(await client.GetStringAsync("/"));
        using var withToken = new HttpRequestMessage(HttpMethod.Post, $"/ui/assessments?af={Uri.EscapeDataString(token)}") { Content = new MultipartFormDataContent() };
        withToken.Headers.Add("Sec-Fetch-Site", "cross-site");
        Assert.Equal(HttpStatusCode.Forbidden, (await client.SendAsync(withToken)).StatusCode);
    }
}
