using System.Text.Json;
using Microsoft.Playwright;
using Xunit.Abstractions;

namespace QaService.Browser.Tests;

/// <summary>The demo report in headless Chromium: loads clean, self-contained, plots hold every point, prints.</summary>
[Collection(LiveServiceCollection.Name)]
public sealed class DemoReportTests(LiveService service, ITestOutputHelper output)
{
    private const string ReportPath = "v1/assessments/demo/report.html";

    [Fact]
    public async Task Demo_report_loads_with_no_console_error_and_no_external_request()
    {
        if (LiveService.SkipReason is { } skip)
        {
            output.WriteLine(skip);
            return;
        }

        await using var session = await BrowserSession.OpenAsync(service);
        var response = await session.Page.GotoAsync(ReportPath, new PageGotoOptions { WaitUntil = WaitUntilState.NetworkIdle });

        Assert.Equal(200, response!.Status);
        Assert.Empty(session.Errors);
        Assert.Empty(session.ExternalRequests(service));
        // The document is the only request: no script, style sheet, font, image or favicon is fetched.
        Assert.Equal([service.BaseAddress + ReportPath], session.Requests);
        Assert.Equal(0, await session.Page.Locator("script, link[rel=stylesheet], img, iframe").CountAsync());
        Assert.Contains("Millbrook Ferry", await session.Page.TitleAsync());

        var path = Path.Combine(LiveService.ArtifactFolder, "demo-report.png");
        await session.Page.ScreenshotAsync(new PageScreenshotOptions { Path = path, FullPage = true });
        output.WriteLine($"screenshot kept: {path}");
    }

    [Fact]
    public async Task Plots_hold_one_mark_per_point_of_the_report()
    {
        if (LiveService.SkipReason is { } skip)
        {
            output.WriteLine(skip);
            return;
        }

        // Expected counts come from the report's JSON, not from the page.
        var report = JsonDocument.Parse(await service.Http.GetStringAsync("v1/assessments/demo")).RootElement;
        var residuals = report.GetProperty("residuals").EnumerateArray().ToList();
        int included = residuals.Count(r => r.GetProperty("excluded").ValueKind == JsonValueKind.Null);
        int marks = residuals.Select(r => r.GetProperty("mark").GetString()).Distinct().Count();
        int vertical = report.GetProperty("vertical").GetProperty("n").GetInt32();

        await using var session = await BrowserSession.OpenAsync(service);
        await session.Page.GotoAsync(ReportPath);
        var page = session.Page;

        Assert.Equal(included, await page.Locator("#plot-scatter circle.pt").CountAsync());
        Assert.Equal(1, await page.Locator("#plot-scatter circle.ring-50").CountAsync());
        Assert.Equal(1, await page.Locator("#plot-scatter circle.ring-95").CountAsync());
        Assert.Equal(1, await page.Locator("#plot-scatter ellipse.ellipse-95").CountAsync());
        Assert.Equal(residuals.Count, await page.Locator("#plot-plan .vectors line").CountAsync());
        Assert.Equal(marks, await page.Locator("#plot-plan rect.mk").CountAsync());
        Assert.Equal(1, await page.Locator("#plot-plan .north").CountAsync());
        Assert.Equal(1, await page.Locator("#plot-plan .scalebar").CountAsync());
        Assert.Equal(included, await page.Locator("#plot-cdf circle.pt").CountAsync());
        Assert.Equal(1, await page.Locator("#plot-cdf polyline.model").CountAsync());
        Assert.Equal(vertical, await page.Locator("#plot-vertical circle.pt").CountAsync());
        Assert.Equal(residuals.Count, await page.Locator("#residual-table tbody tr").CountAsync());

        // Every plot is announced: an accessible name from its <title>, a description from its <desc>.
        foreach (var plot in await page.Locator("svg.plot").AllAsync())
        {
            Assert.False(string.IsNullOrWhiteSpace(await plot.Locator("title").First.TextContentAsync()));
            Assert.False(string.IsNullOrWhiteSpace(await plot.Locator("desc").First.TextContentAsync()));
            Assert.Equal("img", await plot.GetAttributeAsync("role"));
        }

        // The plots are drawn at a readable size, not collapsed.
        var box = await page.Locator("#plot-scatter").BoundingBoxAsync();
        Assert.True(box is { Width: > 250, Height: > 250 }, $"scatter plot box {box?.Width} × {box?.Height}");
    }

    [Fact]
    public async Task Report_prints_on_A4_and_Letter()
    {
        if (LiveService.SkipReason is { } skip)
        {
            output.WriteLine(skip);
            return;
        }

        await using var session = await BrowserSession.OpenAsync(service);
        await session.Page.GotoAsync(ReportPath);
        foreach (var format in new[] { "A4", "Letter" })
        {
            var path = Path.Combine(LiveService.ArtifactFolder, $"demo-report-{format}.pdf");
            var pdf = await session.Page.PdfAsync(new PagePdfOptions { Format = format, Path = path, PrintBackground = true });
            // A PDF (ISO 32000 header) of a handful of pages: the 27-pair demo fits without being cut into slivers.
            Assert.Equal("%PDF-"u8.ToArray(), pdf[..5]);
            int pages = System.Text.RegularExpressions.Regex.Matches(System.Text.Encoding.Latin1.GetString(pdf), @"/Type\s*/Page[^s]").Count;
            output.WriteLine($"{format}: {pages} pages, {pdf.Length} bytes, kept at {path}");
            Assert.InRange(pages, 2, 10);
        }
    }
}
