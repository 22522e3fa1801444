using QaService.Core.Assessment;
using QaService.Core.Reporting;
using QaService.Core.Statistics;

namespace QaService.Core.Diagnosis;

/// <summary>Everything a check may look at: the validated input, the residuals that count, the figures.</summary>
/// <param name="Included">Residuals used in the statistics (paired, not excluded).</param>
public sealed record CheckContext(
    ValidatedAssessment Input,
    IReadOnlyList<Residual> Included,
    HorizontalAccuracy? Horizontal,
    VerticalAccuracy? Vertical)
{
    private ResidualColumns? columns;

    /// <summary>A copy (<c>with</c>) leaves the columns behind: they belong to the original's residuals.</summary>
    private CheckContext(CheckContext original)
    {
        Input = original.Input;
        Included = original.Included;
        Horizontal = original.Horizontal;
        Vertical = original.Vertical;
    }

    /// <summary>
    /// <see cref="Included"/> as arrays with the results several checks share; the runner hands over the ones it built,
    /// otherwise they are made from <see cref="Included"/> on first use.
    /// </summary>
    internal ResidualColumns Columns
    {
        get => LazyInitializer.EnsureInitialized(ref columns, () => ResidualColumns.Of(Input.Marks, Included));
        init => columns = value;
    }
}

/// <summary>One diagnosis of the data. A check never throws for odd data: it reports it.</summary>
public interface IDataCheck
{
    /// <summary>Stable id as listed in api-v1 "Check ids" (plus the service's own: <c>datum-mismatch</c>, <c>units</c>).</summary>
    string Id { get; }

    CheckResult Evaluate(CheckContext context);
}

/// <summary>The checks every assessment runs, in report order.</summary>
public static class DataChecks
{
    public static IReadOnlyList<IDataCheck> All { get; } =
    [
        new MinPointsCheck(),
        new DistributionCheck(),
        new BiasCheck(),
        new DatumMismatchCheck(),
        new UnitsCheck(),
        new OutlierCheck(),
        new HeightReferenceCheck(),
        new ReferenceAccuracyCheck(),
        new AreaOfUseCheck(),
    ];
}
