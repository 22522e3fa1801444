using System.Globalization;
using System.Net;
using System.Net.Http.Headers;
using System.Text;
using System.Text.Json.Nodes;
using System.Text.RegularExpressions;
using Microsoft.AspNetCore.Mvc.Testing;

namespace QaService.Api.Tests.Support;

/// <summary>
/// Drives the guided upload's forms as a browser without script would: reads each page's antiforgery token (the
/// cookie travels in the client's cookie container), posts the forms, follows nothing by itself.
/// </summary>
public sealed partial class GuidedUploadClient(HttpClient http)
{
    public HttpClient Http { get; } = http;

    public static GuidedUploadClient For(WebApplicationFactory<Program> factory, string? bearer = null)
    {
        var client = factory.CreateClient(new WebApplicationFactoryClientOptions { AllowAutoRedirect = false });
        if (bearer is not null)
            client.DefaultRequestHeaders.Authorization = new AuthenticationHeaderValue("Bearer", bearer);
        return new GuidedUploadClient(client);
    }

    /// <summary>The settings every test starts from: the demo's (marks UTM 33N, fixes WGS 84 3D, NSSDA 0.10 m / 0.15 m, pairing 1 m).</summary>
    public static Dictionary<string, string> DemoSettings() => new()
    {
        ["title"] = "Guided upload check",
        ["marksCrs"] = "EPSG:32633", ["marksHeights"] = "ellipsoidal",
        ["fixesCrs"] = "EPSG:4979", ["fixesHeights"] = "ellipsoidal",
        ["standard"] = "nssda",
        ["horizontal"] = "10", ["horizontalUnit"] = "cm",
        ["vertical"] = "0.15", ["verticalUnit"] = "m",
        ["pairingRadius"] = "1",
    };

    public async Task<string> TokenOfAsync(string path)
    {
        var page = await (await Http.GetAsync(path)).Content.ReadAsStringAsync();
        return AntiforgeryField().Match(page) is { Success: true } m ? WebUtility.HtmlDecode(m.Groups[1].Value) : throw new InvalidOperationException($"no antiforgery token on {path}: {page[..Math.Min(400, page.Length)]}");
    }

    /// <summary>Posts step one (settings and files, either may be null) with the action button pressed.</summary>
    public async Task<HttpResponseMessage> StageAsync(IDictionary<string, string> fields, byte[]? marks, byte[]? fixes, string action = "preview", string? antiforgery = null)
    {
        antiforgery ??= await TokenOfAsync("/v1/uploads/new");
        using var form = new MultipartFormDataContent { { new StringContent(antiforgery), "__RequestVerificationToken" }, { new StringContent(action), "action" } };
        foreach (var (name, value) in fields)
            form.Add(new StringContent(value), name);
        if (marks is not null)
            form.Add(Uploads.File(marks), "marks", "marks.csv");
        if (fixes is not null)
            form.Add(Uploads.File(fixes), "fixes", "fixes.csv");
        return await Http.PostAsync("/v1/uploads", form);
    }

    /// <summary>Posts the preview's run form with the given column choices (select name → header).</summary>
    public async Task<HttpResponseMessage> RunAsync(string previewPath, IDictionary<string, string> columns)
    {
        var antiforgery = await TokenOfAsync(previewPath);
        var fields = new Dictionary<string, string>(columns) { ["__RequestVerificationToken"] = antiforgery };
        return await Http.PostAsync($"{previewPath}/run", new FormUrlEncodedContent(fields));
    }

    /// <summary>The demo's marks and fixes as CSV; <paramref name="fixesHeader"/> names the fixes' columns (id, mark, lat, lon, h in that order).</summary>
    public static (byte[] Marks, byte[] Fixes) DemoFiles(string fixesHeader = "id,mark,lat,lon,h", Func<int, string, string>? editFixLine = null)
    {
        var request = JsonNode.Parse(File.ReadAllText(DemoPath()))!;
        var marks = new StringBuilder("id,e,n,h\n");
        foreach (var m in request["marks"]!["points"]!.AsArray())
            marks.Append(CultureInfo.InvariantCulture, $"{m!["id"]},{m["e"]},{m["n"]},{m["h"]}\n");
        var fixes = new StringBuilder(fixesHeader + "\n");
        var line = 1;
        foreach (var f in request["fixes"]!["points"]!.AsArray())
        {
            var text = string.Create(CultureInfo.InvariantCulture, $"{f!["id"]},{f["mark"]},{f["lat"]},{f["lon"]},{f["h"]}");
            fixes.Append(editFixLine?.Invoke(++line, text) ?? text).Append('\n');
        }
        return (Encoding.UTF8.GetBytes(marks.ToString()), Encoding.UTF8.GetBytes(fixes.ToString()));
    }

    public static string DemoPath()
    {
        var dir = new DirectoryInfo(AppContext.BaseDirectory);
        while (dir is not null && !File.Exists(Path.Combine(dir.FullName, "QaService.sln")))
            dir = dir.Parent;
        return Path.Combine(dir!.FullName, "src", "QaService.Api", "Demo", "millbrook-ferry-hydrants.json");
    }

    [GeneratedRegex("name=\"__RequestVerificationToken\" value=\"([^\"]+)\"")]
    private static partial Regex AntiforgeryField();
}
