using QaService.Core.Reporting;
using QaService.Core.Standards;
using QaService.Core.Statistics;

namespace QaService.Core.Assessment;

/// <summary>
/// api-v1 "verdict": inconclusive when the data cannot support a claim (fewer than the standard's
/// minimum of paired check points, no spec, a spec figure that could not be tested, or a failed check);
/// otherwise fail when a spec figure is exceeded, pass when every given figure is met.
/// For <c>nssda</c> the figures are the contract's nssda95; for another standard, its judged figures
/// (<see cref="StandardResult"/>). With spec.confidence, a figure met by its point estimate but not by its upper
/// confidence bound makes the verdict inconclusive.
/// </summary>
public static class VerdictRule
{
    public static (Verdict Verdict, SpecSummary? Spec) Decide(
        RequiredAccuracy? spec, HorizontalAccuracy? horizontal, VerticalAccuracy? vertical, IReadOnlyList<CheckResult> checks,
        StandardResult? standard = null)
    {
        if (spec is null || (spec.HorizontalMetres is null && spec.VerticalMetres is null && !IsMapStandard(spec)))
            return (Verdict.Inconclusive, spec is null ? null : new SpecSummary(spec.Standard, null, null, null, null, spec.Confidence));

        bool? horizontalMet, verticalMet;
        bool? horizontalAtConfidence = null, verticalAtConfidence = null;
        bool horizontalRequired, verticalRequired;
        if (standard is null || standard.Id == AccuracyStandards.NssdaId && spec.Confidence is null)
        {
            horizontalMet = spec.HorizontalMetres is { } h && horizontal is not null ? horizontal.Nssda95 <= h : null;
            verticalMet = spec.VerticalMetres is { } v && vertical is not null ? vertical.Nssda95 <= v : null;
            horizontalRequired = spec.HorizontalMetres is not null;
            verticalRequired = spec.VerticalMetres is not null;
        }
        else
        {
            horizontalMet = standard.HorizontalMet;
            verticalMet = standard.VerticalMet;
            horizontalAtConfidence = AtConfidence(standard, "horizontal");
            verticalAtConfidence = AtConfidence(standard, "vertical");
            horizontalRequired = IsMapStandard(spec) ? spec.MapScaleDenominator is not null : spec.HorizontalMetres is not null;
            verticalRequired = IsMapStandard(spec) ? spec.ContourIntervalMetres is not null : spec.VerticalMetres is not null;
        }
        var summary = new SpecSummary(spec.Standard, spec.HorizontalMetres, spec.VerticalMetres, horizontalMet, verticalMet,
            spec.Confidence, horizontalAtConfidence, verticalAtConfidence);

        var untested = (horizontalRequired && horizontalMet is null) || (verticalRequired && verticalMet is null);
        var tooFew = checks.Any(c => c.Id == "min-points" && c.Status == CheckStatus.Fail);
        if (tooFew || untested)
            return (Verdict.Inconclusive, summary);
        if (horizontalMet == false || verticalMet == false)
            return (Verdict.Fail, summary);
        if (horizontalAtConfidence == false || verticalAtConfidence == false)
            return (Verdict.Inconclusive, summary);
        return checks.Any(c => c.Status == CheckStatus.Fail)
            ? (Verdict.Inconclusive, summary)
            : (Verdict.Pass, summary);
    }

    private static bool IsMapStandard(RequiredAccuracy spec) => spec.Standard == AccuracyStandards.NmasId;

    private static bool? AtConfidence(StandardResult standard, string axis)
    {
        var judged = standard.Figures.Where(f => f.Judged && f.Axis == axis && f.MetAtConfidence is not null).ToList();
        return judged.Count == 0 ? null : judged.All(f => f.MetAtConfidence == true);
    }
}
