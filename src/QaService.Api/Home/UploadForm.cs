using System.Text;
using System.Text.Json;
using QaService.Api.Reports;
using QaService.Api.Security;
using QaService.Core.Reporting.Html;
using static QaService.Core.Reporting.Html.HtmlText;

namespace QaService.Api.Home;

/// <summary>
/// The browser's post of the upload form. Its body already is the contract's multipart request (parts
/// <c>options</c>, <c>marks</c>, <c>fixes</c>), so it is handed unchanged to the <c>CreateAssessment</c> endpoint,
/// whatever that endpoint's reading and validation do. A 201 leads (303 See Other) to the HTML report; a problem is
/// shown as a page listing each error with its pointer.
/// </summary>
internal static class UploadForm
{
    public const string Path = "/ui/assessments";


    /// <summary>Endpoint name of POST /v1/assessments.</summary>
    private const string CreateEndpointName = "CreateAssessment";

    public static async Task SubmitAsync(HttpContext context, EndpointDataSource endpoints)
    {
        // A page on another site must not post here on a visitor's behalf (W3C Fetch Metadata Request Headers).
        if (context.Request.Headers["Sec-Fetch-Site"].ToString() is "cross-site")
        {
            await new HtmlPage(ErrorPage(StatusCodes.Status403Forbidden, "Refused", "uploads are accepted only from this service's own form", []), StatusCodes.Status403Forbidden).ExecuteAsync(context);
            return;
        }

        if (context.Features.Get<TenantFeature>() is null)
        {
            await new HtmlPage(ErrorPage(StatusCodes.Status403Forbidden, "Sign in first",
                "this service requires API keys (Auth:Mode keys): sign in with your team's key on the start page, or post to /v1/assessments with the key", []), StatusCodes.Status403Forbidden).ExecuteAsync(context);
            return;
        }

        var create = endpoints.Endpoints.OfType<RouteEndpoint>()
            .First(e => e.Metadata.GetMetadata<IEndpointNameMetadata>()?.EndpointName == CreateEndpointName);

        var original = context.Response.Body;
        using var captured = new MemoryStream();
        context.Response.Body = captured;
        try
        {
            await create.RequestDelegate!(context);
        }
        finally
        {
            context.Response.Body = original;
        }

        var status = context.Response.StatusCode;
        if (status == StatusCodes.Status201Created && context.Response.Headers.Location.ToString() is { Length: > 0 } location)
        {
            context.Response.Clear();
            context.Response.StatusCode = StatusCodes.Status303SeeOther;
            context.Response.Headers.Location = $"{location}/report.html";
            return;
        }

        var (title, detail, errors) = ReadProblem(captured.ToArray());
        context.Response.Clear();
        await new HtmlPage(ErrorPage(status, title, detail, errors), status).ExecuteAsync(context);
    }

    /// <summary>Title, detail and errors of an RFC 9457 problem body (empty when the body is something else).</summary>
    private static (string? Title, string? Detail, IReadOnlyList<(string Pointer, string Message)> Errors) ReadProblem(byte[] body)
    {
        try
        {
            var root = JsonDocument.Parse(body).RootElement;
            string? Text(string name) => root.TryGetProperty(name, out var v) && v.ValueKind == JsonValueKind.String ? v.GetString() : null;
            var errors = root.TryGetProperty("errors", out var list) && list.ValueKind == JsonValueKind.Array
                ? list.EnumerateArray().Select(e => (
                    e.TryGetProperty("pointer", out var p) ? p.GetString() ?? "" : "",
                    e.TryGetProperty("message", out var m) ? m.GetString() ?? "" : "")).ToList()
                : [];
            return (Text("title"), Text("detail"), errors);
        }
        catch (JsonException)
        {
            return ("The upload could not be processed", null, []);
        }
    }

    internal static string ErrorPage(int status, string? title, string? detail, IReadOnlyList<(string Pointer, string Message)> errors,
        string backHref = "/", string backText = "Back to the form")
    {
        var html = new StringBuilder();
        PageShell.Open(html, "QaService — upload not accepted", "The upload was not accepted", "QaService");
        html.Append($"<div class=\"verdict v-fail\"><p class=\"verdict-word\">{status}</p><p class=\"verdict-gloss\">{Escape(title)}</p></div>")
            .Append($"<p id=\"problem-detail\">{Escape(detail)}</p>");
        if (errors.Count > 0)
        {
            html.Append("<table id=\"problem-errors\"><caption>What to fix</caption><thead><tr><th scope=\"col\">where</th><th scope=\"col\">problem</th></tr></thead><tbody>");
            foreach (var (pointer, message) in errors)
                html.Append($"<tr><th scope=\"row\"><code>{Escape(pointer.Length == 0 ? "(the request)" : pointer)}</code></th><td>{Escape(message)}</td></tr>");
            html.Append("</tbody></table>");
        }

        html.Append($"<p><a href=\"{Escape(backHref)}\">{Escape(backText)}</a> (your browser's back button keeps what you entered).</p>");
        PageShell.Close(html, "Nothing was stored.");
        return html.ToString();
    }
}
