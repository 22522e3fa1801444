using MathNet.Numerics.Distributions;
using QaService.Core.Statistics;

namespace QaService.Core.Standards;

/// <summary>Confidence figures for one axis (metres unless named otherwise).</summary>
/// <param name="DegreesOfFreedom">ν of the chi-square interval (n vertical; Satterthwaite's ν horizontal).</param>
/// <param name="RmseLower">Lower two-sided bound of the RMSE (rmseR horizontal, rmse vertical), m.</param>
/// <param name="RmseUpper">Upper two-sided bound, m.</param>
/// <param name="RmseUpperOneSided">One-sided upper bound at the level, m (what a pass at that confidence rests on).</param>
/// <param name="P95Lower">Percentile-bootstrap lower bound of the empirical 95th percentile (of dH or |dU|), m.</param>
/// <param name="P95Upper">Percentile-bootstrap upper bound, m.</param>
/// <param name="PointsNeeded">Fewest check points that would show the judged requirement at this confidence if the RMSE stayed as tested; null when none would (the point estimate already misses) or no requirement applies.</param>
/// <param name="Advice">The sample-size advice in words.</param>
public sealed record AxisConfidence(double DegreesOfFreedom, double RmseLower, double RmseUpper, double RmseUpperOneSided,
    double? P95Lower, double? P95Upper, int? PointsNeeded, string Advice);

/// <summary>The report's <c>confidence</c> block.</summary>
/// <param name="Level">Confidence level (spec.confidence, else 0.95).</param>
/// <param name="Judged">True when spec.confidence was given, so the verdict rests on upper bounds.</param>
/// <param name="Method">How the bounds were made.</param>
public sealed record ConfidenceSummary(double Level, bool Judged, string Method, AxisConfidence? Horizontal, AxisConfidence? Vertical);

/// <summary>
/// Confidence bounds for the report and for judging a standard's figures at spec.confidence: figures proportional to an
/// RMSE get the chi-square one-sided upper bound ratio (<see cref="RmseConfidence"/>); shares of points over a tolerance
/// (NMAS) get the Clopper–Pearson upper bound (Clopper &amp; Pearson 1934, Biometrika 26(4):404–413,
/// doi:10.1093/biomet/26.4.404): the c-quantile of Beta(k + 1, n − k).
/// </summary>
public static class StandardConfidence
{
    /// <summary>Level used for the report's intervals when the spec names none.</summary>
    public const double DefaultLevel = 0.95;

    public const string MethodText =
        "RMSE: chi-square interval with ν = n (vertical) or Satterthwaite's ν (horizontal), normal unbiased errors assumed; " +
        "95th percentile: percentile bootstrap, 2,000 resamples, fixed seed (above 10,000 values its large-sample order-statistic limit); shares over a tolerance: Clopper–Pearson.";

    /// <summary>Builds the block and returns the standard with upper bounds set on its judged figures when <paramref name="judged"/>.</summary>
    public static (ConfidenceSummary Summary, StandardResult Standard) Apply(StandardResult standard, StandardInput input, double level, bool judged,
        double meanSquareE, double meanSquareN)
    {
        double? hRatio = null, vRatio = null;
        AxisConfidence? horizontal = null, vertical = null;
        if (input.Horizontal is { } h)
        {
            double nu = RmseConfidence.HorizontalDegreesOfFreedom(h.N, meanSquareE, meanSquareN);
            hRatio = RmseConfidence.UpperBound(1.0, nu, level);
            horizontal = Axis(h.RmseR, nu, h.N, level, input.RadialMetres, standard, "horizontal", hRatio.Value);
        }
        if (input.Vertical is { } v)
        {
            vRatio = RmseConfidence.UpperBound(1.0, v.N, level);
            vertical = Axis(v.Rmse, v.N, v.N, level, input.AbsoluteVerticalMetres, standard, "vertical", vRatio.Value);
        }

        if (judged)
        {
            var figures = standard.Figures.Select(f =>
            {
                if (!f.Judged || f.Required is not { } required)
                    return f;
                double? upper = f.Unit == "share"
                    ? ShareUpperBound(f.Value, f.Axis == "horizontal" ? input.RadialMetres.Count : input.AbsoluteVerticalMetres.Count, level)
                    : f.Axis == "horizontal" ? f.Value * hRatio : f.Axis == "vertical" ? f.Value * vRatio : null;
                return upper is null ? f : f with { UpperBound = upper, MetAtConfidence = upper <= required };
            }).ToList();
            standard = standard with { Figures = figures };
        }
        return (new ConfidenceSummary(level, judged, MethodText, horizontal, vertical), standard);
    }

    /// <summary>Clopper–Pearson one-sided upper bound of a share k/n at confidence <paramref name="level"/>.</summary>
    public static double ShareUpperBound(double share, int n, double level)
    {
        int k = (int)Math.Round(share * n);
        return k >= n ? 1.0 : ClopperPearsonUpper[(k, n, level)];
    }

    /// <summary>Beta(k + 1, n − k) quantile at the level (MathNet Beta.InvCDF, a root search), kept per (k, n, level).</summary>
    private static readonly BoundedMemo<(int K, int N, double Level), double> ClopperPearsonUpper =
        new(key => Beta.InvCDF(key.K + 1, key.N - key.K, key.Level), mostEntries: 16_384);

    /// <summary>The values without a copy when they already sit in an array or list (a copy of 400,000 is a large-object allocation).</summary>
    private static ReadOnlySpan<double> AsSpan(IReadOnlyList<double> values) => values switch
    {
        double[] array => array,
        List<double> list => System.Runtime.InteropServices.CollectionsMarshal.AsSpan(list),
        _ => values.ToArray(),
    };

    private static AxisConfidence Axis(double rmse, double nu, int n, double level, IReadOnlyList<double> values, StandardResult standard, string axis, double upperRatio)
    {
        var (lower, upper) = RmseConfidence.Interval(rmse, nu, level);
        (double, double)? bootstrap = values.Count >= 2 ? BootstrapInterval.OfQuantile(AsSpan(values), 0.95, level) : null;
        var judgedFigure = standard.Figures.FirstOrDefault(f => f.Judged && f.Axis == axis && f.Required is not null && f.Unit == "m");
        int? needed = null;
        string advice;
        if (judgedFigure is null)
            advice = "no requirement in the standard's own measure for this axis, so no sample size is advised";
        else
        {
            needed = RmseConfidence.PointsNeeded(judgedFigure.Value, judgedFigure.Required!.Value, level, nu / n);
            advice = needed is { } k
                ? InvariantText.Format($"if the RMSE stays as tested, {k} check points would show {judgedFigure.Name} ≤ {judgedFigure.Required:0.###} m at {level:P0} confidence ({n} tested)")
                : InvariantText.Format($"{judgedFigure.Name} {judgedFigure.Value:0.###} m does not meet {judgedFigure.Required:0.###} m, so no number of check points would show it; improve the data");
        }
        return new AxisConfidence(nu, lower, upper, rmse * upperRatio, bootstrap?.Item1, bootstrap?.Item2, needed, advice);
    }
}
