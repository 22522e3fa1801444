using System.Text.RegularExpressions;
using QaService.Core.Reporting.Html;
using QaService.Core.Reporting.Plots;
using QaService.Core.Statistics;

namespace QaService.Core.Tests.Reporting;

public sealed partial class ReportPageTests
{
    [Fact]
    public void Every_id_title_and_message_is_escaped()
    {
        string html = ReportPage.Render(SampleReports.Hostile());
        Assert.DoesNotContain("<img", html, StringComparison.OrdinalIgnoreCase);
        Assert.DoesNotContain("<b>far</b>", html);
        Assert.DoesNotContain("<title>Sample <title>", html);
        Assert.Contains("&lt;img src=x onerror=alert(1)&gt;", html);
        Assert.Contains("one residual &lt;b&gt;far&lt;/b&gt; out", html);
        Assert.Contains("caution &amp; care", html);
    }

    [Fact]
    public void Page_is_self_contained()
    {
        string html = ReportPage.Render(SampleReports.Hostile());
        Assert.DoesNotContain("<script", html, StringComparison.OrdinalIgnoreCase);
        Assert.DoesNotContain("<link rel=\"stylesheet\"", html);
        Assert.DoesNotContain("@import", html);
        Assert.DoesNotContain("url(http", html);
        // Links and references stay on this service (paths), in the page (#) or inline (data:); nothing points elsewhere.
        var references = ReferencePattern().Matches(html).Select(m => m.Groups[1].Value).ToList();
        Assert.NotEmpty(references);
        Assert.All(references, value => Assert.True(value.StartsWith('/') || value.StartsWith('#') || value.StartsWith("data:", StringComparison.Ordinal), value));
        Assert.Contains($"content=\"{PageShell.ContentSecurityPolicy}\"", html);
    }

    [Fact]
    public void Plots_draw_every_point_and_the_95_percent_figures()
    {
        var report = SampleReports.Hostile();
        string html = ReportPage.Render(report);
        int included = report.Residuals.Count(r => r.Excluded is null);
        Assert.Equal(included, Regex.Matches(Section(html, "plot-scatter"), "class=\"pt\"").Count);
        Assert.Equal(report.Residuals.Count, Regex.Matches(Section(html, "plot-plan"), "class=\"vec( vec-x)?\" x1").Count - 1); // minus the key arrow
        Assert.Equal(included, Regex.Matches(Section(html, "plot-cdf"), "class=\"pt\"").Count);
        Assert.Equal(report.Vertical!.N, Regex.Matches(Section(html, "plot-vertical"), "class=\"pt\"").Count);
        Assert.Contains("class=\"ring-50\"", html);
        Assert.Contains("class=\"ellipse-95\"", html);
    }

    [Fact]
    public void Model_distribution_holds_50_and_95_percent_at_the_reported_radii()
    {
        // The CDF is the same fitted model as cep50 and r95 (api-v1 definitions); interpolating it at those radii
        // must give 0.50 and 0.95 to within the curve's linear interpolation between grid steps.
        var report = SampleReports.With(
            ("A", "1", 0.01, 0.02, null, null), ("B", "2", -0.03, 0.01, null, null), ("C", "3", 0.02, -0.015, null, null),
            ("D", "4", -0.005, -0.025, null, null), ("E", "5", 0.04, 0.005, null, null));
        var plots = PlotDataBuilder.Build(report);
        Assert.Equal(PlotDataBuilder.ModelCdfSteps + 1, plots.ModelCdf.Count);
        Assert.Equal(0.0, plots.ModelCdf[0].Probability);
        Assert.Equal(0.50, Interpolate(plots.ModelCdf, report.Horizontal!.Cep50), 3);
        Assert.Equal(0.95, Interpolate(plots.ModelCdf, report.Horizontal.R95), 3);
        Assert.Equal(report.Residuals.Select(r => r.DH).Order(), plots.SortedHorizontalErrors);
        Assert.Equal(ErrorEllipse.ReportProbability, plots.Ellipse!.Probability);
    }

    private static double Interpolate(IReadOnlyList<CdfPoint> cdf, double r)
    {
        int i = 1;
        while (cdf[i].RadiusMetres < r)
            i++;
        var (a, b) = (cdf[i - 1], cdf[i]);
        return a.Probability + ((b.Probability - a.Probability) * (r - a.RadiusMetres) / (b.RadiusMetres - a.RadiusMetres));
    }

    private static string Section(string html, string id)
    {
        int start = html.IndexOf($"<svg id=\"{id}\"", StringComparison.Ordinal);
        return html[start..html.IndexOf("</svg>", start, StringComparison.Ordinal)];
    }

    [GeneratedRegex("(?:href|src|action)=\"([^\"]*)\"")]
    private static partial Regex ReferencePattern();
}
