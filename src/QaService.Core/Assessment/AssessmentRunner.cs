using System.Runtime.InteropServices;
using QaService.Core.Diagnosis;
using QaService.Core.Geodesy;
using QaService.Core.Reporting;
using QaService.Core.Standards;
using QaService.Core.Statistics;

namespace QaService.Core.Assessment;

/// <summary>
/// Runs one assessment: pairing → residuals in ENU at each mark → statistics → checks → verdict.
/// Pure: the same input, id and time give the same report.
/// </summary>
public static class AssessmentRunner
{
    public static AssessmentReport Run(ValidatedAssessment input, string id, DateTimeOffset createdAt)
    {
        var ellipsoid = input.MarksFrame.Crs.Ellipsoid;
        var markGeocentric = input.Marks.Select(m => GeocentricConversion.ToGeocentric(m.Geodetic, ellipsoid)).ToArray();

        var (pairs, markRows, unpaired) = MarkPairing.PairWithRows(input, markGeocentric);
        var residuals = Residuals(input, pairs, markRows, markGeocentric, ellipsoid);
        var pairCount = pairs.Count;
        var (counted, countedRows) = Counted(residuals, markRows);
        // Taken apart into arrays and grouped by mark row once: the repeat occupations, the statistics, the checks and the
        // report figures all read them.
        var countedGroups = MarkGroups.ByRow(counted, countedRows, input.Marks.Count);
        var countedColumns = ResidualColumns.Of(input.Marks, counted, countedGroups);
        var precision = RepeatOccupations.Precision(countedColumns);
        // Summarised now, so the pairs can be collected before the statistics and the checks run.
        var pairing = Summarise(input.Occupations, pairs, precision);
        var included = input.Occupations == OccupationMode.Mean ? RepeatOccupations.Means(counted, countedGroups) : counted;
        var columns = ReferenceEquals(included, counted) ? countedColumns : ResidualColumns.Of(input.Marks, included);

        var horizontal = included.Count == 0 ? null : HorizontalAccuracy.Compute(columns.East, columns.North);
        var up = input.HasVerticalComparison ? columns.Up : [];
        var vertical = up.Length == 0 ? null : VerticalAccuracy.Compute(up);

        var context = new CheckContext(input, included, horizontal, vertical) { Columns = columns };
        var checks = DataChecks.All.Select(check => check.Evaluate(context)).ToList();
        var figures = ReportFigures.Compute(input, columns, horizontal, vertical, checks);
        var (verdict, spec) = VerdictRule.Decide(input.Spec, horizontal, vertical, checks, figures.Standard);
        var minimumPoints = AccuracyStandards.MinimumPoints(input.Spec?.Standard);
        var groups = AttributeGrouping.Compute(input, columns);

        return new AssessmentReport(
            id,
            input.Title,
            createdAt,
            verdict,
            new ReportCounts(input.Marks.Count, input.Fixes.Count, pairCount, unpaired, residuals.Count - counted.Count),
            horizontal,
            vertical,
            input.Occupations == OccupationMode.Mean ? [.. included, .. residuals.Where(r => r.Excluded is not null)] : residuals,
            checks,
            NssdaStatement.Compose(horizontal, vertical, input.MarksFrame.Crs.Unit),
            ReportCautions.For(verdict, included.Count, minimumPoints),
            spec,
            FrameDescription.Describe(input),
            figures.Standard,
            figures.Confidence,
            figures.Approximations,
            figures.OffsetModel,
            figures.OutlierSensitivity,
            pairing,
            Groups: groups);
    }

    /// <summary>
    /// One residual per pair, in pair order, into a list of exactly that size. Each mark's east-north-up rotation is
    /// worked out once (2,000 marks against 400,000 fixes); the fixes are then converted side by side, each residual
    /// computed alone into its own slot, so the list is the same whatever the scheduling.
    /// </summary>
    private static List<Residual> Residuals(ValidatedAssessment input, List<MarkFixPair> pairs, int[] markRows, GeocentricCoordinate[] markGeocentric,
        Ellipsoid ellipsoid)
    {
        var frames = new TopocentricFrame?[markGeocentric.Length];
        for (var i = 0; i < pairs.Count; i++)
            frames[markRows[i]] ??= TopocentricFrame.At(markGeocentric[markRows[i]], pairs[i].Mark.Geodetic);

        var residuals = new List<Residual>(pairs.Count);
        CollectionsMarshal.SetCount(residuals, pairs.Count);
        var exclusions = input.ExclusionReasonsByFixId;
        ParallelWork.ForRanges(pairs.Count, (start, end) =>
        {
            var slots = CollectionsMarshal.AsSpan(residuals);
            var pairSpan = CollectionsMarshal.AsSpan(pairs);
            for (var i = start; i < end; i++)
            {
                var p = pairSpan[i];
                slots[i] = ResidualComputation.Compute(p, frames[markRows[i]]!.Value, ellipsoid,
                    exclusions.Count == 0 ? null : exclusions.GetValueOrDefault(p.Fix.Id));
            }
        });
        return residuals;
    }

    /// <summary>
    /// The residuals that count and their mark rows. Without exclusions every residual counts: the same list, not a copy
    /// of a million references.
    /// </summary>
    private static (List<Residual> Counted, int[] Rows) Counted(List<Residual> residuals, int[] markRows)
    {
        if (residuals.TrueForAll(r => r.Excluded is null))
            return (residuals, markRows);
        var counted = new List<Residual>(residuals.Count);
        var rows = new List<int>(residuals.Count);
        for (var i = 0; i < residuals.Count; i++)
        {
            if (residuals[i].Excluded is null)
            {
                counted.Add(residuals[i]);
                rows.Add(markRows[i]);
            }
        }
        return (counted, rows.ToArray());
    }

    /// <summary>The pairing block, or null when there is nothing to say beyond the residuals.</summary>
    private static PairingSummary? Summarise(OccupationMode mode, IReadOnlyList<MarkFixPair> pairs, IReadOnlyList<OccupationPrecision> precision)
    {
        var ambiguous = pairs.Where(p => p.AlsoWithinRadius is { Count: > 0 })
            .Select(p => new AmbiguousPairing(p.Fix.Id, p.Mark.Id, p.AlsoWithinRadius!))
            .ToList();
        if (mode == OccupationMode.Each && ambiguous.Count == 0 && precision.Count == 0)
            return null;
        return new PairingSummary(mode == OccupationMode.Mean ? "mean" : "each", ambiguous, precision);
    }
}
