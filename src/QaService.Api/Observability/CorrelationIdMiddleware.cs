using Serilog.Context;

namespace QaService.Api.Observability;

/// <summary>
/// Gives every request a correlation id: the caller's <c>X-Correlation-Id</c> when it is a short
/// token, otherwise the request's trace identifier. It is echoed in the response header, becomes the
/// <c>traceId</c> of problem bodies and the <c>CorrelationId</c> of every log event of the request.
/// </summary>
internal sealed class CorrelationIdMiddleware(RequestDelegate next)
{
    public const string HeaderName = "X-Correlation-Id";

    /// <summary>Longest id taken from a caller; longer or odd ones are replaced, so logs cannot be flooded or forged.</summary>
    private const int MaximumLength = 64;

    public async Task InvokeAsync(HttpContext context)
    {
        var given = context.Request.Headers[HeaderName].ToString();
        var id = IsAcceptable(given) ? given : context.TraceIdentifier;
        context.TraceIdentifier = id;
        // At response start, so answers written after a Response.Clear (fault handler, timeouts) carry it too.
        context.Response.OnStarting(() =>
        {
            context.Response.Headers[HeaderName] = id;
            return Task.CompletedTask;
        });
        using (LogContext.PushProperty("CorrelationId", id))
            await next(context);
    }

    private static bool IsAcceptable(string id) =>
        id.Length is > 0 and <= MaximumLength && id.All(c => char.IsAsciiLetterOrDigit(c) || c is '-' or '_' or '.' or ':');
}
