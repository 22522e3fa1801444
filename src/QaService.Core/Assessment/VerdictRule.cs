using QaService.Core.Reporting;
using QaService.Core.Statistics;

namespace QaService.Core.Assessment;

/// <summary>
/// api-v1 "verdict": inconclusive when the data cannot support a claim (fewer than the standard's
/// minimum of paired check points, no spec, a spec figure that could not be tested, or a failed check);
/// otherwise fail when a spec figure is exceeded, pass when every given figure is met.
/// </summary>
public static class VerdictRule
{
    public static (Verdict Verdict, SpecSummary? Spec) Decide(
        RequiredAccuracy? spec, HorizontalAccuracy? horizontal, VerticalAccuracy? vertical, IReadOnlyList<CheckResult> checks)
    {
        if (spec is null || (spec.HorizontalMetres is null && spec.VerticalMetres is null))
            return (Verdict.Inconclusive, spec is null ? null : new SpecSummary(spec.Standard, null, null, null, null));

        bool? horizontalMet = spec.HorizontalMetres is { } h && horizontal is not null ? horizontal.Nssda95 <= h : null;
        bool? verticalMet = spec.VerticalMetres is { } v && vertical is not null ? vertical.Nssda95 <= v : null;
        var summary = new SpecSummary(spec.Standard, spec.HorizontalMetres, spec.VerticalMetres, horizontalMet, verticalMet);

        var untested = (spec.HorizontalMetres is not null && horizontalMet is null) || (spec.VerticalMetres is not null && verticalMet is null);
        var tooFew = checks.Any(c => c.Id == "min-points" && c.Status == CheckStatus.Fail);
        if (tooFew || untested)
            return (Verdict.Inconclusive, summary);
        if (horizontalMet == false || verticalMet == false)
            return (Verdict.Fail, summary);
        return checks.Any(c => c.Status == CheckStatus.Fail)
            ? (Verdict.Inconclusive, summary)
            : (Verdict.Pass, summary);
    }
}
