using QaService.Core.Reporting;
using QaService.Core.Standards;
using QaService.Core.Statistics;

namespace QaService.Core.Assessment;

/// <summary>
/// The report's blocks beyond the contract's core: the selected standard, confidence, approximations, the offset model
/// and the outlier sensitivity. Pure; computed once from the included residuals.
/// </summary>
public static class ReportFigures
{
    public sealed record Blocks(StandardResult? Standard, ConfidenceSummary? Confidence, IReadOnlyList<Approximation>? Approximations,
        OffsetRadii? OffsetModel, OutlierSensitivity? OutlierSensitivity);

    public static Blocks Compute(ValidatedAssessment input, IReadOnlyList<Residual> included, HorizontalAccuracy? horizontal,
        VerticalAccuracy? vertical, IReadOnlyList<CheckResult> checks)
    {
        if (horizontal is null)
            return new Blocks(null, null, null, null, null);
        var dE = included.Select(r => r.DE).ToArray();
        var dN = included.Select(r => r.DN).ToArray();
        var dU = vertical is null ? [] : included.Where(r => r.DU is not null).Select(r => r.DU!.Value).ToArray();
        double meanSquareE = SampleMoments.MeanSquareAboutZero(dE), meanSquareN = SampleMoments.MeanSquareAboutZero(dN);

        var marks = TestedMarks.Of(input.Marks, included);
        var spec = input.Spec;
        var standardInput = new StandardInput(horizontal, vertical,
            included.Select(r => r.DH).ToArray(), dU.Select(Math.Abs).ToArray(),
            marks.Select(m => m.SigmaHorizontalMetres).ToArray(), marks.Select(m => m.SigmaVerticalMetres).ToArray(),
            spec?.HorizontalMetres, spec?.VerticalMetres, spec?.MapScaleDenominator, spec?.ContourIntervalMetres,
            input.MarksFrame.Crs.Unit);
        var standard = AccuracyStandards.Evaluate(spec?.Standard ?? AccuracyStandards.NssdaId, standardInput);
        ConfidenceSummary? confidence = null;
        if (included.Count >= 2)
        {
            (confidence, standard) = StandardConfidence.Apply(standard, standardInput, spec?.Confidence ?? StandardConfidence.DefaultLevel,
                spec?.Confidence is not null, meanSquareE, meanSquareN);
        }

        var approximations = CircularErrorApproximations.For(meanSquareE, meanSquareN, SampleMoments.MeanProductAboutZero(dE, dN), horizontal);
        return new Blocks(standard, confidence, approximations, OffsetModelOrNull(dE, dN, dU), Sensitivity(included, horizontal, vertical, checks));
    }

    /// <summary>
    /// The offset model is descriptive (no verdict depends on it): if its root finding cannot bracket a
    /// radius for some extreme shape of data, the block is left out rather than failing the whole report.
    /// </summary>
    private static OffsetRadii? OffsetModelOrNull(double[] dE, double[] dN, double[] dU)
    {
        try
        {
            return OffsetRadii.Compute(dE, dN, dU);
        }
        catch (MathNet.Numerics.NonConvergenceException)
        {
            return null;
        }
    }

    private static OutlierSensitivity? Sensitivity(IReadOnlyList<Residual> included, HorizontalAccuracy horizontal, VerticalAccuracy? vertical, IReadOnlyList<CheckResult> checks)
    {
        var flagged = checks.FirstOrDefault(c => c.Id == "outliers")?.Items;
        if (flagged is null || flagged.Count == 0)
            return null;
        var set = flagged.ToHashSet(StringComparer.Ordinal);
        var kept = included.Where(r => !set.Contains(r.Fix)).ToList();
        HorizontalAccuracy? without = kept.Count == 0 ? null : HorizontalAccuracy.Compute(kept.Select(r => r.DE).ToArray(), kept.Select(r => r.DN).ToArray());
        var keptUp = kept.Where(r => r.DU is not null).Select(r => r.DU!.Value).ToArray();
        return new OutlierSensitivity(flagged, horizontal.RmseR, without?.RmseR, horizontal.Nssda95, without?.Nssda95,
            vertical?.Rmse, vertical is null || keptUp.Length == 0 ? null : SampleMoments.RootMeanSquareAboutZero(keptUp));
    }
}
