using static QaService.Core.InvariantText;
using MathNet.Numerics.Distributions;
using QaService.Core.Reporting;
using QaService.Core.Statistics;

namespace QaService.Core.Diagnosis;

/// <summary>
/// Systematic offset. Horizontal: Hotelling's one-sample T² test of the mean (dE, dN) against zero at the 5 % level
/// (<see cref="HotellingTest"/>; Hotelling 1931), which tests the offset as one vector. Vertical: a two-sided one-sample
/// Student t test of the mean dU (NIST/SEMATECH e-Handbook §7.2.2). NSSDA's 95 % figures assume errors without bias
/// (FGDC-STD-007.3-1998 App. 3-A), so a significant mean is reported with its direction and size.
/// Status: warn when significant; fail when significant and the offset alone uses up at least half of the spec
/// (|mean| ≥ 0.5 × spec figure; a limit of this service — ASPRS Ed.1 asked mean errors to stay within 25 % of the
/// RMSE, from memory). The <c>datum-mismatch</c> and <c>height-reference</c> checks look for the cause.
/// </summary>
public sealed class BiasCheck : IDataCheck
{
    /// <summary>Significance level of both tests.</summary>
    public const double SignificanceLevel = 0.05;

    /// <summary>Share of the spec figure an offset may take before the check fails (service's rule).</summary>
    public const double FailShareOfSpec = 0.5;

    public string Id => "bias";

    public CheckResult Evaluate(CheckContext context)
    {
        var included = context.Included;
        if (included.Count < 3)
            return new CheckResult(Id, CheckStatus.Warn, "fewer than three residuals: a systematic offset cannot be tested");

        var horizontal = context.Columns.MeanOffsetTest;
        var upValues = context.Columns.Up;
        var up = upValues.Length >= 2 ? TTest(upValues) : null;

        var findings = new List<string>();
        var fail = false;
        if (horizontal is { Significant: true } h)
        {
            var shift = Math.Sqrt(h.MeanE * h.MeanE + h.MeanN * h.MeanN);
            var bearing = (Math.Atan2(h.MeanE, h.MeanN) * 180 / Math.PI + 360) % 360;
            findings.Add(Format($"horizontal offset {shift:F3} m towards {bearing:F0}° (mean dE {h.MeanE:+0.000;-0.000} m, dN {h.MeanN:+0.000;-0.000} m; Hotelling T² = {h.TSquared:F1}, F = {h.F:F1} > {h.CriticalF:F2}, p = {h.PValue:0.###e0})"));
            if (context.Input.Spec?.HorizontalMetres is { } spec && shift >= FailShareOfSpec * spec)
                fail = true;
        }
        if (up is { Significant: true } u)
        {
            findings.Add(Format($"vertical offset {u.Mean:+0.000;-0.000} m (t = {u.T:F1}, |t| > {u.Critical:F2}, n = {u.Count})"));
            if (context.Input.Spec?.VerticalMetres is { } spec && Math.Abs(u.Mean) >= FailShareOfSpec * spec)
                fail = true;
        }

        var measured = horizontal?.F ?? 0.0;
        var threshold = horizontal?.CriticalF;
        if (findings.Count == 0)
        {
            var text = horizontal is null
                ? "the horizontal residuals are degenerate (no spread), so Hotelling's test cannot run"
                : Format($"no significant mean offset at the {SignificanceLevel:P0} level (mean dE {horizontal.MeanE:F3} m, dN {horizontal.MeanN:F3} m, F = {horizontal.F:F2} ≤ {horizontal.CriticalF:F2}{(up is null ? "" : Format($"; mean dU {up.Mean:F3} m, |t| = {Math.Abs(up.T):F2}"))})");
            return new CheckResult(Id, horizontal is null ? CheckStatus.Warn : CheckStatus.Pass, text, measured, threshold, "F");
        }
        var message = "significant systematic offset: " + string.Join("; ", findings)
            + ". The 95 % figures assume no bias. Look for a datum or frame mismatch, a wrong zone, unapplied antenna heights or a shared coordinate typo (see datum-mismatch and height-reference); "
            + "if the offset is real and constant, remove its cause rather than the points";
        return new CheckResult(Id, fail ? CheckStatus.Fail : CheckStatus.Warn, message, measured, threshold, "F");
    }

    /// <summary>Two-sided critical t at <see cref="SignificanceLevel"/> per degrees of freedom (MathNet StudentT.InvCDF), kept per count.</summary>
    private static readonly BoundedMemo<int, double> CriticalT = new(freedom => StudentT.InvCDF(0, 1, freedom, 1 - SignificanceLevel / 2), MostKeptCounts);

    /// <summary>Counts whose critical values are kept (about 40 bytes each).</summary>
    private const int MostKeptCounts = 4096;

    private static VerticalTest TTest(double[] values)
    {
        var n = values.Length;
        var mean = values.Average();
        var sd = Math.Sqrt(values.Sum(v => (v - mean) * (v - mean)) / (n - 1));
        var critical = CriticalT[n - 1];
        var se = sd / Math.Sqrt(n);
        var t = se > 0 ? mean / se : (mean == 0 ? 0 : Math.Sign(mean) * double.MaxValue);
        return new VerticalTest(n, mean, t, critical, Math.Abs(t) > critical);
    }

    private sealed record VerticalTest(int Count, double Mean, double T, double Critical, bool Significant);
}
