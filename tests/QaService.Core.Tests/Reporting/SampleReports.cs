using QaService.Core.Reporting;
using QaService.Core.Statistics;

namespace QaService.Core.Tests.Reporting;

/// <summary>Small invented reports for renderer tests (figures from the statistics code; renderers only lay out).</summary>
internal static class SampleReports
{
    public static AssessmentReport With(params (string Mark, string Fix, double DE, double DN, double? DU, string? Excluded)[] pairs)
    {
        var residuals = pairs.Select((p, i) => new Residual(p.Mark, p.Fix, p.DE, p.DN, p.DU, Math.Sqrt((p.DE * p.DE) + (p.DN * p.DN)), "id", p.Excluded,
            48.1 + (i * 0.001), 15.6 + ((i % 3) * 0.002))).ToList();
        var included = residuals.Where(r => r.Excluded is null).ToList();
        var horizontal = HorizontalAccuracy.Compute(included.Select(r => r.DE).ToArray(), included.Select(r => r.DN).ToArray());
        var up = included.Where(r => r.DU is not null).Select(r => r.DU!.Value).ToArray();
        return new AssessmentReport(
            "sample-1", "Sample <title>", new DateTimeOffset(2026, 6, 1, 8, 0, 0, TimeSpan.Zero), Verdict.Inconclusive,
            new ReportCounts(pairs.Length, pairs.Length, pairs.Length, 0, pairs.Length - included.Count),
            horizontal, up.Length > 0 ? VerticalAccuracy.Compute(up) : null, residuals,
            [new CheckResult("outliers", CheckStatus.Warn, "one residual <b>far</b> out", 4.1, 3.5, "z", [pairs[0].Fix])],
            "Tested 0.05 meters horizontal accuracy at 95% confidence level.", ["caution & care"],
            new SpecSummary("nssda", 0.5, null, true, null),
            new FrameSummary("EPSG:32633 (WGS 84 / UTM zone 33N)", "EPSG:4979 (WGS 84)", "marks ellipsoidal, fixes ellipsoidal", "step one; step two"));
    }

    public static AssessmentReport Hostile() => With(
        ("<img src=x onerror=alert(1)>", "=HYPERLINK(\"http://x\",\"y\")", 0.01, -0.02, 0.03, null),
        ("M-2", "+SUM(A1)", -0.015, 0.004, -0.01, null),
        ("M-3", "@cmd", 0.02, 0.011, null, null),
        ("M-3", "-2+3", 0.3, 0.2, 0.5, "blunder, re-observed"),
        ("M-4", "F,\"q\"", -0.004, -0.018, 0.002, null));
}
