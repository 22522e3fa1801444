using System.Globalization;
using System.Text;
using QaService.Core.Projects;
using QaService.Core.SignOff;
using static QaService.Core.Reporting.Html.HtmlText;

namespace QaService.Core.Reporting.Html;

/// <summary>A project as the page shows it: its spec and its deliveries in creation order.</summary>
/// <param name="Id">Project id.</param>
/// <param name="Name">Project name.</param>
/// <param name="CreatedAt">When the project was made.</param>
/// <param name="SpecJson">The project's spec as stored (the JSON the client sent).</param>
/// <param name="Standard">spec.standard (nssda when absent).</param>
/// <param name="Horizontal">spec.horizontal, metres, in the standard's measure.</param>
/// <param name="Vertical">spec.vertical, metres, in the standard's measure.</param>
/// <param name="Deliveries">The project's assessments, oldest first.</param>
public sealed record ProjectPageModel(string Id, string Name, DateTimeOffset CreatedAt, string SpecJson, string Standard, double? Horizontal, double? Vertical,
    IReadOnlyList<ProjectDelivery> Deliveries);

/// <summary>One delivery (assessment) of a project.</summary>
/// <param name="Id">Assessment id.</param>
/// <param name="CreatedAt">When it was assessed.</param>
/// <param name="Title">Its title.</param>
/// <param name="Verdict">pass, fail or inconclusive.</param>
/// <param name="Latest">Its latest decision; null while it awaits one.</param>
/// <param name="Figures">Its headline figures.</param>
public sealed record ProjectDelivery(string Id, DateTimeOffset CreatedAt, string? Title, string Verdict, SignOffDecision? Latest, DeliveryFigures Figures);

/// <summary>
/// A project's page: the acceptance state of every delivery and the trend of their figures (inline SVG with the same
/// numbers in a table), self-contained like the report page. Lays out stored figures; computes none.
/// </summary>
public static class ProjectPage
{
    public static string Render(ProjectPageModel project)
    {
        var html = new StringBuilder(16 * 1024);
        PageShell.Open(html, $"{project.Name} — project deliveries", project.Name, "QaService · project deliveries");
        string json = Escape($"/v1/projects/{Uri.EscapeDataString(project.Id)}");
        html.Append($"<p class=\"meta\">Project <code>{Escape(project.Id)}</code> · made {Escape(project.CreatedAt.UtcDateTime.ToString("yyyy-MM-dd HH:mm 'UTC'", CultureInfo.InvariantCulture))}")
            .Append($" · <a class=\"no-print\" href=\"{json}\">JSON</a> <a class=\"no-print\" href=\"/\">all assessments</a></p>");

        RenderSpec(html, project);
        RenderDeliveries(html, project.Deliveries);
        RenderTrend(html, project);

        PageShell.Close(html, $"Project {Escape(project.Id)}. Each delivery's figures are those of its own stored report; acceptance is the latest decision recorded on it.");
        return html.ToString();
    }

    private static void RenderSpec(StringBuilder html, ProjectPageModel project)
    {
        html.Append("<section id=\"project-spec\" aria-labelledby=\"spec-h\"><h2 id=\"spec-h\"><span class=\"num\">1</span> The contract's spec</h2>")
            .Append($"<p>Standard <code>{Escape(project.Standard)}</code>; horizontal {Requirement(project.Horizontal)}, vertical {Requirement(project.Vertical)}. ")
            .Append("Applied to every delivery that names this project and brings no spec of its own.</p>")
            .Append($"<p class=\"small\">As stored: <code id=\"spec-json\">{Escape(project.SpecJson)}</code></p></section>");
    }

    private static string Requirement(double? metres) => metres is { } m ? $"{Metres(m)} m" : "not required";

