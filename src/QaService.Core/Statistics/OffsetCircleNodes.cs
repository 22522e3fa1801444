using MathNet.Numerics;

namespace QaService.Core.Statistics;

/// <summary>
/// The radius-independent part of <see cref="OffsetCircleProbability"/>'s periodic trapezoid rule for one distribution:
/// at each direction θ the quadratic-form coefficients a, m, k, s and the radius-free terms erf(s·m) (or erfc(−s·m))
/// and e^(−k/2)·m·√(π/2a), level by level of node doubling. A root search evaluates the probability at many radii for
/// the same distribution, so the cos/sin, one erf, one exp and one sqrt per node are done once instead of once per radius;
/// the remaining expression is the same in the same order, so results are bit for bit those of the direct evaluation.
/// </summary>
/// <remarks>Levels are built lazily (level 0: <see cref="OffsetCircleProbability.InitialNodes"/> nodes from θ = 0; level
/// j ≥ 1: the midpoints of the rule with InitialNodes·2^(j−1) nodes). Not thread-safe: one instance per thread (see
/// <see cref="For"/>).</remarks>
internal sealed class OffsetCircleNodes
{
    [ThreadStatic]
    private static OffsetCircleNodes? lastUsed;

    private readonly List<Level> levels = [];
    private readonly double iEE, iNN, iEN, muE, muN;

    private OffsetCircleNodes(BivariateNormal distribution, double inverseEE, double inverseNN, double inverseEN, double c)
    {
        Distribution = distribution;
        (iEE, iNN, iEN, muE, muN) = (inverseEE, inverseNN, inverseEN, distribution.MeanEast, distribution.MeanNorth);
        QuadraticAtMean = c;
    }

    /// <summary>The distribution the nodes belong to.</summary>
    public BivariateNormal Distribution { get; }

    /// <summary>c = μᵀΣ⁻¹μ.</summary>
    public double QuadraticAtMean { get; }

    /// <summary>This thread's table for the distribution (reused when the distribution is the same as last time).</summary>
    /// <param name="distribution">The bivariate normal (non-singular covariance).</param>
    /// <param name="inverseEE">(Σ⁻¹)_EE.</param>
    /// <param name="inverseNN">(Σ⁻¹)_NN.</param>
    /// <param name="inverseEN">(Σ⁻¹)_EN.</param>
    /// <param name="c">μᵀΣ⁻¹μ.</param>
    public static OffsetCircleNodes For(BivariateNormal distribution, double inverseEE, double inverseNN, double inverseEN, double c)
    {
        var cached = lastUsed;
        if (cached is not null && cached.Distribution.Equals(distribution))
            return cached;
        return lastUsed = new OffsetCircleNodes(distribution, inverseEE, inverseNN, inverseEN, c);
    }

    /// <summary>Nodes of level j.</summary>
    public Level this[int j]
    {
        get
        {
            while (levels.Count <= j)
                levels.Add(Build(levels.Count));
            return levels[j];
        }
    }

    private Level Build(int j)
    {
        int previousNodes = OffsetCircleProbability.InitialNodes;
        for (int i = 1; i < j; i++)
            previousNodes *= 2;
        int count = j == 0 ? OffsetCircleProbability.InitialNodes : previousNodes;
        var level = new Level(new double[count], new double[count], new double[count], new double[count], new double[count], new double[count]);
        for (int i = 0; i < count; i++)
        {
            // Same angles as the direct rule: 2π·i/N at level 0, 2π·(i + ½)/N for the midpoints of the N-node rule.
            double theta = j == 0 ? 2.0 * Math.PI * i / count : 2.0 * Math.PI * (i + 0.5) / previousNodes;
            double ue = Math.Cos(theta), un = Math.Sin(theta);
            double a = (iEE * ue * ue) + (2.0 * iEN * ue * un) + (iNN * un * un);
            double b = (ue * ((iEE * muE) + (iEN * muN))) + (un * ((iEN * muE) + (iNN * muN)));
            double m = b / a;
            double k = Math.Max(QuadraticAtMean - (b * m), 0.0);
            double s = Math.Sqrt(a / 2.0);
            level.A[i] = a;
            level.M[i] = m;
            level.K[i] = k;
            level.S[i] = s;
            level.ErfAtMean[i] = m >= 0.0 ? SpecialFunctions.Erf(s * m) : SpecialFunctions.Erfc(-s * m);
            level.SecondFactor[i] = m == 0.0 ? 0.0 : Math.Exp(-k / 2.0) * m * Math.Sqrt(Math.PI / (2.0 * a));
        }

        return level;
    }

    /// <summary>One level's per-direction terms, element by element.</summary>
    internal sealed record Level(double[] A, double[] M, double[] K, double[] S, double[] ErfAtMean, double[] SecondFactor);
}
