namespace QaService.Api.Problems;

/// <summary>A detail a person can act on for the problems the framework raises itself (no route, wrong method…).</summary>
internal static class DefaultProblemDetail
{
    public static string For(HttpContext context)
    {
        var request = context.Request;
        return context.Response.StatusCode switch
        {
            StatusCodes.Status404NotFound => $"nothing is served at {request.Path}; the API is under /v1 (see /openapi/v1.json)",
            StatusCodes.Status405MethodNotAllowed => $"{request.Method} is not allowed on {request.Path}; see /openapi/v1.json for the methods each path takes",
            StatusCodes.Status415UnsupportedMediaType => "send the request body as application/json",
            StatusCodes.Status400BadRequest => "the request could not be read",
            _ => "see the status code; the traceId identifies this request in the service's logs",
        };
    }
}
