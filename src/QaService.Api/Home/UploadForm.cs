using System.Text;
using System.Text.Json;
using Microsoft.AspNetCore.Http.HttpResults;
using Microsoft.AspNetCore.Mvc;
using QaService.Api.Assessments;
using QaService.Api.Reports;
using QaService.Api.Storage;
using QaService.Core.Assessment;
using QaService.Core.Reporting;
using QaService.Core.Reporting.Html;
using static QaService.Core.Reporting.Html.HtmlText;

namespace QaService.Api.Home;

/// <summary>
/// The browser's post of the upload form: the body is the contract's multipart request, handed unchanged to
/// <see cref="AssessmentsApi.CreateAsync"/>. Success leads (303) to the HTML report; a problem is shown as a page
/// listing each error with its pointer.
/// </summary>
internal static class UploadForm
{
    public const string Path = "/ui/assessments";

    public static async Task<IResult> SubmitAsync(
        HttpRequest request,
        JsonBodyReader<AssessmentRequest> reader,
        IReportStore store,
        TimeProvider clock,
        ILogger<AssessmentRequest> logger,
        CancellationToken cancellationToken)
    {
        // A page on another site must not post here on a visitor's behalf (Fetch Metadata, W3C).
        if (request.Headers["Sec-Fetch-Site"].ToString() is "cross-site")
            return new HtmlPage(ErrorPage(StatusCodes.Status403Forbidden, "Refused", "uploads are accepted only from this service's own form", []), StatusCodes.Status403Forbidden);

        var result = await AssessmentsApi.CreateAsync(request, reader, store, clock, logger, cancellationToken);
        return result switch
        {
            JsonTextResult { StatusCode: StatusCodes.Status201Created, Location: { } location } =>
                new SeeOther($"{location}/report.html"),
            ProblemHttpResult problem => new HtmlPage(ErrorPage(problem.StatusCode, problem.ProblemDetails.Title, problem.ProblemDetails.Detail, Errors(problem.ProblemDetails)), problem.StatusCode),
            _ => result,
        };
    }

    private static IReadOnlyList<(string Pointer, string Message)> Errors(ProblemDetails problem)
    {
        if (!problem.Extensions.TryGetValue("errors", out var errors) || errors is null)
            return [];
        var element = JsonSerializer.SerializeToElement(errors);
        return element.ValueKind != JsonValueKind.Array
            ? []
            : element.EnumerateArray().Select(e => (
                e.TryGetProperty("pointer", out var p) ? p.GetString() ?? "" : "",
                e.TryGetProperty("message", out var m) ? m.GetString() ?? "" : "")).ToList();
    }

    internal static string ErrorPage(int status, string? title, string? detail, IReadOnlyList<(string Pointer, string Message)> errors)
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

        html.Append("<p><a href=\"/\">Back to the form</a> (your browser's back button keeps what you entered).</p>");
        PageShell.Close(html, "Nothing was stored.");
        return html.ToString();
    }

    /// <summary>303 See Other: after a POST, the browser GETs the report (RFC 9110 §15.4.4).</summary>
    private sealed class SeeOther(string location) : IResult
    {
        public Task ExecuteAsync(HttpContext httpContext)
        {
            httpContext.Response.StatusCode = StatusCodes.Status303SeeOther;
            httpContext.Response.Headers.Location = location;
            return Task.CompletedTask;
        }
    }
}
