namespace QaService.Api.Security;

/// <summary>
/// Security headers on every response (OWASP Secure Headers Project, common practice): no MIME
/// sniffing, no framing, no referrer, and a Content-Security-Policy that lets HTML pages use only
/// their own inline styles and SVG. The API explorer (<c>/swagger</c>) loads its scripts from this
/// service and gets a policy that allows them.
/// </summary>
internal sealed class SecurityHeadersMiddleware(RequestDelegate next)
{
    /// <summary>Reports and the landing page: self-contained HTML, inline CSS and SVG, no scripts.</summary>
    public const string PagePolicy = "default-src 'none'; style-src 'unsafe-inline'; img-src data:; base-uri 'none'; form-action 'self'; frame-ancestors 'none'";

    /// <summary>The API explorer: scripts and styles from this origin only.</summary>
    public const string ExplorerPolicy = "default-src 'self'; style-src 'self' 'unsafe-inline'; img-src 'self' data:; base-uri 'none'; frame-ancestors 'none'";

    /// <summary>
    /// <see cref="HttpContext.Items"/> key of a page's own policy (a page with a hashed inline script); such a policy must
    /// add to <see cref="PagePolicy"/>, and gets its frame-ancestors appended here.
    /// </summary>
    public const string PagePolicyItem = "QaService.PagePolicy";

    public Task InvokeAsync(HttpContext context)
    {
        // At response start, so answers written after a Response.Clear (fault handler, timeouts) carry them too.
        context.Response.OnStarting(() =>
        {
            Apply(context);
            return Task.CompletedTask;
        });
        return next(context);
    }

    private static void Apply(HttpContext context)
    {
        var headers = context.Response.Headers;
        headers.XContentTypeOptions = "nosniff";
        headers.XFrameOptions = "DENY";
        headers["Referrer-Policy"] = "no-referrer";
        headers["Cross-Origin-Opener-Policy"] = "same-origin";
        headers.ContentSecurityPolicy = context.Items[PagePolicyItem] is string own ? own + "; frame-ancestors 'none'"
            : context.Request.Path.StartsWithSegments("/swagger") ? ExplorerPolicy : PagePolicy;
        if (context.Request.Path.StartsWithSegments("/v1"))
            headers.CacheControl = "no-store";
    }
}
