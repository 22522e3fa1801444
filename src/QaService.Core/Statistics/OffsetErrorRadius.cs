using MathNet.Numerics;
using MathNet.Numerics.RootFinding;

namespace QaService.Core.Statistics;

/// <summary>
/// Radii about the mark that hold a probability p of an error with a systematic offset: the circle (CEP, CE90, R95 with
/// a bias; <see cref="OffsetCircleProbability"/>) and the one-dimensional interval |X| ≤ r for X ~ N(μ, σ²)
/// (LE90, LE95 with a bias). Both solve P(r) = p by MathNet Brent root finding on r.
/// </summary>
/// <remarks>
/// Accuracy: the radius to 1e-10 relative where the probability is accurate to 1e-12 (see
/// <see cref="OffsetCircleProbability"/>); tested against scipy 1.10 (noncentral χ², brentq) and check-values §5
/// (circular μ/σ = 0.5, 1, 2: CEP/CE90/R95 = 1.2516/2.2746/2.5917, 1.4755/2.6019/2.9398, 2.2458/3.4734/3.8263;
/// one-dimensional μ/σ = 0.5, 1, 2: LE90 = 1.8388, 2.2845, 3.2816, LE95 = 2.1815, 2.6461, 3.6449).
/// </remarks>
public static class OffsetErrorRadius
{
    private const double RootTolerance = 1e-12;

    /// <summary>
    /// A Newton step smaller than this fraction of the major standard deviation is the last: the point it lands on is
    /// about M·δ² from the root (Press et al., Numerical Recipes, 3rd ed., §9.4), with M = |P″/2P′| of order 1/σ, so
    /// ~1e-14·σ, without another quadrature to confirm it. Measured: at most 2.2e-14 relative from the search that stopped
    /// on <see cref="RootTolerance"/> over 12,000 radii (offsets 0 to 10σ, axis ratios 0–1, correlations ±0.9).
    /// </summary>
    private const double NewtonAcceptStep = 1e-7;

    /// <summary>
    /// Spread below which the error is a constant offset to double precision: with σ ≤ 1e-10·|μ| the radius
    /// is |μ| to better than 1e-10 relative (it lies within |μ| ± a few σ), and the bracket [0, |μ| + kσ]
    /// would round to |μ| itself, so no root could be bracketed. Identical residuals (zero spread about
    /// their mean, up to rounding noise) land here.
    /// </summary>
    private const double NegligibleSpreadRatio = 1e-10;

    /// <summary>
    /// Spread below which the circle is linearised along the offset: |X| = |μ| + u·(X − μ) + q with
    /// u = μ/|μ| and 0 ≤ q ≤ σmax²·χ²/(2|μ|), so r = |μ| + σᵤ·Φ⁻¹(p) with σᵤ² = uᵀΣu, error at most
    /// σmax·(σmax/|μ|)·χ²/2 ≈ 5e-5·σmax·χ² here (common first-order expansion of the norm). The quadrature of
    /// <see cref="OffsetCircleProbability"/> is built for moderate |μ|/σ and loses its bracket far beyond it.
    /// </summary>
    private const double LinearisedSpreadRatio = 1e-4;
    private const int RootMaximumIterations = 300;

    /// <summary>Radius r (m) with P(|X| ≤ r) = p for the plane error <paramref name="distribution"/>.</summary>
    /// <param name="probability">p in (0, 1).</param>
    /// <param name="distribution">Mean (m) and covariance (m²) of the horizontal error.</param>
    /// <returns>The radius in metres.</returns>
    public static double Circular(double probability, BivariateNormal distribution) => Circular(probability, distribution, out _);

