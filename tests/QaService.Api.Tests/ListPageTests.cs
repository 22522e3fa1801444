using System.Net;
using System.Text.RegularExpressions;
using Microsoft.AspNetCore.Mvc.Testing;
using QaService.Api.Tests.Support;

namespace QaService.Api.Tests;

/// <summary>The list page for people (/ui/assessments): filters, next-page link, delete forms with an antiforgery token.</summary>
public sealed partial class ListPageTests
{
    private static readonly DateTimeOffset T0 = new(2026, 4, 2, 7, 30, 0, TimeSpan.Zero);

    [Fact]
    public async Task The_page_lists_filters_and_pages_with_escaped_titles_and_accessible_markup()
    {
        using var factory = new QaServiceFactory();
        await ListingScenarios.SeedAsync(factory, Enumerable.Range(0, 25).Select(i =>
            ListingScenarios.Row("local", $"p{i:D2}", T0.AddMinutes(i), i == 24 ? "<script>alert(1)</script> & co" : $"Pole survey {i}", i % 2 == 0 ? "pass" : "fail")));
        var client = factory.CreateClient();

        var home = await client.GetStringAsync("/");
        Assert.Contains("href=\"/ui/assessments\"", home);

        var first = await client.GetAsync("/ui/assessments");
        Assert.Equal(HttpStatusCode.OK, first.StatusCode);
        Assert.Equal("text/html", first.Content.Headers.ContentType?.MediaType);
        var html = await first.Content.ReadAsStringAsync();
        Assert.DoesNotContain("<script>", html);
        Assert.Contains("&lt;script&gt;alert(1)&lt;/script&gt; &amp; co", html);
        foreach (var label in new[] { "q", "verdict", "from", "to", "limit" })
            Assert.Contains($"<label for=\"{label}\">", html);
        Assert.Contains("<th scope=\"col\">made (UTC)</th>", html);
        Assert.Equal(20, Rows(html).Count);
        Assert.Equal("p24", Rows(html)[0]);

        var next = NextLink().Match(html);
        Assert.True(next.Success, "no next-page link");
        var second = await client.GetStringAsync(WebUtility.HtmlDecode(next.Groups[1].Value));
        Assert.Equal(["p04", "p03", "p02", "p01", "p00"], Rows(second));
        Assert.DoesNotMatch(NextLink(), second);

        var passOnly = await client.GetStringAsync("/ui/assessments?verdict=pass&q=POLE+survey&limit=3");
        Assert.Equal(["p22", "p20", "p18"], Rows(passOnly));
        var passNext = WebUtility.HtmlDecode(NextLink().Match(passOnly).Groups[1].Value);
        Assert.Contains("verdict=pass", passNext);
        Assert.Equal(["p16", "p14", "p12"], Rows(await client.GetStringAsync(passNext)));
    }

    [Fact]
    public async Task Bad_parameters_show_a_400_page_naming_them()
    {
        using var factory = new QaServiceFactory();
        var response = await factory.CreateClient().GetAsync("/ui/assessments?limit=500&from=soon");
        Assert.Equal(HttpStatusCode.BadRequest, response.StatusCode);
        var html = await response.Content.ReadAsStringAsync();
        Assert.Contains("<code>limit</code>", html);
        Assert.Contains("<code>from</code>", html);
    }

    [Fact]
    public async Task Delete_posts_a_form_with_its_token_and_leads_back_to_the_same_list()
    {
        using var factory = new QaServiceFactory();
        await ListingScenarios.SeedAsync(factory, Enumerable.Range(0, 3).Select(i => ListingScenarios.Row("local", $"d{i}", T0.AddMinutes(i), $"Valve {i}", "pass")));
        var client = factory.CreateClient(new WebApplicationFactoryClientOptions { AllowAutoRedirect = false });
        var html = await client.GetStringAsync("/ui/assessments?verdict=pass");
        var form = DeleteForm().Match(html);
        Assert.True(form.Success, "no delete form");
        Assert.Equal("d2", form.Groups["id"].Value);

        // Without the token (a page elsewhere posting here): refused, nothing deleted.
        var forged = await client.PostAsync("/ui/assessments/d2/delete", new FormUrlEncodedContent([new("back", "")]));
        Assert.Equal(HttpStatusCode.BadRequest, forged.StatusCode);
        Assert.Contains("d2", Rows(await client.GetStringAsync("/ui/assessments")));

        var fields = new Dictionary<string, string>
        {
            [form.Groups["name"].Value] = WebUtility.HtmlDecode(form.Groups["token"].Value),
            ["back"] = WebUtility.HtmlDecode(form.Groups["back"].Value),
        };
        var posted = await client.PostAsync("/ui/assessments/d2/delete", new FormUrlEncodedContent(fields));
        Assert.Equal(HttpStatusCode.SeeOther, posted.StatusCode);
        Assert.Equal("/ui/assessments?verdict=pass", posted.Headers.Location!.OriginalString);
        Assert.Equal(["d1", "d0"], Rows(await client.GetStringAsync("/ui/assessments")));
        Assert.Equal(HttpStatusCode.NotFound, (await client.GetAsync("/v1/assessments/d2")).StatusCode);

        // The same form again: the report is gone.
        Assert.Equal(HttpStatusCode.NotFound, (await client.PostAsync("/ui/assessments/d2/delete", new FormUrlEncodedContent(fields))).StatusCode);

        // "back" only ever leads to the list itself.
        fields["back"] = "//evil.example/?q=1";
        var elsewhere = await client.PostAsync("/ui/assessments/d1/delete", new FormUrlEncodedContent(fields));
        Assert.Equal(HttpStatusCode.SeeOther, elsewhere.StatusCode);
        Assert.StartsWith("/ui/assessments", elsewhere.Headers.Location!.OriginalString);
    }