    private static void RenderDeliveries(StringBuilder html, IReadOnlyList<ProjectDelivery> deliveries)
    {
        int accepted = deliveries.Count(d => d.Latest?.Decision == DecisionWords.Accepted);
        int rejected = deliveries.Count(d => d.Latest?.Decision == DecisionWords.Rejected);
        html.Append("<section id=\"deliveries\" aria-labelledby=\"deliveries-h\"><h2 id=\"deliveries-h\"><span class=\"num\">2</span> Deliveries and their acceptance</h2>")
            .Append($"<dl class=\"counts\"><div><dt>deliveries</dt><dd>{deliveries.Count}</dd></div><div><dt>accepted</dt><dd>{accepted}</dd></div>")
            .Append($"<div><dt>rejected</dt><dd>{rejected}</dd></div><div><dt>awaiting decision</dt><dd>{deliveries.Count - accepted - rejected}</dd></div></dl>");
        if (deliveries.Count == 0)
        {
            html.Append("<p class=\"none\">No delivery yet: send an assessment with <code>\"projectId\"</code> (JSON) or in the upload's options.</p></section>");
            return;
        }

        html.Append("<table id=\"delivery-table\"><caption>Deliveries, oldest first</caption><thead><tr><th scope=\"col\" class=\"n\">#</th><th scope=\"col\">delivery</th>")
            .Append("<th scope=\"col\">assessed (UTC)</th><th scope=\"col\">verdict</th><th scope=\"col\">acceptance</th><th scope=\"col\">decided</th></tr></thead><tbody>");
        for (int i = 0; i < deliveries.Count; i++)
        {
            var d = deliveries[i];
            string title = string.IsNullOrWhiteSpace(d.Title) ? "Untitled assessment" : d.Title;
            string decided = d.Latest is { } l ? $"{Escape(l.By)}, {SignOffSection.Time(l.At)}" : "–";
            html.Append($"<tr data-assessment=\"{Escape(d.Id)}\"><td class=\"n\">{i + 1}</td><th scope=\"row\"><a href=\"{ReportLinks.Page(d.Id)}\">{Escape(title)}</a></th>")
                .Append($"<td>{SignOffSection.Time(d.CreatedAt)}</td><td>{VerdictTag(d.Verdict)}</td><td class=\"acceptance\">{SignOffSection.StateTag(d.Latest)}</td><td>{decided}</td></tr>");
        }

        html.Append("</tbody></table></section>");
    }

    private static string VerdictTag(string verdict) => verdict switch
    {
        "pass" => "<span class=\"tag t-pass\">pass</span>",
        "fail" => "<span class=\"tag t-fail\">fail</span>",
        _ => $"<span class=\"tag t-none\">{Escape(verdict)}</span>",
    };

    private static void RenderTrend(StringBuilder html, ProjectPageModel project)
    {
        var deliveries = project.Deliveries;
        html.Append("<section id=\"trend\" aria-labelledby=\"trend-h\"><h2 id=\"trend-h\"><span class=\"num\">3</span> Trend of the figures</h2>");
        if (deliveries.Count == 0)
        {
            html.Append("<p class=\"none\">Nothing to plot yet.</p></section>");
            return;
        }

        html.Append("<figure id=\"fig-trend\">");
        TrendPlot.Render(html, project);
        html.Append("<figcaption>Each delivery's figures in the order received, metres (the table below holds the same numbers).<span class=\"legend\">")
            .Append("<span class=\"key k-nh\" aria-hidden=\"true\"></span>NSSDA horizontal 95 % <span class=\"key k-rh\" aria-hidden=\"true\"></span>RMSE_H ")
            .Append("<span class=\"key k-nv\" aria-hidden=\"true\"></span>NSSDA vertical 95 % <span class=\"key k-rv\" aria-hidden=\"true\"></span>RMSE_V ")
            .Append("<span class=\"key k-level\" aria-hidden=\"true\"></span>spec</span></figcaption></figure>");

        html.Append("<table id=\"trend-table\"><caption>Figures per delivery (metres; n = check points used)</caption><thead><tr><th scope=\"col\" class=\"n\">#</th><th scope=\"col\">delivery</th>")
            .Append("<th scope=\"col\" class=\"n\">n (H)</th><th scope=\"col\" class=\"n\">NSSDA H 95 %</th><th scope=\"col\" class=\"n\">RMSE_H</th>")
            .Append("<th scope=\"col\" class=\"n\">n (V)</th><th scope=\"col\" class=\"n\">NSSDA V 95 %</th><th scope=\"col\" class=\"n\">RMSE_V</th></tr></thead><tbody>");
        for (int i = 0; i < deliveries.Count; i++)
        {
            var (d, f) = (deliveries[i], deliveries[i].Figures);
            html.Append($"<tr><td class=\"n\">{i + 1}</td><th scope=\"row\"><code>{Escape(d.Id)}</code></th><td class=\"n\">{Count(f.HorizontalN)}</td><td class=\"n\">{Metres(f.HorizontalNssda95)}</td>")
                .Append($"<td class=\"n\">{Metres(f.RmseH)}</td><td class=\"n\">{Count(f.VerticalN)}</td><td class=\"n\">{Metres(f.VerticalNssda95)}</td><td class=\"n\">{Metres(f.RmseV)}</td></tr>");
        }

        html.Append("</tbody></table></section>");
    }

    private static string Count(int? n) => n is { } value ? value.ToString(CultureInfo.InvariantCulture) : "–";
}