    /// <summary><see cref="Circular(double, BivariateNormal)"/>, also giving the quadratures its Newton search ran (for tests).</summary>
    internal static double Circular(double probability, BivariateNormal distribution, out int evaluations)
    {
        evaluations = 0;
        RequireOpenProbability(probability);
        var (major, _) = PrincipalAxes.FromSecondMoments(distribution.VarianceEast, distribution.VarianceNorth, distribution.CovarianceEastNorth);
        double offset = double.Hypot(distribution.MeanEast, distribution.MeanNorth);
        if (major <= NegligibleSpreadRatio * offset || major == 0.0)
            return offset;
        if (major <= LinearisedSpreadRatio * offset)
            return LinearisedCircular(probability, distribution, offset);
        // P(|X| ≤ |μ| + σmax·sqrt(−2 ln(1 − p))) ≥ P(|X − μ| ≤ σmax·sqrt(−2 ln(1 − p))) ≥ p: an upper bracket.
        double upper = offset + (major * Math.Sqrt(-2.0 * Math.Log(1.0 - probability))) + (1e-9 * major);
        return NewtonInBracket(probability, distribution, offset, major, upper, ref evaluations)
            ?? Brent.FindRoot(r => OffsetCircleProbability.Probability(Math.Max(r, 0.0), distribution) - probability,
                0.0, upper, RootTolerance * upper, RootMaximumIterations);
    }

    /// <summary>
    /// The root of P(r) = p by Newton's method kept inside a shrinking bracket, falling back to bisection whenever a step
    /// would leave it ("rtsafe": Press et al., Numerical Recipes, 3rd ed., 2007, §9.4). P and its derivative come from
    /// one quadrature (<see cref="OffsetCircleProbability.WithDensity"/>), so each step costs one evaluation, and the
    /// convergence is quadratic near the root: a handful of evaluations where Brent's method on [0, upper] took about a
    /// dozen. Stops on the same tolerance as the Brent search. Null when the quadrature does not apply (the caller then
    /// uses Brent's method on P alone).
    /// </summary>
    /// <param name="offset">|μ|, metres.</param>
    /// <param name="spread">The major standard deviation, metres (the scale of the last Newton step).</param>
    /// <param name="upper">A radius where P ≥ p, metres.</param>
    private static double? NewtonInBracket(double probability, BivariateNormal distribution, double offset, double spread, double upper, ref int evaluations)
    {
        double lower = 0.0;
        double r = Math.Min(upper, StartingRadius(probability, distribution, offset));
        double tolerance = RootTolerance * upper;
        double acceptStep = NewtonAcceptStep * spread;
        for (int i = 0; i < RootMaximumIterations; i++)
        {
            if (OffsetCircleProbability.WithDensity(r, distribution) is not var (p, density))
                return null;
            evaluations++;
            double f = p - probability;
            if (f == 0.0)
                return r;
            if (f < 0.0)
                lower = r;
            else
                upper = r;
            double next = r - (f / density);
            // The bracket's ends are allowed: once the probability is exact to rounding, the Newton step is below one
            // unit in the last place and lands on r itself (now an end); calling that "outside" forced about twenty
            // bisection steps back down from the far end (25 evaluations instead of 4 for CEP of μ = (0.3, 0.15) m,
            // σ = (1, 0.8) m, ρ = 0.2).
            bool newton = density > 0.0 && next >= lower && next <= upper;
            if (!newton)
                next = 0.5 * (lower + upper);
            if (Math.Abs(next - r) <= (newton ? acceptStep : tolerance) || upper - lower <= tolerance)
                return next;
            r = next;
        }
        return null;
    }

    /// <summary>
    /// A start for the Newton search, within about 1 % of the root in common cases: |X|² matched in mean and variance by
    /// a scaled chi-square a·χ²(ν) (Patnaik 1949, "The non-central χ²- and F-distributions and their applications",
    /// Biometrika 36:202–232), whose quantile is taken by Wilson &amp; Hilferty's cube-root normal approximation (1931,
    /// "The distribution of chi-square", PNAS 17:684–688). E|X|² = |μ|² + tr Σ; Var|X|² = 2 tr Σ² + 4 μᵀΣμ.
    /// Only the start: the search solves P(r) = p exactly whatever it is. Falls back to the circular-normal start
    /// sqrt(|μ|² + tr Σ·(−ln(1 − p))) where the cube-root form fails (a non-positive base, far in the lower tail).
    /// </summary>
    private static double StartingRadius(double probability, BivariateNormal distribution, double offset)
    {
        var (muE, muN, varE, varN, cov) = distribution;
        double trace = varE + varN;
        double mean = (offset * offset) + trace;
        double variance = (2.0 * ((varE * varE) + (varN * varN) + (2.0 * cov * cov)))
            + (4.0 * ((muE * muE * varE) + (2.0 * muE * muN * cov) + (muN * muN * varN)));
        double nu = 2.0 * mean * mean / variance, scale = variance / (2.0 * mean);
        double z = MathNet.Numerics.Distributions.Normal.InvCDF(0.0, 1.0, probability);
        double cubeRootVariance = 2.0 / (9.0 * nu); // of (χ²/ν)^(1/3), Wilson–Hilferty
        double root = 1.0 - cubeRootVariance + (z * Math.Sqrt(cubeRootVariance));
        return root > 0.0 && double.IsFinite(scale * nu)
            ? Math.Sqrt(scale * nu * root * root * root)
            : Math.Sqrt((offset * offset) + (trace * -Math.Log(1.0 - probability)));
    }

