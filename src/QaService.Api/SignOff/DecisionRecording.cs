using QaService.Api.Storage;
using QaService.Core.Assessment;
using QaService.Core.SignOff;

namespace QaService.Api.SignOff;

/// <summary>What recording a decision came to: the decision, the input errors, or no such report.</summary>
internal sealed record DecisionOutcome(SignOffDecision? Recorded, IReadOnlyList<InputError> Errors, bool NotFound);

/// <summary>
/// Records a sign-off decision for the API and the report page's form alike: validate, hash the stored report bytes,
/// append. The hash is taken from the store, so it is of what GET returns, not of a re-serialisation.
/// </summary>
internal sealed class DecisionRecording(IReportStore reports, IDecisionStore decisions, TimeProvider clock)
{
    public async Task<DecisionOutcome> RecordAsync(string tenant, string reportId, DecisionRequest? request, CancellationToken cancellationToken)
    {
        var (valid, errors) = DecisionValidator.Validate(request);
        if (valid is null)
            return new DecisionOutcome(null, errors, false);
        var sha256 = await ReportHash.OfStoredAsync(reports, tenant, reportId, cancellationToken);
        if (sha256 is null)
            return new DecisionOutcome(null, [], true);
        // Whole milliseconds: both stores keep them exactly (PostgreSQL timestamptz holds microseconds), so 201 and GET agree.
        var now = clock.GetUtcNow();
        var decision = new SignOffDecision(valid.Decision!, valid.By!, valid.Comment, now.AddTicks(-(now.Ticks % TimeSpan.TicksPerMillisecond)), sha256);
        return await decisions.AddAsync(tenant, reportId, decision, cancellationToken)
            ? new DecisionOutcome(decision, [], false)
            : new DecisionOutcome(null, [], true);
    }
}
