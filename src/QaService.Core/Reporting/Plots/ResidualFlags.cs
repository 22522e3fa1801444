namespace QaService.Core.Reporting.Plots;

/// <summary>Which findings point at each residual: the ids of checks not passed whose items name its fix or mark.</summary>
public static class ResidualFlags
{
    /// <summary>Flag of a residual left out of the statistics by request.</summary>
    public const string ExcludedFlag = "excluded";

    /// <summary>One list per residual, in the report's order; an excluded residual carries <see cref="ExcludedFlag"/> first.</summary>
    public static IReadOnlyList<IReadOnlyList<string>> For(AssessmentReport report)
    {
        var findings = report.Checks
            .Where(c => c.Status != CheckStatus.Pass && c.Items is { Count: > 0 })
            .Select(c => (c.Id, Items: c.Items!.ToHashSet(StringComparer.Ordinal)))
            .ToList();
        return report.Residuals
            .Select(r =>
            {
                var flags = findings.Where(f => f.Items.Contains(r.Fix) || f.Items.Contains(r.Mark)).Select(f => f.Id).ToList();
                if (r.Excluded is not null)
                    flags.Insert(0, ExcludedFlag);
                return (IReadOnlyList<string>)flags;
            })
            .ToList();
    }
}
