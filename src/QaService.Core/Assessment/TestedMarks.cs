using QaService.Core.Reporting;

namespace QaService.Core.Assessment;

/// <summary>The marks that at least one counted residual tests, in request order (each mark once).</summary>
public static class TestedMarks
{
    public static List<FramedPoint> Of(IReadOnlyList<FramedPoint> marks, IReadOnlyList<Residual> included)
    {
        var markIds = included.Select(r => r.Mark).ToHashSet(StringComparer.Ordinal);
        return marks.Where(m => markIds.Contains(m.Id)).ToList();
    }

    /// <summary>The same from residuals already grouped by mark: one id per mark to hash, not one per residual.</summary>
    internal static List<FramedPoint> Of(IReadOnlyList<FramedPoint> marks, MarkGroups groups)
    {
        var markIds = groups.MarkIds.ToHashSet(StringComparer.Ordinal);
        return marks.Where(m => markIds.Contains(m.Id)).ToList();
    }
}
