namespace QaService.Core.Statistics;

/// <summary>
/// The ρ-independent part of <see cref="CircleProbability"/>'s trapezoid rule for one axis ratio q: at each node s,
/// q·cosh s, the denominator 1 + q²sinh²s and h = q²cosh²s/(1 + q²sinh²s), level by level of step halving. A root
/// search evaluates the integral at many radii for the same q (and CEP, CE90 and R95 share q), so the sinh/cosh and
/// divisions are done once per node instead of once per node and radius; the sum is the same expression in the same
/// order as evaluating the integrand directly.
/// </summary>
/// <remarks>Levels are built lazily (level j has step <see cref="CircleProbability.InitialStep"/>/2^j, odd multiples
/// only for j ≥ 1); memory is 24 bytes a node. Not thread-safe: one instance per thread (see <see cref="For"/>).</remarks>
internal sealed class CircleQuadratureNodes
{
    [ThreadStatic]
    private static CircleQuadratureNodes? lastUsed;

    private readonly List<Level> levels = [];

    private CircleQuadratureNodes(double q, double end)
    {
        AxisRatio = q;
        End = end;
    }

    /// <summary>The axis ratio q = σ₂/σ₁, 0 &lt; q &lt; 1.</summary>
    public double AxisRatio { get; }

    /// <summary>Upper end of the s-range (asinh(1/q) + tail).</summary>
    public double End { get; }

    /// <summary>The table for q: this thread's last table when q is the same, otherwise a new one.</summary>
    /// <param name="q">Axis ratio, 0 &lt; q &lt; 1.</param>
    /// <param name="end">Upper end of the s-range for q.</param>
    public static CircleQuadratureNodes For(double q, double end)
    {
        var cached = lastUsed;
        if (cached is not null && cached.AxisRatio.Equals(q))
            return cached;
        return lastUsed = new CircleQuadratureNodes(q, end);
    }

    /// <summary>Nodes of level j (0: s = 0 … end at the initial step; j ≥ 1: the odd multiples of step/2^j).</summary>
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
        double step = CircleProbability.InitialStep;
        for (int i = 0; i < j; i++)
            step /= 2.0;
        int first = j == 0 ? 0 : 1, stride = j == 0 ? 1 : 2;
        var qCosh = new List<double>();
        var denominator = new List<double>();
        var h = new List<double>();
        // Same node positions and loop condition as the direct rule (k·step ≤ end), node 0 included at level 0.
        for (int k = first; k == 0 || k * step <= End; k += stride)
        {
            // sinh and cosh from one exponential (half the cost; sinh loses relative precision only for small s, where
            // it enters as 1 + q²sinh²s, so the absolute error ~1e-16 is harmless: tested against scipy to 1e-9).
            double s = k * step;
            double exp = Math.Exp(s), inverseExp = 1.0 / exp;
            double qSinh = AxisRatio * 0.5 * (exp - inverseExp);
            double c = AxisRatio * 0.5 * (exp + inverseExp);
            double d = 1.0 + (qSinh * qSinh);
            qCosh.Add(c);
            denominator.Add(d);
            h.Add(c * c / d);
        }

        return new Level(qCosh.ToArray(), denominator.ToArray(), h.ToArray());
    }

    /// <summary>One level's nodes: q·cosh s, 1 + q²sinh²s and h(s), element by element.</summary>
    internal sealed record Level(double[] QCosh, double[] Denominator, double[] H);
}
