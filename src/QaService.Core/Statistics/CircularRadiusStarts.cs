using System.Collections.Concurrent;
using MathNet.Numerics.Interpolation;

namespace QaService.Core.Statistics;

/// <summary>
/// Starting points for <see cref="CircularErrorRadius"/>'s Newton search: for one probability p, ln ρ(q) (ρ the radius in
/// units of the major sigma, q the axis ratio) solved exactly at q = 0, 1/32, …, 1 and joined by a natural cubic spline.
/// Only the start comes from here; the search still solves P(ρ) = p to its own tolerance, so a poor start costs
/// evaluations, never accuracy. Newton's error squares at each step (Press et al., Numerical Recipes, 3rd ed., §9.4): from
/// the bracket's middle (relative error up to ~0.3) the search took 3–6 quadratures, from the spline 1–3 (measured in
/// CircularErrorRadiusTests). Built once per probability on first use (~1–2 ms, 31 exact searches). The report's own
/// probabilities (CEP, CE90, R95; NSSDA's 95 % is R95's) always get a table; other probabilities share
/// <see cref="MostOtherProbabilities"/> tables, beyond which their search starts from the bracket's middle.
/// </summary>
internal static class CircularRadiusStarts
{
    /// <summary>Intervals of the q grid (33 nodes).</summary>
    private const int Intervals = 32;

    /// <summary>Tables kept for probabilities other than the report's own (a caller's own figures).</summary>
    private const int MostOtherProbabilities = 16;

    /// <summary>CEP, CE90 and R95: the probabilities the test above always lets in.</summary>
    private const int ReportsOwnProbabilities = 3;

    private static readonly ConcurrentDictionary<double, IInterpolation> Tables = new();

    /// <summary>The tabulated ln ρ for <paramref name="probability"/> at axis ratio <paramref name="q"/> in [0, 1]; null when no table is kept for it.</summary>
    public static double? LogRadius(double probability, double q)
    {
        if (!Tables.TryGetValue(probability, out var table))
        {
            bool reportsOwn = probability is HorizontalAccuracy.CepProbability or HorizontalAccuracy.Ce90Probability or HorizontalAccuracy.R95Probability;
            if (!reportsOwn && Tables.Count >= MostOtherProbabilities + ReportsOwnProbabilities)
                return null;
            table = Tables.GetOrAdd(probability, Build);
        }

        return table.Interpolate(q);
    }

    private static IInterpolation Build(double probability)
    {
        var q = new double[Intervals + 1];
        var logRadius = new double[Intervals + 1];
        for (int k = 0; k <= Intervals; k++)
        {
            q[k] = (double)k / Intervals;
            logRadius[k] = Math.Log(k switch
            {
                0 => CircularErrorRadius.OneDimensionalRadius(probability),
                Intervals => CircularErrorRadius.CircularRadius(probability),
                _ => CircularErrorRadius.ByRootFinding(probability, q[k], useStartTable: false, out _),
            });
        }

        return CubicSpline.InterpolateNatural(q, logRadius);
    }
}