    private static double LinearisedCircular(double probability, BivariateNormal distribution, double offset)
    {
        double ux = distribution.MeanEast / offset, uy = distribution.MeanNorth / offset;
        double radialVariance = (ux * ux * distribution.VarianceEast) + (2.0 * ux * uy * distribution.CovarianceEastNorth) + (uy * uy * distribution.VarianceNorth);
        return offset + (Math.Sqrt(Math.Max(radialVariance, 0.0)) * MathNet.Numerics.Distributions.Normal.InvCDF(0.0, 1.0, probability));
    }

    /// <summary>P(|X| ≤ r) for X ~ N(μ, σ²): Φ((r − μ)/σ) − Φ((−r − μ)/σ).</summary>
    /// <param name="radiusMetres">r ≥ 0, metres.</param>
    /// <param name="meanMetres">μ, metres, finite.</param>
    /// <param name="sigmaMetres">σ &gt; 0, metres.</param>
    public static double LinearProbability(double radiusMetres, double meanMetres, double sigmaMetres) =>
        OffsetCircleProbability.NormalInterval((-radiusMetres - meanMetres) / sigmaMetres, (radiusMetres - meanMetres) / sigmaMetres);

    /// <summary>
    /// Linear error with a bias: r with P(|X| ≤ r) = p for X ~ N(μ, σ²) (LE90 for p = 0.9 with an offset).
    /// With μ = 0 it is σ·Φ⁻¹((1 + p)/2), e.g. LE90 = 1.644854σ.
    /// </summary>
    /// <param name="probability">p in (0, 1).</param>
    /// <param name="meanMetres">μ, metres, finite.</param>
    /// <param name="sigmaMetres">σ ≥ 0, metres, finite.</param>
    /// <returns>The radius in metres.</returns>
    public static double Linear(double probability, double meanMetres, double sigmaMetres)
    {
        RequireOpenProbability(probability);
        if (!(sigmaMetres >= 0.0 && double.IsFinite(sigmaMetres)) || !double.IsFinite(meanMetres))
            throw new ArgumentException($"σ = {sigmaMetres}, μ = {meanMetres}: σ must be finite and ≥ 0, μ finite.", nameof(sigmaMetres));
        double offset = Math.Abs(meanMetres);
        if (sigmaMetres == 0.0 || sigmaMetres <= NegligibleSpreadRatio * offset)
            return offset;
        if (offset == 0.0)
            return sigmaMetres * Math.Sqrt(2.0) * SpecialFunctions.ErfInv(probability);
        // |X| ≤ |μ| + |X − μ|, so P(|X| ≤ |μ| + σ·√2·erf⁻¹(p)) ≥ P(|X − μ| ≤ σ·√2·erf⁻¹(p)) = p: an upper bracket.
        double upper = offset + (sigmaMetres * Math.Sqrt(2.0) * SpecialFunctions.ErfInv(probability)) + (1e-9 * sigmaMetres);
        return Brent.FindRoot(r => LinearProbability(Math.Max(r, 0.0), meanMetres, sigmaMetres) - probability,
            0.0, upper, RootTolerance * upper, RootMaximumIterations);
    }

    private static void RequireOpenProbability(double probability)
    {
        if (!(probability > 0.0 && probability < 1.0))
            throw new ArgumentException($"Probability {probability} must be in (0, 1).", nameof(probability));
    }
}
