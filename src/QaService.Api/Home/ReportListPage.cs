using System.Globalization;
using System.Text;
using Microsoft.AspNetCore.Antiforgery;
using Microsoft.AspNetCore.WebUtilities;
using Microsoft.Extensions.Options;
using QaService.Api.Assessments;
using QaService.Api.Reports;
using QaService.Api.Security;
using QaService.Api.Storage;
using QaService.Core.Assessment;
using QaService.Core.Reporting.Html;
using static QaService.Core.Reporting.Html.HtmlText;

namespace QaService.Api.Home;

/// <summary>
/// The tenant's reports as a page for people: the API list's filters as a GET form, a "next page" link, and a delete
/// button per row (a POST form with an antiforgery token, answered 303 back to the same list). Server-rendered, no script.
/// </summary>
internal static class ReportListPage
{
    public const string Path = "/ui/assessments";

    /// <summary>The list page's query string (filters and cursor) travels with each delete form, so the answer leads back there.</summary>
    private const string BackField = "back";

    public static void MapListPage(this IEndpointRouteBuilder routes)
    {
        routes.MapGet(Path, Show).ExcludeFromDescription();
        routes.MapPost(Path + "/{id}/delete", DeleteAsync).ExcludeFromDescription();
        routes.MapPost(Path + "/{id}/share", ShareAsync).ExcludeFromDescription();
    }

    /// <summary>How long a link made from the list page stays open, hours (the API takes any length up to Auth:ShareLinkMaxHours).</summary>
    private const double ShareHours = 72;

    /// <summary>A share link made by a person: the same link as POST /v1/assessments/{id}/share-links, shown on a page to copy.</summary>
    private static async Task<IResult> ShareAsync(string id, HttpContext context, IAntiforgery antiforgery, Sharing.ShareLinkSigning signing,
        IShareLinkStore links, TimeProvider clock, IOptions<AuthOptions> auth, CancellationToken cancellationToken)
    {
        if (context.Features.Get<TenantFeature>() is not { } tenant)
            return Message(StatusCodes.Status403Forbidden, "Sign in first", "sign in with your team's key on the start page to share a report");
        if (!await antiforgery.IsRequestValidAsync(context))
            return Message(StatusCodes.Status400BadRequest, "No link made",
                "the form was stale or did not come from this service's list page; open the list again and retry");
        var hours = Math.Min(ShareHours, auth.Value.ShareLinkMaxHours);
        var created = ReportIds.IsPlausible(id)
            ? await Sharing.ShareLinksApi.IssueAsync(tenant.TenantId, id, hours, context.Request, links, signing, clock, cancellationToken)
            : null;
        if (created is null)
            return Message(StatusCodes.Status404NotFound, "Not found", "there is no such assessment (it may have been deleted)");
        var html = new StringBuilder();
        PageShell.Open(html, "QaService — share link", "Share link made", "QaService");
        html.Append("<p>Anyone with this link can open the report page, its CSV and its GeoJSON, without a key, until ")
            .Append($"<time datetime=\"{Escape(created.ExpiresAt.ToString("O", CultureInfo.InvariantCulture))}\">{Escape(created.ExpiresAt.UtcDateTime.ToString("yyyy-MM-dd HH:mm", CultureInfo.InvariantCulture))} UTC</time>.</p>")
            .Append($"<p><label for=\"share-url\">Link</label> <input id=\"share-url\" readonly size=\"80\" value=\"{Escape(created.Url)}\"></p>")
            .Append($"<p>To end it early: <code>DELETE /v1/assessments/{Escape(id)}/share-links/{Escape(created.Id)}</code> with your key.</p>")
            .Append($"<p><a href=\"{Path}\">Back to the list</a> · <a href=\"/\">Home</a></p>");
        PageShell.Close(html, "The link is the permission: send it only to people who may see this report.");
        return new HtmlPage(html.ToString(), StatusCodes.Status201Created);
    }

