using System.Globalization;
using System.Text;
using QaService.Core.SignOff;
using static QaService.Core.Reporting.Html.HtmlText;

namespace QaService.Core.Reporting.Html;

/// <summary>
/// What the report page shows beside the stored report, never inside its JSON: the hash of the stored bytes, the
/// decisions taken on them (oldest first) and, when the page may post, the form that records the next one.
/// </summary>
/// <param name="ReportSha256">Lower-case hex SHA-256 of the bytes <c>GET /v1/assessments/{id}</c> returns.</param>
/// <param name="Decisions">Every decision, oldest first.</param>
/// <param name="Form">The form to record a decision; null shows none.</param>
public sealed record SignOffPanel(string ReportSha256, IReadOnlyList<SignOffDecision> Decisions, DecisionFormFields? Form);

/// <summary>Where the decision form posts and its anti-forgery field (the token is set by the host).</summary>
public sealed record DecisionFormFields(string Action, string TokenFieldName, string Token);

/// <summary>Section 8 of the report page: acceptance state, decisions, hash and the decision form.</summary>
internal static class SignOffSection
{
    public static void Render(StringBuilder html, string reportId, SignOffPanel panel)
    {
        var latest = panel.Decisions.Count == 0 ? null : panel.Decisions[^1];
        html.Append("<section id=\"sign-off\" aria-labelledby=\"sign-off-h\"><h2 id=\"sign-off-h\"><span class=\"num\">8</span> Sign-off</h2>")
            .Append($"<p id=\"acceptance-state\">Acceptance: {StateTag(latest)}")
            .Append(latest is null ? "" : $" by {Escape(latest.By)}, {Time(latest.At)}")
            .Append("</p>")
            .Append($"<p class=\"small\">SHA-256 of this report's JSON (the bytes of <a href=\"{ReportLinks.Json(reportId)}\">GET</a>): <code id=\"report-sha256\">{Escape(panel.ReportSha256)}</code>. ")
            .Append("Each decision quotes the hash of the bytes it was taken on; decisions are kept in order and never edited.</p>");
        if (panel.Decisions.Count == 0)
        {
            html.Append("<p class=\"none\">No decision has been recorded.</p>");
        }
        else
        {
            html.Append("<table id=\"decisions\"><caption>Decisions, oldest first</caption><thead><tr><th scope=\"col\">recorded (UTC)</th><th scope=\"col\">decision</th>")
                .Append("<th scope=\"col\">by</th><th scope=\"col\">comment</th><th scope=\"col\">report SHA-256</th></tr></thead><tbody>");
            foreach (var d in panel.Decisions)
            {
                string hash = d.ReportSha256 == panel.ReportSha256 ? "same as above" : Escape(d.ReportSha256) + " (differs)";
                html.Append($"<tr><td>{Time(d.At)}</td><td>{StateTag(d)}</td><td>{Escape(d.By)}</td><td>{Escape(d.Comment ?? "–")}</td><td class=\"items\">{hash}</td></tr>");
            }

            html.Append("</tbody></table>");
        }

        if (panel.Form is { } form)
            RenderForm(html, form);
        html.Append("</section>");
    }

    /// <summary>A tag for a decision or, without one, for a delivery awaiting it (also used on the project page).</summary>
    internal static string StateTag(SignOffDecision? decision) => DecisionWords.StateOf(decision) switch
    {
        DecisionWords.Accepted => "<span class=\"tag t-pass\">✓ accepted</span>",
        DecisionWords.Rejected => "<span class=\"tag t-fail\">✗ rejected</span>",
        _ => "<span class=\"tag t-none\">… awaiting decision</span>",
    };

    internal static string Time(DateTimeOffset at) => Escape(at.UtcDateTime.ToString("yyyy-MM-dd HH:mm:ss 'UTC'", CultureInfo.InvariantCulture));

    private static void RenderForm(StringBuilder html, DecisionFormFields form)
    {
        html.Append($"<form id=\"decision-form\" class=\"upload no-print\" method=\"post\" action=\"{Escape(form.Action)}\">")
            .Append("<h3>Record a decision</h3>")
            .Append($"<input type=\"hidden\" name=\"{Escape(form.TokenFieldName)}\" value=\"{Escape(form.Token)}\">")
            .Append("<fieldset class=\"choice\"><legend>Decision</legend>")
            .Append("<label><input type=\"radio\" name=\"decision\" value=\"accepted\" required> accept this delivery</label>")
            .Append("<label><input type=\"radio\" name=\"decision\" value=\"rejected\"> reject this delivery</label></fieldset>")
            .Append($"<p><label for=\"decision-by\">By (name or sign)</label><input id=\"decision-by\" name=\"by\" required maxlength=\"{DecisionValidator.MaximumByLength}\" autocomplete=\"name\"></p>")
            .Append($"<p><label for=\"decision-comment\">Comment (optional)</label><textarea id=\"decision-comment\" name=\"comment\" rows=\"3\" maxlength=\"{DecisionValidator.MaximumCommentLength}\"></textarea></p>")
            .Append("<p><button type=\"submit\">Record decision</button></p></form>");
    }
}
