using QaService.Core.Reporting;
using QaService.Core.Statistics;

namespace QaService.Core.Assessment;

/// <summary>
/// Repeat occupations of one mark: their precision (scatter about their own mean) and, on request,
/// their mean as one test point. Residuals are in east-north-up at the mark, a linear frame, so the mean
/// of the residuals is the residual of the mean position (exact, no approximation).
/// </summary>
public static class RepeatOccupations
{
    /// <summary>Precision per mark with at least two counted occupations, in mark order of first appearance.</summary>
    public static IReadOnlyList<OccupationPrecision> Precision(IReadOnlyList<Residual> included) =>
        Precision(ResidualColumns.Of([], included));

    /// <summary>The same from the counted residuals' columns (each mark's values taken in residual order).</summary>
    internal static IReadOnlyList<OccupationPrecision> Precision(ResidualColumns counted)
    {
        var (groups, east, north) = (counted.Groups, counted.East, counted.North);
        // dU read from the column when every residual (or none) has one; otherwise from each residual.
        var upColumn = counted.Up.Length == east.Length ? counted.Up : null;
        var result = new List<OccupationPrecision>();
        for (var g = 0; g < groups.Count; g++)
        {
            var members = groups.Members(g);
            if (members.Length < 2)
                continue;
            var e = new double[members.Length];
            var n = new double[members.Length];
            var u = new List<double>(counted.Up.Length == 0 ? 0 : members.Length);
            for (var k = 0; k < members.Length; k++)
            {
                var row = members[k];
                e[k] = east[row];
                n[k] = north[row];
                if (upColumn is not null)
                    u.Add(upColumn[row]);
                else if (counted.Up.Length > 0 && counted.Rows[row].DU is { } up)
                    u.Add(up);
            }
            var upValues = System.Runtime.InteropServices.CollectionsMarshal.AsSpan(u);
            var sdE = SampleMoments.SampleStandardDeviation(e);
            var sdN = SampleMoments.SampleStandardDeviation(n);
            result.Add(new OccupationPrecision(groups.MarkIds[g], e.Length, SampleMoments.Mean(e), SampleMoments.Mean(n),
                upValues.Length == 0 ? null : SampleMoments.Mean(upValues),
                sdE, sdN, upValues.Length >= 2 ? SampleMoments.SampleStandardDeviation(upValues) : null,
                Math.Sqrt(sdE * sdE + sdN * sdN)));
        }
        return result;
    }

    /// <summary>One residual per mark: the mean of its counted occupations (a mark with one occupation keeps it).</summary>
    public static IReadOnlyList<Residual> Means(IReadOnlyList<Residual> included) => Means(included, MarkGroups.ById(included));

    /// <summary>The same for residuals already grouped by mark.</summary>
    internal static IReadOnlyList<Residual> Means(IReadOnlyList<Residual> included, MarkGroups groups)
    {
        var result = new List<Residual>(groups.Count);
        for (var g = 0; g < groups.Count; g++)
        {
            var list = new List<Residual>(groups.Members(g).Length);
            foreach (var i in groups.Members(g))
                list.Add(included[i]);
            result.Add(Mean(list));
        }
        return result;
    }

    private static Residual Mean(List<Residual> list)
    {
        if (list.Count == 1)
            return list[0];
        var e = list.Average(r => r.DE);
        var n = list.Average(r => r.DN);
        double? u = list.All(r => r.DU is not null) ? list.Average(r => r.DU!.Value) : null;
        var pairedBy = list.All(r => r.PairedBy == list[0].PairedBy) ? list[0].PairedBy : "mixed";
        return list[0] with
        {
            Fix = InvariantText.Format($"mean of {list.Count} occupations"),
            DE = e, DN = n, DU = u, DH = Math.Sqrt(e * e + n * n), PairedBy = pairedBy,
        };
    }
}
