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

        var paired = MarkPairing.PairByRows(input, markGeocentric);
        var residuals = ResidualTable.Compute(input, paired, markGeocentric, ellipsoid);
        var counted = residuals.Counted();
        // Grouped by mark row once: the repeat occupations, the statistics, the checks and the report figures all read
        // the same columns (the table's own arrays, not copies).
        var countedGroups = MarkGroups.ByRow(counted.MarkRows, input.Marks);
        var countedColumns = ResidualColumns.Of(input.Marks, counted, countedGroups);
        var precision = RepeatOccupations.Precision(countedColumns);
        var pairing = Summarise(input, paired, precision);
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
            new ReportCounts(input.Marks.Count, input.Fixes.Count, residuals.Count, paired.Unpaired, residuals.Count - counted.Count),
            horizontal,
            vertical,
            input.Occupations == OccupationMode.Mean ? [.. included, .. residuals.ExcludedRows()] : residuals,
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

    /// <summary>The pairing block, or null when there is nothing to say beyond the residuals.</summary>
    private static PairingSummary? Summarise(ValidatedAssessment input, MarkPairing.PairRows pairs, IReadOnlyList<OccupationPrecision> precision)
    {
        var ambiguous = pairs.AmbiguousByPair.OrderBy(a => a.Key)
            .Select(a => new AmbiguousPairing(input.Fixes[pairs.FixRows[a.Key]].Id, input.Marks[pairs.MarkRows[a.Key]].Id, a.Value))
            .ToList();
        if (input.Occupations == OccupationMode.Each && ambiguous.Count == 0 && precision.Count == 0)
            return null;
        return new PairingSummary(input.Occupations == OccupationMode.Mean ? "mean" : "each", ambiguous, precision);
    }
}
