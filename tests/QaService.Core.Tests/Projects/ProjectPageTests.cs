using System.Text.RegularExpressions;
using QaService.Core.Projects;
using QaService.Core.Reporting.Html;
using QaService.Core.SignOff;
using QaService.Core.Tests.Reporting;

namespace QaService.Core.Tests.Projects;

/// <summary>The project page and the report page's sign-off section: escaped, self-contained, every delivery and value shown.</summary>
public sealed partial class ProjectPageTests
{
    private static readonly DateTimeOffset Start = new(2026, 6, 1, 8, 0, 0, TimeSpan.Zero);

    private static SignOffDecision Decision(string decision, string by, int minutes) =>
        new(decision, by, "<i>note</i>", Start.AddMinutes(minutes), new string('a', 64));

    private static ProjectPageModel Model() => new("p1", "Contract <b>7</b>", Start, """{"horizontal":0.5,"note":"<x>"}""", "nssda", 0.5, null,
    [
        new("r1", Start.AddHours(1), "First <delivery>", "pass", Decision(DecisionWords.Accepted, "A & B", 70), new DeliveryFigures(24, 0.41, 0.24, 24, 0.6, 0.31)),
        new("r2", Start.AddHours(2), null, "fail", Decision(DecisionWords.Rejected, "C", 130), new DeliveryFigures(24, 0.52, 0.3, null, null, null)),
        new("r3", Start.AddHours(3), "Third", "inconclusive", null, new DeliveryFigures(12, 0.45, 0.26, 12, 0.5, 0.25)),
    ]);

    [Fact]
    public void Every_delivery_shows_its_acceptance_state()
    {
        string html = ProjectPage.Render(Model());
        var rows = DeliveryRows().Matches(html).Select(m => m.Groups["row"].Value).ToList();
        Assert.Equal(3, rows.Count);
        Assert.Contains("✓ accepted", rows[0]);
        Assert.Contains("✗ rejected", rows[1]);
        Assert.Contains("awaiting decision", rows[2]);
        Assert.Contains("A &amp; B", rows[0]);
    }

    [Fact]
    public void Text_is_escaped_and_the_page_loads_nothing()
    {
        string html = ProjectPage.Render(Model());
        Assert.DoesNotContain("<b>7</b>", html);
        Assert.DoesNotContain("<delivery>", html);
        Assert.DoesNotContain("<x>", html);
        Assert.Contains("Contract &lt;b&gt;7&lt;/b&gt;", html);
        Assert.DoesNotContain("<script", html, StringComparison.OrdinalIgnoreCase);
        Assert.All(References().Matches(html).Select(m => m.Groups[1].Value), value => Assert.True(value.StartsWith('/') || value.StartsWith('#') || value.StartsWith("data:", StringComparison.Ordinal), value));
        Assert.Contains($"content=\"{PageShell.ContentSecurityPolicy}\"", html);
    }

    [Fact]
    public void The_trend_plots_each_present_value_and_lists_all_in_a_table()
    {
        string html = ProjectPage.Render(Model());
        string plot = html[html.IndexOf("<svg id=\"plot-trend\"", StringComparison.Ordinal)..];
        plot = plot[..(plot.IndexOf("</svg>", StringComparison.Ordinal) + 6)];
        Assert.Contains("role=\"img\"", plot);
        Assert.Contains("<desc id=\"plot-trend-d\">", plot);
        Assert.Equal(3, Regex.Matches(plot, "<circle[^>]*><title>#\\d NSSDA horizontal").Count);
        // Delivery 2 has no vertical block: two vertical points, and its line is broken rather than drawn through zero.
        Assert.Equal(2, Regex.Matches(plot, "<title>#\\d NSSDA vertical").Count);
        Assert.DoesNotContain("<title>#2 NSSDA vertical", plot);
        Assert.Contains("spec H 0.500 m", plot);
        Assert.Contains("Metres", plot);
        var table = html[html.IndexOf("id=\"trend-table\"", StringComparison.Ordinal)..];
        Assert.Equal(3, Regex.Matches(table[..table.IndexOf("</table>", StringComparison.Ordinal)], "<tr><td class=\"n\">").Count);
        Assert.Contains("<td class=\"n\">0.410</td><td class=\"n\">0.240</td>", table);
    }

    [Fact]
    public void A_project_without_deliveries_says_so()
    {
        string html = ProjectPage.Render(Model() with { Deliveries = [] });
        Assert.Contains("No delivery yet", html);
        Assert.DoesNotContain("plot-trend", html);
    }

    [Fact]
    public void The_report_page_shows_sign_off_only_when_given_and_escapes_it()
    {
        var report = SampleReports.Hostile();
        Assert.DoesNotContain("id=\"sign-off\"", ReportPage.Render(report));

        string hash = new('b', 64);
        var panel = new SignOffPanel(hash, [Decision(DecisionWords.Rejected, "<script>x</script>", 1), Decision(DecisionWords.Accepted, "Lead", 2)],
            new DecisionFormFields("/ui/assessments/sample-1/decisions", "__token", "t\"<>"));
        string html = ReportPage.Render(report, panel);
        Assert.Contains($"<code id=\"report-sha256\">{hash}</code>", html);
        Assert.DoesNotContain("<script>x</script>", html);
        Assert.Contains("&lt;script&gt;x&lt;/script&gt;", html);
        Assert.Contains("value=\"t&quot;&lt;&gt;\"", html);
        Assert.Contains("action=\"/ui/assessments/sample-1/decisions\"", html);
        // The latest decision is the state in force; each decision quoting another hash is marked.
        Assert.Matches("id=\"acceptance-state\">Acceptance: <span class=\"tag t-pass\">", html);
        Assert.Contains(new string('a', 64) + " (differs)", html);
    }

    [GeneratedRegex("<tr data-assessment=\"[^\"]+\">(?<row>.*?)</tr>")]
    private static partial Regex DeliveryRows();

    [GeneratedRegex("(?:href|src|action)=\"([^\"]*)\"")]
    private static partial Regex References();
}
