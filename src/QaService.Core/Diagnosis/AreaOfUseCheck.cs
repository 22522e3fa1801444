using System.Globalization;
using QaService.Core.Reporting;

namespace QaService.Core.Diagnosis;

/// <summary>
/// Marks and fixes inside the EPSG areas of use of their CRSs and of the datum operation that joined them
/// (EPSG Guidance Note 7-1 §7: an operation's parameters are only defined for its area of use; outside, the result
/// is an extrapolation). Warns, naming the area and the point ids, rather than failing: the figures are still
/// computed, but an offset there may be the operation's, not the survey's.
/// </summary>
public sealed class AreaOfUseCheck : IDataCheck
{
    /// <summary>How many point ids a message names before "and n more".</summary>
    private const int IdsListed = 5;

    public string Id => "area-of-use";

    public CheckResult Evaluate(CheckContext context)
    {
        var warnings = context.Input.AreaWarnings;
        var outside = warnings.SelectMany(w => w.Ids.Select(id => (w.Side, id))).Distinct().Count();
        if (warnings.Count == 0)
            return new CheckResult(Id, CheckStatus.Pass, "every mark and fix lies inside the areas of use of its CRS and of the datum operation applied", 0, 0, "points");
        var text = string.Join("; ", warnings.Select(w => string.Create(CultureInfo.InvariantCulture,
            $"{w.Side}: {w.Message} (ids {string.Join(", ", w.Ids.Take(IdsListed))}{(w.Ids.Count > IdsListed ? $" and {w.Ids.Count - IdsListed} more" : "")})")));
        return new CheckResult(Id, CheckStatus.Warn, text + ". Choose an operation whose area covers the survey (fixes.operationCode) or check the CRS", outside, 0, "points");
    }
}