    private static async Task<IResult> Show(HttpContext context, IReportStore store, IAntiforgery antiforgery, CancellationToken cancellationToken)
    {
        // With API keys required a browser is nobody's tenant (as on the home page).
        if (context.Features.Get<TenantFeature>() is not { } tenant)
            return Message(StatusCodes.Status403Forbidden, "Sign in first",
                "this service requires API keys (Auth:Mode keys): sign in with your team's key on the start page, or use GET /v1/assessments with the key");

        var query = context.Request.Query;
        var (list, errors) = ListingParameters.Read(tenant.TenantId, name => query.TryGetValue(name, out var value) ? value[0] : null);
        var html = new StringBuilder();
        PageShell.Open(html, "QaService — assessments", "Stored assessments", "QaService");
        html.Append("<p><a href=\"/\">Home</a> · newest first; filters apply together.</p>");
        AppendFilters(html, name => query.TryGetValue(name, out var value) ? value[0] : null);
        if (list is null)
        {
            AppendErrors(html, errors);
            PageShell.Close(html, "Nothing was listed.");
            return new HtmlPage(html.ToString(), StatusCodes.Status400BadRequest);
        }

        var page = await store.ListAsync(list, cancellationToken);
        var token = antiforgery.GetAndStoreTokens(context);
        AppendTable(html, page, list.After is not null, context.Request.QueryString.Value ?? "", token);
        AppendPaging(html, list, page);
        PageShell.Close(html, "Deleting a report removes its JSON, page and exports for good.");
        return new HtmlPage(html.ToString());
    }

    private static async Task<IResult> DeleteAsync(string id, HttpContext context, IReportStore store, IAntiforgery antiforgery, CancellationToken cancellationToken)
    {
        if (context.Features.Get<TenantFeature>() is not { } tenant)
            return Message(StatusCodes.Status403Forbidden, "Sign in first",
                "this service requires API keys (Auth:Mode keys): sign in with your team's key on the start page, or use DELETE /v1/assessments/{id} with the key");
        // The token from the list page's form and its cookie (ASP.NET Core antiforgery): another site cannot post here.
        if (!await antiforgery.IsRequestValidAsync(context))
            return Message(StatusCodes.Status400BadRequest, "Not deleted",
                "the form was stale or did not come from this service's list page; open the list again and retry");

        var form = await context.Request.ReadFormAsync(cancellationToken);
        if (!ReportIds.IsPlausible(id) || !await store.DeleteAsync(tenant.TenantId, id, cancellationToken))
            return Message(StatusCodes.Status404NotFound, "Not found", "there is no such assessment (it may have been deleted already)");
        context.Response.Headers.Location = Path + ListQuery(form[BackField].ToString());
        return TypedResults.StatusCode(StatusCodes.Status303SeeOther);
    }

    /// <summary>The list's own parameters from a posted query string, re-encoded (never a redirect elsewhere).</summary>
    private static string ListQuery(string back)
    {
        var parsed = QueryHelpers.ParseQuery(back.StartsWith('?') ? back : "?" + back);
        var kept = ListingParameters.Names.Where(parsed.ContainsKey)
            .Select(name => new KeyValuePair<string, string?>(name, parsed[name][0]));
        return QueryString.Create(kept).Value ?? "";
    }

    private static void AppendFilters(StringBuilder html, Func<string, string?> value)
    {
        string Field(string name) => Escape(value(name));
        var verdict = value("verdict");
        html.Append($"<form id=\"filters\" class=\"upload\" method=\"get\" action=\"{Path}\" aria-label=\"Filter the list\">")
            .Append("<p><label for=\"q\">Title contains</label><input id=\"q\" name=\"q\" type=\"search\" value=\"").Append(Field("q")).Append("\"></p>")
            .Append("<p><label for=\"verdict\">Verdict</label><select id=\"verdict\" name=\"verdict\"><option value=\"\">any</option>");
        foreach (var v in ListingParameters.Verdicts)
            html.Append($"<option{(string.Equals(v, verdict, StringComparison.OrdinalIgnoreCase) ? " selected" : "")}>{v}</option>");
        html.Append("</select></p>")
            .Append("<p><label for=\"from\">Made from (inclusive, RFC 3339, e.g. 2026-05-01T00:00:00Z)</label><input id=\"from\" name=\"from\" value=\"").Append(Field("from")).Append("\"></p>")
            .Append("<p><label for=\"to\">Made before (exclusive)</label><input id=\"to\" name=\"to\" value=\"").Append(Field("to")).Append("\"></p>")
            .Append(string.Create(CultureInfo.InvariantCulture, $"<p><label for=\"limit\">Per page (1–{ListingParameters.MaximumLimit})</label><input id=\"limit\" name=\"limit\" inputmode=\"numeric\" value=\""))
            .Append(Field("limit")).Append("\"></p>")
            .Append("<p><button type=\"submit\">Show</button></p></form>");
    }

    private static void AppendErrors(StringBuilder html, IReadOnlyList<InputError> errors)
    {
        html.Append("<div role=\"alert\"><table id=\"problem-errors\"><caption>What to fix</caption><thead><tr><th scope=\"col\">parameter</th><th scope=\"col\">problem</th></tr></thead><tbody>");
        foreach (var error in errors)
            html.Append($"<tr><th scope=\"row\"><code>{Escape(error.Pointer.TrimStart('/'))}</code></th><td>{Escape(error.Message)}</td></tr>");
        html.Append("</tbody></table></div>");
    }

