using System.Text;
using Microsoft.AspNetCore.Authentication;
using Microsoft.Extensions.Options;
using QaService.Api.Reports;
using QaService.Api.Security;
using QaService.Api.Storage;
using QaService.Core.Reporting.Html;
using static QaService.Core.Reporting.Html.HtmlText;

namespace QaService.Api.Home;

/// <summary>
/// Sign-in for people while <c>Auth:Mode</c> is <c>keys</c>: <c>/</c> shows this form to a browser without a session;
/// <c>POST /ui/sign-in</c> checks the tenant's API key as the Bearer path does (SHA-256, constant-time compare) and sets
/// the session cookie (<see cref="PeopleAuthentication"/>); <c>POST /ui/sign-out</c> ends it. Both need the antiforgery token.
/// </summary>
internal static class SignInPage
{
    public const string SignInPath = "/ui/sign-in", SignOutPath = "/ui/sign-out";
    public const string KeyField = "apiKey";

    public static void MapSignIn(this IEndpointRouteBuilder routes)
    {
        routes.MapPost(SignInPath, SignInAsync).AddEndpointFilter(new UiAntiforgery(tokenInQuery: false)).ExcludeFromDescription();
        routes.MapPost(SignOutPath, (Delegate)SignOutAsync).AddEndpointFilter(new UiAntiforgery(tokenInQuery: false)).ExcludeFromDescription();
    }

    /// <summary>The sign-in page; <paramref name="error"/> is shown beside the key field.</summary>
    public static HtmlPage Form(HttpContext context, string? error = null, int status = StatusCodes.Status200OK)
    {
        var html = new StringBuilder();
        PageShell.Open(html, "QaService — sign in", "Sign in to see your team's accuracy tests", "QaService");
        html.Append($"<form id=\"sign-in\" method=\"post\" action=\"{SignInPath}\">").Append(UiAntiforgery.HiddenField(context))
            .Append($"<p><label for=\"{KeyField}\">Your team's API key</label> ")
            .Append($"<input id=\"{KeyField}\" name=\"{KeyField}\" type=\"password\" autocomplete=\"current-password\" required size=\"50\"")
            .Append(error is null ? ">" : $" aria-invalid=\"true\" aria-describedby=\"{KeyField}-error\">")
            .Append(error is null ? "" : $" <strong id=\"{KeyField}-error\" class=\"field-error\" role=\"alert\" style=\"color:#a40000\">{Escape(error)}</strong>")
            .Append("</p><p class=\"small\">The key (qak_…) comes from the service's administrator. The browser keeps a session cookie, not the key.</p>")
            .Append("<p><button type=\"submit\">Sign in</button></p></form>")
            .Append("<p class=\"small\">Programs call <code>/v1</code> with <code>Authorization: Bearer &lt;key&gt;</code>; see the <a href=\"/swagger\">API explorer</a>.</p>");
        PageShell.Close(html, "Reports are statistical accuracy tests of submitted positions, not survey certifications.");
        return new HtmlPage(html.ToString(), status);
    }

    /// <summary>The sign-out button shown on pages of a signed-in browser.</summary>
    public static string SignOutForm(HttpContext context) =>
        $"<form id=\"sign-out\" method=\"post\" action=\"{SignOutPath}\">{UiAntiforgery.HiddenField(context)}<p class=\"small\">Signed in as {Escape(context.User.Identity?.Name)} <button type=\"submit\">Sign out</button></p></form>";

    private static async Task<IResult> SignInAsync(HttpContext context, ITenantStore tenants, IOptions<AuthOptions> auth)
    {
        if (!auth.Value.KeysRequired)
            return Results.NotFound();
        var form = await context.Request.ReadFormAsync(context.RequestAborted);
        var key = form[KeyField].ToString().Trim();
        if (key.Length == 0 || key.Length > ApiKeys.MaximumPresentedLength)
            return Form(context, "Enter your team's API key.", StatusCodes.Status400BadRequest);
        var tenant = await ApiKeys.FindTenantAsync(tenants, key, context.RequestAborted);
        if (tenant is null)
            return Form(context, "This key is not valid. Check that it was copied whole, or ask the administrator for a key.", StatusCodes.Status401Unauthorized);

        await context.SignInAsync(PeopleAuthentication.SessionScheme, PeopleAuthentication.SessionPrincipal(tenant.Id, tenant.Name),
            new AuthenticationProperties { AllowRefresh = true });
        return SeeOther("/");
    }

    private static async Task<IResult> SignOutAsync(HttpContext context)
    {
        await context.SignOutAsync(PeopleAuthentication.SessionScheme);
        return SeeOther("/");
    }

    /// <summary>303 See Other: after a form POST the browser GETs the next page (RFC 9110 §15.4.4).</summary>
    private static IResult SeeOther(string location) => new SeeOtherResult(location);

    private sealed class SeeOtherResult(string location) : IResult
    {
        public Task ExecuteAsync(HttpContext httpContext)
        {
            httpContext.Response.StatusCode = StatusCodes.Status303SeeOther;
            httpContext.Response.Headers.Location = location;
            return Task.CompletedTask;
        }
    }
}
