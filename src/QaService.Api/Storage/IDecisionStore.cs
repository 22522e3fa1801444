using QaService.Core.SignOff;

namespace QaService.Api.Storage;

/// <summary>Sign-off decisions on reports: append-only (there is no update or delete); they go when their report goes.</summary>
public interface IDecisionStore
{
    /// <summary>Appends a decision to the tenant's report; false (nothing stored) when that report does not exist.</summary>
    Task<bool> AddAsync(string tenant, string reportId, SignOffDecision decision, CancellationToken cancellationToken);

    /// <summary>The report's decisions, oldest first (empty when none, or no such report).</summary>
    Task<IReadOnlyList<SignOffDecision>> ListAsync(string tenant, string reportId, CancellationToken cancellationToken);
}
