using QaService.Core.Reporting;
using QaService.Core.Standards;
using QaService.Core.Statistics;

namespace QaService.Core.Assessment;

/// <summary>
/// The report's <c>groups</c>: the counted pairs split by each fix attribute present, each group's figures computed by the
/// same code as the top-level blocks (<see cref="HorizontalAccuracy.Compute"/>, <see cref="VerticalAccuracy.Compute"/>,
/// <see cref="ReportFigures.Judge"/>, <see cref="VerdictRule.Decide"/>), and tests of whether the groups differ.
/// Linear in the pairs: one pass assigns every row its group per attribute, a counting sort lays the rows out group by
/// group, and each group's components are gathered once into arrays of its own size (the figures need them as arrays).
/// </summary>
public static class AttributeGrouping
{
    public const string SpreadMethod =
        "Brown–Forsythe: Levene's test on absolute deviations from each group's median (Levene 1960; Brown & Forsythe 1974), F(k − 1, N − k)";

    public const string MeansMethod = "Welch's one-way test of equal means without equal variances (Welch 1951), F(k − 1, ν₂)";

    /// <summary>The groups of any list of counted residuals (benchmarks, tests); the runner passes the columns it already has.</summary>
    public static IReadOnlyList<AttributeGroups>? Compute(ValidatedAssessment input, IReadOnlyList<Residual> included) =>
        Compute(input, ResidualColumns.Of(input.Marks, included));

    internal static IReadOnlyList<AttributeGroups>? Compute(ValidatedAssessment input, ResidualColumns columns)
    {
        var n = columns.Rows.Count;
        var attributeCount = FixAttributes.GroupingNames.Count;
        // Group of every row per attribute (−1: no value); values in order of first appearance.
        int[][]? groupOf = null;
        var values = new List<string>[attributeCount];
        var lookups = new Dictionary<string, int>[attributeCount];
        for (var a = 0; a < attributeCount; a++)
        {
            values[a] = [];
            lookups[a] = new Dictionary<string, int>(StringComparer.Ordinal);
        }
        for (var i = 0; i < n; i++)
        {
            if (columns.AttributesOf(i) is not { } attributes)
                continue;
            for (var a = 0; a < attributeCount; a++)
            {
                if (attributes.Grouping(a) is not { } value)
                    continue;
                groupOf ??= NewGroupTable(attributeCount, n);
                if (!lookups[a].TryGetValue(value, out var g))
                {
                    g = values[a].Count;
                    lookups[a][value] = g;
                    values[a].Add(value);
                }
                groupOf[a][i] = g;
            }
        }
        if (groupOf is null)
            return null;

        // Row → its index in the Up column (−1 without a height), built once for all attributes.
        var upIndexOfRow = new int[n];
        Array.Fill(upIndexOfRow, -1);
        for (var j = 0; j < columns.UpRows.Length; j++)
            upIndexOfRow[columns.UpRows[j]] = j;

        var marksById = new Dictionary<string, FramedPoint>(StringComparer.Ordinal);
        foreach (var mark in input.Marks)
            marksById.TryAdd(mark.Id, mark);

        var result = new List<AttributeGroups>();
        for (var a = 0; a < attributeCount; a++)
        {
            if (values[a].Count > 0)
                result.Add(ForAttribute(input, columns, FixAttributes.GroupingNames[a], values[a], groupOf[a], upIndexOfRow, marksById));
        }
        return result;
    }

    private static int[][] NewGroupTable(int attributes, int rows)
    {
        var table = new int[attributes][];
        for (var a = 0; a < attributes; a++)
        {
            table[a] = new int[rows];
            Array.Fill(table[a], -1);
        }
        return table;
    }

