using static QaService.Core.InvariantText;
using System.Globalization;
using MathNet.Numerics.Distributions;
using QaService.Core.Reporting;

namespace QaService.Core.Diagnosis;

/// <summary>
/// Systematic offset: a two-sided one-sample Student t test of the mean of dE, dN and dU against zero
/// at the 5 % level (any statistics text, e.g. NIST/SEMATECH e-Handbook of Statistical Methods §7.2.2).
/// NSSDA's 95 % figures assume errors without bias (FGDC-STD-007.3-1998 App. 3-A), so a significant
/// mean is reported. A large, tight horizontal shift is named as the usual cause: a datum or frame
/// mismatch, a wrong zone, or marks and fixes from different realisations.
/// Needs n ≥ 2 residuals per component.
/// </summary>
public sealed class BiasCheck : IDataCheck
{
    /// <summary>Two-sided significance level of the t test.</summary>
    public const double SignificanceLevel = 0.05;

    /// <summary>Horizontal shift above which a tight offset is named as a likely frame problem, metres (common practice: NAD83 vs WGS 84/ITRF differ by 1–2 m in North America).</summary>
    public const double FrameMismatchShiftMetres = 0.5;

    public string Id => "bias";

    public CheckResult Evaluate(CheckContext context)
    {
        var included = context.Included;
        if (included.Count < 2)
            return new CheckResult(Id, CheckStatus.Warn, "fewer than two residuals: a systematic offset cannot be tested");

        var east = Test(included.Select(r => r.DE).ToArray());
        var north = Test(included.Select(r => r.DN).ToArray());
        var upValues = included.Where(r => r.DU is not null).Select(r => r.DU!.Value).ToArray();
        var up = upValues.Length >= 2 ? Test(upValues) : null;

        var significant = new List<string>();
        if (east.Significant) significant.Add(Describe("east", east));
        if (north.Significant) significant.Add(Describe("north", north));
        if (up is { Significant: true }) significant.Add(Describe("up", up));

        var largestT = new[] { east.TStatistic, north.TStatistic, up?.TStatistic ?? 0 }.Max(Math.Abs);
        var critical = east.CriticalT;
        if (significant.Count == 0)
        {
            return new CheckResult(Id, CheckStatus.Pass,
                Format($"no significant mean offset at the {SignificanceLevel:P0} level (mean dE {east.Mean:F3} m, dN {north.Mean:F3} m{(up is null ? "" : Format($", dU {up.Mean:F3} m"))})"),
                largestT, critical, "t");
        }

        var shift = Math.Sqrt(east.Mean * east.Mean + north.Mean * north.Mean);
        var message = "significant mean offset: " + string.Join("; ", significant);
        if ((east.Significant || north.Significant) && shift >= FrameMismatchShiftMetres)
        {
            var bearing = (Math.Atan2(east.Mean, north.Mean) * 180 / Math.PI + 360) % 360;
            message += Format($". A consistent {shift:F2} m shift towards {bearing:F0}° usually means the marks and fixes are in different datums or frames, a wrong zone, or a coordinate typo shared by the batch");
        }
        return new CheckResult(Id, CheckStatus.Warn, message, largestT, critical, "t");
    }

    private static string Describe(string axis, ComponentTest test) =>
        Format($"{axis} {test.Mean:+0.000;-0.000} m (t = {test.TStatistic:F1}, n = {test.Count})");

    private static ComponentTest Test(double[] values)
    {
        var n = values.Length;
        var mean = values.Average();
        var sumSquares = values.Sum(v => (v - mean) * (v - mean));
        var standardError = Math.Sqrt(sumSquares / (n - 1)) / Math.Sqrt(n);
        var critical = StudentT.InvCDF(0, 1, n - 1, 1 - SignificanceLevel / 2);
        var t = standardError > 0 ? mean / standardError : (mean == 0 ? 0 : double.PositiveInfinity * Math.Sign(mean));
        var significant = Math.Abs(t) > critical;
        return new ComponentTest(n, mean, double.IsFinite(t) ? t : Math.Sign(t) * double.MaxValue, critical, significant);
    }


    private sealed record ComponentTest(int Count, double Mean, double TStatistic, double CriticalT, bool Significant);
}
