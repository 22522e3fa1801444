using System.Runtime.InteropServices;
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
        VerticalAccuracy? vertical, IReadOnlyList<CheckResult> checks) =>
        Compute(input, ResidualColumns.Of(input.Marks, included), horizontal, vertical, checks);

    /// <summary>The same from the columns the runner already took from the included residuals.</summary>
    internal static Blocks Compute(ValidatedAssessment input, ResidualColumns columns, HorizontalAccuracy? horizontal,
        VerticalAccuracy? vertical, IReadOnlyList<CheckResult> checks)
    {
        if (horizontal is null)
            return new Blocks(null, null, null, null, null);
        var (dE, dN) = (columns.East, columns.North);
        var dU = vertical is null ? [] : columns.Up;
        double meanSquareE = SampleMoments.MeanSquareAboutZero(dE), meanSquareN = SampleMoments.MeanSquareAboutZero(dN);

        var (standard, confidence) = Judge(input.Spec, input.MarksFrame.Crs.Unit, horizontal, vertical, columns.Radial, dU, columns.TestedMarks,
            meanSquareE, meanSquareN, alwaysConfidence: true);

        var approximations = CircularErrorApproximations.For(meanSquareE, meanSquareN, SampleMoments.MeanProductAboutZero(dE, dN), horizontal);
        return new Blocks(standard, confidence, approximations, OffsetModelOrNull(dE, dN, dU), Sensitivity(columns, horizontal, vertical, checks));
    }

    /// <summary>
    /// The selected standard's figures on one set of residuals and, when asked (or always, for the report's own block), the
    /// confidence bounds: the one place the standard is applied, for the whole set and for each attribute group alike.
    /// </summary>
    /// <param name="radial">dH of the residuals, m.</param>
    /// <param name="dU">dU of the residuals with heights (empty without a vertical comparison), m.</param>
    /// <param name="marks">The tested marks (their declared sigmas enter ASPRS Ed.2).</param>
    internal static (StandardResult Standard, ConfidenceSummary? Confidence) Judge(RequiredAccuracy? spec, Geodesy.Catalog.LinearUnit unit,
        HorizontalAccuracy horizontal, VerticalAccuracy? vertical, double[] radial, ReadOnlySpan<double> dU, IReadOnlyList<FramedPoint> marks,
        double meanSquareE, double meanSquareN, bool alwaysConfidence)
    {
        var absoluteUp = new double[dU.Length];
        for (var i = 0; i < dU.Length; i++)
            absoluteUp[i] = Math.Abs(dU[i]);
        var standardInput = new StandardInput(horizontal, vertical, radial, absoluteUp,
            marks.Select(m => m.SigmaHorizontalMetres).ToArray(), marks.Select(m => m.SigmaVerticalMetres).ToArray(),
            spec?.HorizontalMetres, spec?.VerticalMetres, spec?.MapScaleDenominator, spec?.ContourIntervalMetres, unit);
        var standard = AccuracyStandards.Evaluate(spec?.Standard ?? AccuracyStandards.NssdaId, standardInput);
        ConfidenceSummary? confidence = null;
        if (radial.Length >= 2 && (alwaysConfidence || spec?.Confidence is not null))
        {
            (confidence, standard) = StandardConfidence.Apply(standard, standardInput, spec?.Confidence ?? StandardConfidence.DefaultLevel,
                spec?.Confidence is not null, meanSquareE, meanSquareN);
        }
        return (standard, confidence);
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

    /// <summary>
    /// The figures again without the flagged fixes. Only RMSE_r, nssda95 and the vertical RMSE are shown, so only they
    /// are recomputed — by the same estimators and sums, in the same order, as <see cref="HorizontalAccuracy.Compute"/>
    /// and <see cref="SampleMoments.RootMeanSquareAboutZero"/> (FGDC-STD-007.3-1998 appendix 3-A), without its sort.
    /// </summary>
    private static OutlierSensitivity? Sensitivity(ResidualColumns columns, HorizontalAccuracy horizontal, VerticalAccuracy? vertical, IReadOnlyList<CheckResult> checks)
    {
        var flagged = checks.FirstOrDefault(c => c.Id == "outliers")?.Items;
        if (flagged is null || flagged.Count == 0)
            return null;
        var set = flagged.ToHashSet(StringComparer.Ordinal).GetAlternateLookup<ReadOnlySpan<char>>();
        var rows = columns.Rows;
        // Which rows stay is looked up side by side (one slot each); the kept values are then gathered in row order.
        var keptRow = new bool[rows.Count];
        ParallelWork.ForRanges(rows.Count, (start, end) =>
        {
            for (var i = start; i < end; i++)
                keptRow[i] = !set.Contains(columns.FixIdTextOf(i));
        });
        var keptE = new List<double>(rows.Count);
        var keptN = new List<double>(rows.Count);
        for (var i = 0; i < rows.Count; i++)
        {
            if (!keptRow[i])
                continue;
            keptE.Add(columns.East[i]);
            keptN.Add(columns.North[i]);
        }
        var keptUp = new List<double>(columns.Up.Length);
        for (var j = 0; j < columns.Up.Length; j++)
        {
            if (keptRow[columns.UpRows[j]])
                keptUp.Add(columns.Up[j]);
        }
        double? rmseRWithout = null, nssda95Without = null;
        if (keptE.Count > 0)
        {
            double meanSquareE = SampleMoments.MeanSquareAboutZero(CollectionsMarshal.AsSpan(keptE));
            double meanSquareN = SampleMoments.MeanSquareAboutZero(CollectionsMarshal.AsSpan(keptN));
            rmseRWithout = Math.Sqrt(meanSquareE + meanSquareN);
            nssda95Without = Nssda.Horizontal(Math.Sqrt(meanSquareE), Math.Sqrt(meanSquareN)).Accuracy95Metres;
        }
        return new OutlierSensitivity(flagged, horizontal.RmseR, rmseRWithout, horizontal.Nssda95, nssda95Without,
            vertical?.Rmse, vertical is null || keptUp.Count == 0 ? null : SampleMoments.RootMeanSquareAboutZero(CollectionsMarshal.AsSpan(keptUp)));
    }
}