    private static AttributeGroups ForAttribute(ValidatedAssessment input, ResidualColumns columns, string attribute, List<string> values, int[] groupOf,
        int[] upIndexOfRow, Dictionary<string, FramedPoint> marksById)
    {
        var k = values.Count;
        // Counting sort of the rows by group: start offsets, then each row in its group's run, row order kept inside a group.
        var counts = new int[k];
        var without = 0;
        foreach (var g in groupOf)
        {
            if (g < 0) without++;
            else counts[g]++;
        }
        var starts = new int[k + 1];
        for (var g = 0; g < k; g++)
            starts[g + 1] = starts[g] + counts[g];
        var order = new int[starts[k]];
        var next = (int[])starts.Clone();
        for (var i = 0; i < groupOf.Length; i++)
        {
            if (groupOf[i] >= 0)
                order[next[groupOf[i]]++] = i;
        }

        var groups = new AttributeGroup[k];
        var (eastByGroup, northByGroup, radialByGroup, upByGroup) = (new double[k][], new double[k][], new double[k][], new double[k][]);
        // Each group is gathered and judged on its own (one slot each), side by side when the rows are many.
        ParallelWork.Invoke(order.Length >= ParallelWork.MinimumRange, [.. Enumerable.Range(0, k).Select(g => (Action)(() =>
        {
            var members = order.AsSpan(starts[g], counts[g]);
            (eastByGroup[g], northByGroup[g], radialByGroup[g], upByGroup[g]) = Gather(columns, members, upIndexOfRow);
            groups[g] = Judge(input, columns, attribute, values[g], members, eastByGroup[g], northByGroup[g], radialByGroup[g], upByGroup[g], marksById);
        }))]);

        var tests = new List<GroupDifference>();
        AddTest(tests, "equal-spread", "dH", SpreadMethod, radialByGroup, GroupComparison.BrownForsythe, minimum: 2);
        AddTest(tests, "equal-means", "dE", MeansMethod, eastByGroup, GroupComparison.Welch, minimum: 2);
        AddTest(tests, "equal-means", "dN", MeansMethod, northByGroup, GroupComparison.Welch, minimum: 2);
        if (input.HasVerticalComparison)
        {
            AddTest(tests, "equal-spread", "dU", SpreadMethod, upByGroup, GroupComparison.BrownForsythe, minimum: 2);
            AddTest(tests, "equal-means", "dU", MeansMethod, upByGroup, GroupComparison.Welch, minimum: 2);
        }
        return new AttributeGroups(attribute, groups, without, tests);
    }

    /// <summary>The group's components as arrays of its own size, in row order.</summary>
    private static (double[] East, double[] North, double[] Radial, double[] Up) Gather(ResidualColumns columns, ReadOnlySpan<int> members, int[] upIndexOfRow)
    {
        var east = new double[members.Length];
        var north = new double[members.Length];
        var radial = new double[members.Length];
        var withHeight = 0;
        for (var m = 0; m < members.Length; m++)
        {
            var row = members[m];
            east[m] = columns.East[row];
            north[m] = columns.North[row];
            radial[m] = columns.Radial[row];
            withHeight += upIndexOfRow[row] >= 0 ? 1 : 0;
        }
        var up = new double[withHeight];
        for (int m = 0, j = 0; m < members.Length; m++)
        {
            if (upIndexOfRow[members[m]] is var u && u >= 0)
                up[j++] = columns.Up[u];
        }
        return (east, north, radial, up);
    }

    /// <summary>
    /// One group's figures and verdict. A featureClass group is judged against spec.featureClasses[value] when the spec
    /// names it; any other group (and an unnamed class) against the top-level spec. Below the standard's minimum number
    /// of points the verdict is inconclusive, as at top level. The data checks run on the whole set, not per group.
    /// </summary>
    private static AttributeGroup Judge(ValidatedAssessment input, ResidualColumns columns, string attribute, string value, ReadOnlySpan<int> members,
        double[] east, double[] north, double[] radial, double[] up, Dictionary<string, FramedPoint> marksById)
    {
        var horizontal = HorizontalAccuracy.Compute(east, north);
        var vertical = up.Length == 0 ? null : VerticalAccuracy.Compute(up);
        var spec = input.Spec;
        var source = spec is null ? "none" : "spec";
        if (spec is not null && attribute == "featureClass" && spec.FeatureClasses?.GetValueOrDefault(value) is { } own)
        {
            spec = spec with { HorizontalMetres = own.HorizontalMetres, VerticalMetres = own.VerticalMetres };
            source = "spec.featureClasses." + value;
        }
        var marks = new List<FramedPoint>();
        var seen = new HashSet<string>(StringComparer.Ordinal);
        foreach (var row in members)
        {
            var markId = columns.MarkIdOf(row);
            if (seen.Add(markId) && marksById.TryGetValue(markId, out var mark))
                marks.Add(mark);
        }
        var (standard, _) = ReportFigures.Judge(spec, input.MarksFrame.Crs.Unit, horizontal, vertical, radial, up, marks,
            SampleMoments.MeanSquareAboutZero(east), SampleMoments.MeanSquareAboutZero(north), alwaysConfidence: false);
        var (verdict, summary) = VerdictRule.Decide(spec, horizontal, vertical, [], standard);
        if (members.Length < AccuracyStandards.MinimumPoints(spec?.Standard))
            verdict = Verdict.Inconclusive;
        return new AttributeGroup(value, members.Length, horizontal, vertical, verdict, summary, source);
    }

    private static void AddTest(List<GroupDifference> tests, string hypothesis, string quantity, string method, double[][] groups,
        Func<IReadOnlyList<double[]>, GroupTestResult?> test, int minimum)
    {
        var usable = groups.Where(g => g.Length >= minimum).ToList();
        if (usable.Count < 2 || test(usable) is not { } result)
            return;
        tests.Add(new GroupDifference(hypothesis, quantity, method, usable.Count, result.Statistic, result.DegreesOfFreedom1, result.DegreesOfFreedom2, result.PValue));
    }
}
