using QaService.Core.Reporting.Html;

namespace QaService.Api.Reports;

/// <summary>An HTML response with the house security headers: nothing may load, run or frame it.</summary>
internal sealed class HtmlPage(string html, int statusCode = StatusCodes.Status200OK) : IResult
{
    public Task ExecuteAsync(HttpContext httpContext)
    {
        var response = httpContext.Response;
        response.StatusCode = statusCode;
        response.ContentType = "text/html; charset=utf-8";
        ApplySecurityHeaders(response.Headers);
        return response.WriteAsync(html);
    }

    /// <summary>CSP (scripts and every external load blocked), no MIME sniffing, no referrer, no framing.</summary>
    public static void ApplySecurityHeaders(IHeaderDictionary headers)
    {
        headers.ContentSecurityPolicy = PageShell.ContentSecurityPolicyHeader;
        headers.XContentTypeOptions = "nosniff";
        headers.XFrameOptions = "DENY";
        headers["Referrer-Policy"] = "no-referrer";
        headers.CacheControl = "no-store";
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
