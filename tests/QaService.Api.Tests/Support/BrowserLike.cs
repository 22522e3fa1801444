using System.Net;
using System.Text.RegularExpressions;
using Microsoft.AspNetCore.Mvc.Testing;

namespace QaService.Api.Tests.Support;

/// <summary>A client that behaves like a browser for the /ui pages: keeps cookies, does not follow redirects, reads form tokens.</summary>
public static partial class BrowserLike
{
    public const string TokenField = "__RequestVerificationToken";

    public static HttpClient Client(WebApplicationFactory<Program> factory, string baseAddress = "http://localhost") =>
        factory.CreateClient(new WebApplicationFactoryClientOptions { HandleCookies = true, AllowAutoRedirect = false, BaseAddress = new Uri(baseAddress) });

    /// <summary>The first hidden antiforgery field's value on the page (sign-in or sign-out form).</summary>
    public static string FormToken(string html) =>
        WebUtility.HtmlDecode(HiddenToken().Match(html) is { Success: true } m ? m.Groups[1].Value : throw new Xunit.Sdk.XunitException("no antiforgery field on the page"));

    /// <summary>The upload form's token from its action's query.</summary>
    public static string UploadToken(string html) =>
        Uri.UnescapeDataString(WebUtility.HtmlDecode(UploadAction().Match(html) is { Success: true } m ? m.Groups[1].Value : throw new Xunit.Sdk.XunitException("no upload form on the page")));

    /// <summary>GET / then POST /ui/sign-in with the page's token and the key.</summary>
    public static async Task<HttpResponseMessage> SignInAsync(HttpClient client, string key)
    {
        var page = await client.GetStringAsync("/");
        return await client.PostAsync("/ui/sign-in", new FormUrlEncodedContent(new Dictionary<string, string> { [TokenField] = FormToken(page), ["apiKey"] = key }));
    }

    [GeneratedRegex("name=\"__RequestVerificationToken\" value=\"([^\"]+)\"")]
    private static partial Regex HiddenToken();

    [GeneratedRegex("action=\"/ui/assessments\\?af=([^\"]+)\"")]
    private static partial Regex UploadAction();
}
