using static QaService.Core.InvariantText;
using System.Globalization;
using QaService.Core.Reporting;
using QaService.Core.Statistics;

namespace QaService.Core.Diagnosis;

/// <summary>
/// Blunders: the modified z-score M = 0.6745 (x − median) / MAD of each residual component, flagged
/// when |M| &gt; 3.5 (B. Iglewicz and D. C. Hoaglin, "How to Detect and Handle Outliers", ASQC 1993;
/// also NIST/SEMATECH e-Handbook §1.3.5.17). Median-based, so one blunder cannot hide itself by
/// inflating the spread as it would with a 3·RMSE rule. Where MAD is zero the mean absolute
/// deviation stands in, scaled by 1.253314 = sqrt(π/2) (as the same authors advise).
/// Needs at least <see cref="MinimumPoints"/> residuals. Flagged fixes stay in the statistics
/// unless the request excludes them with a reason.
/// </summary>
public sealed class OutlierCheck : IDataCheck
{
    /// <summary>|modified z| above which a residual is flagged (Iglewicz and Hoaglin 1993).</summary>
    public const double ModifiedZLimit = 3.5;

    /// <summary>Φ⁻¹(0.75): makes the MAD a consistent estimator of σ for normal data.</summary>
    public const double NormalQuartile = 0.6745;

    /// <summary>sqrt(π/2): mean absolute deviation to σ for normal data.</summary>
    public const double MeanAbsoluteDeviationToSigma = 1.253314;

    /// <summary>Fewest residuals for which a median-based rule means anything.</summary>
    public const int MinimumPoints = 5;

    public string Id => "outliers";

    public CheckResult Evaluate(CheckContext context)
    {
        var included = context.Included;
        if (included.Count < MinimumPoints)
            return new CheckResult(Id, CheckStatus.Warn, $"fewer than {MinimumPoints} residuals: blunders cannot be told from spread");

        // The components are judged independently (each its own medians and flags), so side by side for large uploads;
        // the flags are then merged into one sorted set and the largest score taken, as one after the other would.
        var columns = context.Columns;
        var (flaggedE, flaggedN, flaggedU) = (NewFlagSet(), NewFlagSet(), NewFlagSet());
        double largestE = 0, largestN = 0, largestU = 0;
        var withHeight = columns.Up.Length >= MinimumPoints;
        ParallelWork.Invoke(included.Count >= ParallelWork.MinimumRange,
            () => largestE = Flag(columns.East, columns.FixIdOf, flaggedE),
            () => largestN = Flag(columns.North, columns.FixIdOf, flaggedN),
            () => largestU = withHeight ? Flag(columns.Up, i => columns.FixIdOf(columns.UpRows[i]), flaggedU) : 0);
        var flagged = flaggedE;
        flagged.UnionWith(flaggedN);
        flagged.UnionWith(flaggedU);
        var largest = Math.Max(Math.Max(0.0, largestE), largestN);
        if (withHeight)
            largest = Math.Max(largest, largestU);

        if (flagged.Count == 0)
        {
            return new CheckResult(Id, CheckStatus.Pass,
                Format($"no residual has a modified z-score above {ModifiedZLimit}"), largest, ModifiedZLimit, "modified z");
        }
        return new CheckResult(Id, CheckStatus.Warn,
            Format($"{flagged.Count} fix(es) lie far outside the rest (modified z-score above {ModifiedZLimit}): {string.Join(", ", flagged)}. Check them for blunders (wrong mark, unapplied antenna height, float solution); exclude them only with a documented reason"),
            largest, ModifiedZLimit, "modified z", flagged.ToArray());
    }

    private static SortedSet<string> NewFlagSet() => new(StringComparer.Ordinal);

    /// <param name="values">One component of the residuals, m.</param>
    /// <param name="fixOf">Fix id of the residual behind values[i].</param>
    private static double Flag(double[] values, Func<int, string> fixOf, SortedSet<string> flagged)
    {
        var median = Percentile.LinearInterpolation(values, 0.5);
        using var deviationCopy = new Statistics.PooledScratch(values.Length);
        var deviations = deviationCopy.Span;
        for (var i = 0; i < values.Length; i++)
            deviations[i] = Math.Abs(values[i] - median);
        var mad = Percentile.LinearInterpolationInPlace(deviations, 0.5);
        // Degenerate data only (a zero MAD): the mean deviation, from the values again, as selection reordered the scratch.
        var scale = mad > 0 ? mad / NormalQuartile : values.Select(v => Math.Abs(v - median)).Average() * MeanAbsoluteDeviationToSigma;
        if (scale <= 0)
            return 0;
        var largest = 0.0;
        for (var i = 0; i < values.Length; i++)
        {
            var z = Math.Abs(values[i] - median) / scale;
            largest = Math.Max(largest, z);
            if (z > ModifiedZLimit)
                flagged.Add(fixOf(i));
        }
        return largest;
    }

}
