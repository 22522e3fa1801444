using Microsoft.Net.Http.Headers;
using QaService.Api.Security;
using QaService.Api.Storage;

namespace QaService.Api.Reports;

/// <summary>
/// <c>GET /v1/assessments/{id}</c> answers with the HTML page when the client prefers <c>text/html</c> to JSON
/// (a browser); API clients (<c>application/json</c>, <c>*/*</c> or no Accept) keep the stored JSON.
/// </summary>
internal sealed class HtmlNegotiation : IEndpointFilter
{
    public async ValueTask<object?> InvokeAsync(EndpointFilterInvocationContext context, EndpointFilterDelegate next)
    {
        var http = context.HttpContext;
        if (!PrefersHtml(http.Request.Headers.Accept) || http.Request.RouteValues["id"] is not string id)
            return await next(context);
        var services = http.RequestServices;
        return await ReportsApi.HtmlAsync(id, http, services.GetRequiredService<IReportStore>(), services.GetRequiredService<ITenantContext>(), http.RequestAborted);
    }

    /// <summary>True when text/html is listed with a higher quality than application/json (RFC 9110 §12.5.1).</summary>
    internal static bool PrefersHtml(IEnumerable<string?> accept)
    {
        if (!MediaTypeHeaderValue.TryParseList(accept.OfType<string>().ToList(), out var types))
            return false;
        double html = Quality(types, "text/html"), json = Quality(types, "application/json");
        return html > 0 && html > json;
    }

    private static double Quality(IList<MediaTypeHeaderValue> types, string mediaType) =>
        types.Where(t => t.MediaType.Equals(mediaType, StringComparison.OrdinalIgnoreCase))
            .Select(t => t.Quality ?? 1.0)
            .DefaultIfEmpty(0.0)
            .Max();
}
