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
        included.GroupBy(r => r.Mark, StringComparer.Ordinal)
            .Where(g => g.Count() >= 2)
            .Select(g =>
            {
                var e = g.Select(r => r.DE).ToArray();
                var n = g.Select(r => r.DN).ToArray();
                var u = g.Where(r => r.DU is not null).Select(r => r.DU!.Value).ToArray();
                var sdE = SampleMoments.SampleStandardDeviation(e);
                var sdN = SampleMoments.SampleStandardDeviation(n);
                return new OccupationPrecision(g.Key, e.Length, SampleMoments.Mean(e), SampleMoments.Mean(n),
                    u.Length == 0 ? null : SampleMoments.Mean(u),
                    sdE, sdN, u.Length >= 2 ? SampleMoments.SampleStandardDeviation(u) : null,
                    Math.Sqrt(sdE * sdE + sdN * sdN));
            })
            .ToList();

    /// <summary>One residual per mark: the mean of its counted occupations (a mark with one occupation keeps it).</summary>
    public static IReadOnlyList<Residual> Means(IReadOnlyList<Residual> included) =>
        included.GroupBy(r => r.Mark, StringComparer.Ordinal)
            .Select(g =>
            {
                var list = g.ToList();
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
            })
            .ToList();
}
