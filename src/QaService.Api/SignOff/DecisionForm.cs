using System.Text;
using Microsoft.AspNetCore.Antiforgery;
using QaService.Api.Reports;
using QaService.Api.Security;
using QaService.Core.Assessment;
using QaService.Core.Reporting.Html;
using QaService.Core.SignOff;
using static QaService.Core.Reporting.Html.HtmlText;

namespace QaService.Api.SignOff;

/// <summary>
/// The report page's decision form (<c>POST /ui/assessments/{id}/decisions</c>, urlencoded, ASP.NET Core antiforgery
/// token): records through the same <see cref="DecisionRecording"/> as the API and answers <c>303</c> back to the page,
/// or a page listing what to fix.
/// </summary>
internal static class DecisionForm
{
    public static string PathOf(string reportId) => $"/ui/assessments/{Uri.EscapeDataString(reportId)}/decisions";

    public static void Map(IEndpointRouteBuilder routes) =>
        routes.MapPost("/ui/assessments/{id}/decisions", SubmitAsync).ExcludeFromDescription();

    private static async Task<IResult> SubmitAsync(string id, HttpContext context, IAntiforgery antiforgery, DecisionRecording recording, CancellationToken cancellationToken)
    {
        // A page on another site must not post here on a visitor's behalf (W3C Fetch Metadata Request Headers).
        if (context.Request.Headers["Sec-Fetch-Site"].ToString() is "cross-site")
            return Page(StatusCodes.Status403Forbidden, "Refused", "decisions are accepted only from this service's own report page", [], id);
        if (context.Features.Get<TenantFeature>() is not { } tenant)
            return Page(StatusCodes.Status403Forbidden, "Decisions need an API key",
                "this service requires API keys (Auth:Mode keys): record the decision with POST /v1/assessments/{id}/decisions and your key", [], id);
        if (!context.Request.HasFormContentType)
            return Page(StatusCodes.Status415UnsupportedMediaType, "Not a form", "post the report page's decision form", [], id);
        try
        {
            await antiforgery.ValidateRequestAsync(context);
        }
        catch (AntiforgeryValidationException)
        {
            return Page(StatusCodes.Status400BadRequest, "The form has expired", "reload the report page and record the decision again", [], id);
        }

        var form = await context.Request.ReadFormAsync(cancellationToken);
        string? Field(string name) => form.TryGetValue(name, out var value) ? value.ToString() : null;
        var outcome = await recording.RecordAsync(tenant.TenantId, id, new DecisionRequest(Field("decision"), Field("by"), Field("comment")), cancellationToken);
        if (outcome.NotFound)
            return Page(StatusCodes.Status404NotFound, "Assessment not found", "there is no such assessment (or it was deleted)", [], null);
        if (outcome.Recorded is null)
            return Page(StatusCodes.Status400BadRequest, "The decision was not recorded", "fix these fields and send the form again", outcome.Errors, id);
        context.Response.Headers.Location = $"/v1/assessments/{Uri.EscapeDataString(id)}/report.html#sign-off";
        return Results.StatusCode(StatusCodes.Status303SeeOther);
    }

    private static HtmlPage Page(int status, string title, string detail, IReadOnlyList<InputError> errors, string? reportId)
    {
        var html = new StringBuilder();
        PageShell.Open(html, "QaService — decision not recorded", "The decision was not recorded", "QaService");
        html.Append($"<div class=\"verdict v-fail\"><p class=\"verdict-word\">{status}</p><p class=\"verdict-gloss\">{Escape(title)}</p></div>")
            .Append($"<p id=\"problem-detail\">{Escape(detail)}</p>");
        if (errors.Count > 0)
        {
            html.Append("<table id=\"problem-errors\"><caption>What to fix</caption><thead><tr><th scope=\"col\">field</th><th scope=\"col\">problem</th></tr></thead><tbody>");
            foreach (var error in errors)
                html.Append($"<tr><th scope=\"row\"><code>{Escape(error.Pointer.TrimStart('/'))}</code></th><td>{Escape(error.Message)}</td></tr>");
            html.Append("</tbody></table>");
        }

        html.Append(reportId is null ? "<p><a href=\"/\">All assessments</a></p>" : $"<p><a href=\"{ReportLinks.Page(reportId)}#sign-off\">Back to the report</a></p>");
        PageShell.Close(html, "Nothing was recorded.");
        return new HtmlPage(html.ToString(), status);
    }
}
