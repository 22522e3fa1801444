using System.Text;
using Microsoft.AspNetCore.Antiforgery;
using QaService.Api.Reports;
using QaService.Api.Security;
using QaService.Core.Reporting.Html;
using static QaService.Core.Reporting.Html.HtmlText;

namespace QaService.Api.Home;

/// <summary>
/// Every state-changing form under <c>/ui</c> proves it came from a page of this service (ASP.NET Core antiforgery:
/// a cookie token and a request token bound to the signed-in tenant). Small forms carry the request token as a hidden
/// field. The multipart upload carries it in its action's query (<see cref="QueryField"/>) because reading a form
/// field would mean buffering the whole upload before the assessment reader streams it; the token is useless without
/// the antiforgery cookie, pages send no Referer (Referrer-Policy: no-referrer) and request logs record the path only.
/// A form without a valid token gets 400 and a page that says what to do.
/// </summary>
internal sealed class UiAntiforgery(bool tokenInQuery) : IEndpointFilter
{
    /// <summary>Name of the hidden field in small forms (ASP.NET Core's default).</summary>
    public const string FormField = "__RequestVerificationToken";

    /// <summary>Query parameter of the upload form's action.</summary>
    public const string QueryField = "af";

    public async ValueTask<object?> InvokeAsync(EndpointFilterInvocationContext context, EndpointFilterDelegate next)
    {
        var http = context.HttpContext;
        var antiforgery = http.RequestServices.GetRequiredService<IAntiforgery>();
        if (tokenInQuery)
        {
            // Never fall back to reading the form: with the token in the header antiforgery does not touch the body.
            if (http.Request.Query[QueryField] is not { Count: 1 } token)
                return Refused();
            http.Request.Headers[PeopleAuthentication.AntiforgeryHeader] = token;
        }
        return await antiforgery.IsRequestValidAsync(http) ? await next(context) : Refused();
    }

    /// <summary>The request token for a form on this response (and the antiforgery cookie it pairs with).</summary>
    public static string Token(HttpContext context) =>
        context.RequestServices.GetRequiredService<IAntiforgery>().GetAndStoreTokens(context).RequestToken!;

    public static string HiddenField(HttpContext context) =>
        $"<input type=\"hidden\" name=\"{FormField}\" value=\"{Escape(Token(context))}\">";

    private static HtmlPage Refused()
    {
        var html = new StringBuilder();
        PageShell.Open(html, "QaService — form not accepted", "The form was not accepted", "QaService");
        html.Append("<p id=\"problem-detail\">The form's security token is missing or no longer valid (it belongs to this service's own page and to your session). Nothing was changed.</p>")
            .Append("<p><a href=\"/\">Open the start page again</a> and send the form from there.</p>");
        PageShell.Close(html, "Nothing was stored.");
        return new HtmlPage(html.ToString(), StatusCodes.Status400BadRequest);
    }
}
