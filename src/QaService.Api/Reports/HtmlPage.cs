namespace QaService.Api.Reports;

/// <summary>
/// An HTML page. Its Content-Security-Policy, nosniff, no-referrer and no-framing headers come from
/// <see cref="Security.SecurityHeadersMiddleware"/> (every response); the page repeats the policy in a meta element.
/// </summary>
internal sealed class HtmlPage(string html, int statusCode = StatusCodes.Status200OK) : IResult
{
    public Task ExecuteAsync(HttpContext httpContext)
    {
        var response = httpContext.Response;
        response.StatusCode = statusCode;
        response.ContentType = "text/html; charset=utf-8";
        response.Headers.CacheControl = "no-store";
        return response.WriteAsync(html);
    }
}

/// <summary>A download (CSV, GeoJSON) with a file name, never sniffed into something else.</summary>
internal sealed class DownloadResult(string content, string mediaType, string fileName) : IResult
{
    public Task ExecuteAsync(HttpContext httpContext)
    {
        var response = httpContext.Response;
        response.ContentType = mediaType;
        response.Headers.XContentTypeOptions = "nosniff";
        response.Headers.ContentDisposition = $"attachment; filename=\"{fileName}\"";
        return response.WriteAsync(content);
    }
}