    private static void AppendTable(StringBuilder html, ReportSummaryPage page, bool laterPage, string listQuery, AntiforgeryTokenSet token)
    {
        if (page.Items.Count == 0)
        {
            html.Append($"<p class=\"none\" id=\"empty\">{(laterPage ? "No more assessments." : "No assessments match.")}</p>");
            return;
        }
        html.Append("<table id=\"assessments\"><caption>Assessments, newest first</caption><thead><tr><th scope=\"col\">made (UTC)</th><th scope=\"col\">title</th>")
            .Append("<th scope=\"col\">verdict</th><th scope=\"col\">views</th><th scope=\"col\">share</th><th scope=\"col\">delete</th></tr></thead><tbody>");
        foreach (var r in page.Items)
        {
            var title = string.IsNullOrWhiteSpace(r.Title) ? "(untitled)" : r.Title;
            var tag = r.Verdict switch { "pass" => "t-pass", "fail" => "t-fail", _ => "t-warn" };
            html.Append($"<tr><td class=\"n\">{Escape(r.CreatedAt.UtcDateTime.ToString("yyyy-MM-dd HH:mm:ss", CultureInfo.InvariantCulture))}</td>")
                .Append($"<th scope=\"row\"><a href=\"{ReportLinks.Page(r.Id)}\">{Escape(title)}</a></th>")
                .Append($"<td><span class=\"tag {tag}\">{Escape(r.Verdict)}</span></td>")
                .Append($"<td><a href=\"{ReportLinks.Json(r.Id)}\">JSON</a> · <a href=\"{ReportLinks.Csv(r.Id)}\">CSV</a> · <a href=\"{ReportLinks.GeoJson(r.Id)}\">GeoJSON</a></td>")
                .Append($"<td><form class=\"upload\" method=\"post\" action=\"{Path}/{Escape(Uri.EscapeDataString(r.Id))}/share\">")
                .Append($"<input type=\"hidden\" name=\"{Escape(token.FormFieldName)}\" value=\"{Escape(token.RequestToken)}\">")
                .Append($"<button type=\"submit\" aria-label=\"Share {Escape(title)} for {ShareHours.ToString(CultureInfo.InvariantCulture)} hours\">Share link</button></form></td>")
                .Append($"<td><form class=\"upload\" method=\"post\" action=\"{Path}/{Escape(Uri.EscapeDataString(r.Id))}/delete\">")
                .Append($"<input type=\"hidden\" name=\"{Escape(token.FormFieldName)}\" value=\"{Escape(token.RequestToken)}\">")
                .Append($"<input type=\"hidden\" name=\"{BackField}\" value=\"{Escape(listQuery)}\">")
                .Append($"<button type=\"submit\" aria-label=\"Delete {Escape(title)}\">Delete</button></form></td></tr>");
        }
        html.Append("</tbody></table>");
    }

    private static void AppendPaging(StringBuilder html, ReportListQuery list, ReportSummaryPage page)
    {
        var filters = new List<KeyValuePair<string, string?>>();
        void Keep(string name, string? value)
        {
            if (value is not null)
                filters.Add(new(name, value));
        }
        Keep("verdict", list.Verdict);
        Keep("q", list.TitleContains);
        Keep("from", list.From?.ToString("O", CultureInfo.InvariantCulture));
        Keep("to", list.To?.ToString("O", CultureInfo.InvariantCulture));
        Keep("limit", list.Limit == ListingParameters.DefaultLimit ? null : list.Limit.ToString(CultureInfo.InvariantCulture));
        var links = new List<string>();
        if (list.After is not null)
            links.Add($"<a id=\"first-page\" href=\"{Escape(Path + QueryString.Create(filters).Value)}\">First page</a>");
        if (page.Next is { } next)
            links.Add($"<a id=\"next-page\" rel=\"next\" href=\"{Escape(Path + QueryString.Create(filters.Append(new("cursor", next.Encode()))).Value)}\">Next page</a>");
        if (links.Count > 0)
            html.Append("<nav aria-label=\"Pages\"><p>").Append(string.Join(" · ", links)).Append("</p></nav>");
    }

    private static HtmlPage Message(int status, string title, string detail)
    {
        var html = new StringBuilder();
        PageShell.Open(html, "QaService — " + title, title, "QaService");
        html.Append($"<p id=\"problem-detail\">{Escape(detail)}</p><p><a href=\"{Path}\">Back to the list</a> · <a href=\"/\">Home</a></p>");
        PageShell.Close(html, "");
        return new HtmlPage(html.ToString(), status);
    }
}
