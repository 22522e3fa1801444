using QaService.Core.Reporting;

namespace QaService.Core.Assessment;

/// <summary>
/// Residuals grouped by the mark they test, the groups numbered in order of each mark's first appearance and each
/// group's members kept in residual order — the grouping LINQ's GroupBy gives, which the report's per-mark lists and
/// sums follow, without a hash lookup and a list per residual (a 400,000-fix upload has 2,000 marks).
/// </summary>
internal sealed class MarkGroups
{
    private readonly int[] memberOrder;
    private readonly int[] groupStart;

    private MarkGroups(int[] groupOf, List<string> markIds)
    {
        GroupOf = groupOf;
        MarkIds = markIds;
        // Members by group, each group's in residual order (a stable counting sort).
        groupStart = new int[markIds.Count + 1];
        foreach (var g in groupOf)
            groupStart[g + 1]++;
        for (var g = 0; g < markIds.Count; g++)
            groupStart[g + 1] += groupStart[g];
        var next = groupStart[..^1];
        memberOrder = new int[groupOf.Length];
        for (var i = 0; i < groupOf.Length; i++)
            memberOrder[next[groupOf[i]]++] = i;
    }

    /// <summary>Group number of each residual.</summary>
    public int[] GroupOf { get; }

    /// <summary>Mark id of each group (that of its first residual).</summary>
    public IReadOnlyList<string> MarkIds { get; }

    public int Count => MarkIds.Count;

    /// <summary>Indices of the residuals of group <paramref name="group"/>, ascending.</summary>
    public ReadOnlySpan<int> Members(int group) => memberOrder.AsSpan(groupStart[group], groupStart[group + 1] - groupStart[group]);

    /// <summary>Grouped by the row of each residual's mark in the request's marks (ids are unique, so a row is an id).</summary>
    /// <param name="markRows">Row in <paramref name="marks"/> of residual i's mark.</param>
    /// <param name="marks">The request's marks, whose ids name the groups (read from the list: no residual object is made).</param>
    public static MarkGroups ByRow(ReadOnlySpan<int> markRows, IReadOnlyList<FramedPoint> marks)
    {
        var groupOfRow = new int[marks.Count];
        Array.Fill(groupOfRow, -1);
        var groupOf = new int[markRows.Length];
        var markIds = new List<string>();
        for (var i = 0; i < groupOf.Length; i++)
        {
            ref var group = ref groupOfRow[markRows[i]];
            if (group < 0)
            {
                group = markIds.Count;
                markIds.Add(marks[markRows[i]].Id);
            }
            groupOf[i] = group;
        }
        return new MarkGroups(groupOf, markIds);
    }

    /// <summary>Grouped by mark id (ordinal), for residuals whose mark rows are not known.</summary>
    public static MarkGroups ById(IReadOnlyList<Residual> residuals)
    {
        var groupOfId = new Dictionary<string, int>(StringComparer.Ordinal);
        var groupOf = new int[residuals.Count];
        var markIds = new List<string>();
        for (var i = 0; i < groupOf.Length; i++)
        {
            var mark = residuals[i].Mark;
            if (!groupOfId.TryGetValue(mark, out var group))
            {
                group = markIds.Count;
                groupOfId.Add(mark, group);
                markIds.Add(mark);
            }
            groupOf[i] = group;
        }
        return new MarkGroups(groupOf, markIds);
    }
}
