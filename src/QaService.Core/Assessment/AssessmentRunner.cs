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
        var markIndex = new Dictionary<string, int>(StringComparer.Ordinal);
        for (var i = 0; i < input.Marks.Count; i++)
            markIndex[input.Marks[i].Id] = i;

        var (pairs, unpaired) = MarkPairing.Pair(input, markGeocentric);
        var residuals = Residuals(input, pairs, markGeocentric, markIndex, ellipsoid);
        var pairCount = pairs.Count;
        // Without exclusions every residual counts: the same list, not a copy of a million references.
        var counted = residuals.Count(r => r.Excluded is not null) == 0 ? residuals : residuals.Where(r => r.Excluded is null).ToList();
        var precision = RepeatOccupations.Precision(counted);
        // Summarised now, so the pairs can be collected before the statistics and the checks run.
        var pairing = Summarise(input.Occupations, pairs, precision);
        var included = input.Occupations == OccupationMode.Mean ? RepeatOccupations.Means(counted) : counted;

        var horizontal = included.Count == 0
            ? null
            : HorizontalAccuracy.Compute(included.Select(r => r.DE).ToArray(), included.Select(r => r.DN).ToArray());
        var up = input.HasVerticalComparison ? included.Where(r => r.DU is not null).Select(r => r.DU!.Value).ToArray() : [];
        var vertical = up.Length == 0 ? null : VerticalAccuracy.Compute(up);

        var context = new CheckContext(input, included, horizontal, vertical);
        var checks = DataChecks.All.Select(check => check.Evaluate(context)).ToList();
        var figures = ReportFigures.Compute(input, included, horizontal, vertical, checks);
        var (verdict, spec) = VerdictRule.Decide(input.Spec, horizontal, vertical, checks, figures.Standard);
        var minimumPoints = AccuracyStandards.MinimumPoints(input.Spec?.Standard);

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
            pairing);
    }

    /// <summary>One residual per pair, in pair order, into a list of exactly that size.</summary>
    private static List<Residual> Residuals(ValidatedAssessment input, IReadOnlyList<MarkFixPair> pairs, GeocentricCoordinate[] markGeocentric,
        Dictionary<string, int> markIndex, Ellipsoid ellipsoid)
    {
        var residuals = new List<Residual>(pairs.Count);
        var exclusions = input.ExclusionReasonsByFixId;
        foreach (var p in pairs)
        {
            residuals.Add(ResidualComputation.Compute(p, markGeocentric[markIndex[p.Mark.Id]], ellipsoid,
                exclusions.Count == 0 ? null : exclusions.GetValueOrDefault(p.Fix.Id)));
        }
        return residuals;
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