    [Fact]
    public async Task Share_posts_a_form_with_its_token_and_shows_a_link_that_opens_without_credentials()
    {
        using var factory = new QaServiceFactory();
        var client = factory.CreateClient(new WebApplicationFactoryClientOptions { AllowAutoRedirect = false });
        var created = await client.PostJsonAsync(Requests.Minimal());
        Assert.Equal(HttpStatusCode.Created, created.StatusCode);
        var id = created.Headers.Location!.OriginalString.Split('/')[^1];
        var form = ShareForm().Match(await client.GetStringAsync("/ui/assessments"));
        Assert.True(form.Success, "no share form");
        Assert.Equal(id, form.Groups["id"].Value);

        // Without the token: refused, no link.
        var forged = await client.PostAsync($"/ui/assessments/{id}/share", new FormUrlEncodedContent([new("x", "")]));
        Assert.Equal(HttpStatusCode.BadRequest, forged.StatusCode);

        var fields = new Dictionary<string, string> { [form.Groups["name"].Value] = WebUtility.HtmlDecode(form.Groups["token"].Value) };
        var shared = await client.PostAsync($"/ui/assessments/{id}/share", new FormUrlEncodedContent(fields));
        var page = await shared.Content.ReadAsStringAsync();
        Assert.Equal(HttpStatusCode.Created, shared.StatusCode);
        var url = ShareUrl().Match(page);
        Assert.True(url.Success, page);
        // A client with no cookies and no key opens it.
        var stranger = factory.CreateClient();
        Assert.Equal(HttpStatusCode.OK, (await stranger.GetAsync(new Uri(WebUtility.HtmlDecode(url.Groups[1].Value)).PathAndQuery)).StatusCode);

        Assert.Equal(HttpStatusCode.NotFound, (await client.PostAsync("/ui/assessments/no-such-report/share", new FormUrlEncodedContent(fields))).StatusCode);
    }

    [GeneratedRegex("action=\"/ui/assessments/(?<id>[^/\"]+)/share\"><input type=\"hidden\" name=\"(?<name>[^\"]+)\" value=\"(?<token>[^\"]+)\">")]
    private static partial Regex ShareForm();

    [GeneratedRegex("id=\"share-url\" readonly size=\"80\" value=\"([^\"]+/shared/[^\"]+)\"")]
    private static partial Regex ShareUrl();

    [Fact]
    public async Task With_keys_required_a_browser_gets_no_list()
    {
        using var host = new KeysHost();
        var response = await host.Client(null).GetAsync("/ui/assessments");
        Assert.Equal(HttpStatusCode.Forbidden, response.StatusCode);
        Assert.Contains("API key", await response.Content.ReadAsStringAsync());
    }

    private static List<string> Rows(string html) => RowLink().Matches(html).Select(m => m.Groups[1].Value).ToList();

    [GeneratedRegex("<th scope=\"row\"><a href=\"/v1/assessments/([^/\"]+)/report.html\">")]
    private static partial Regex RowLink();

    [GeneratedRegex("<a id=\"next-page\" rel=\"next\" href=\"([^\"]+)\">")]
    private static partial Regex NextLink();

    [GeneratedRegex("action=\"/ui/assessments/(?<id>[^/\"]+)/delete\"><input type=\"hidden\" name=\"(?<name>[^\"]+)\" value=\"(?<token>[^\"]+)\"><input type=\"hidden\" name=\"back\" value=\"(?<back>[^\"]*)\">")]
    private static partial Regex DeleteForm();
}
