using MathNet.Numerics;
using MathNet.Numerics.RootFinding;

namespace QaService.Core.Statistics;

/// <summary>
/// Exact radius of the circle, centred on the mean, that holds a given probability of a zero-mean bivariate
/// normal distribution (CEP for p = 0.5, CE90 for 0.9, R95 for 0.95). Not a rule of thumb: the radius solves
/// <see cref="CircleProbability.ZeroMean"/>(r, σ₁, σ₂) = p.
/// </summary>
/// <remarks>
/// Accuracy: relative error of the radius below 1e-9 for p in [1e-12, 1 − 1e-12] (the root is found to ~1e-14 in
/// ln r; the probability integral is accurate to ~1e-13 relative); tested against closed forms, scipy 1.10
/// (tests/reference-data/circular-radius-scipy.tsv) and the published circular factors.
/// </remarks>
public static class CircularErrorRadius
{
    /// <summary>Bisection step size on ln(r/σ₁) at which the root is taken as found.</summary>
    private const double RootTolerance = 1e-13;

    /// <summary>
    /// A Newton step this small (in ln r) is the last: Newton's error after a step δ is about M·δ² with
    /// M = |g″/2g′| of order 1 here (Press et al., Numerical Recipes, 3rd ed., §9.4), so the point it lands on is within
    /// ~1e-14 of the root without another quadrature to confirm it. Measured: at most 9.3e-15 relative from the search
    /// that stopped at steps of 1e-13 over 5,500 (p, q) pairs, p from 1e-12 to 1 − 1e-12.
    /// </summary>
    private const double NewtonAcceptStep = 1e-7;

    /// <summary>Iteration limit (Newton with bisection fallback normally converges in 4–8).</summary>
    private const int RootMaximumIterations = 200;

    /// <summary>Widening of the analytic bracket in ln r, so that rounding at a bound cannot hide the sign change.</summary>
    private const double BracketSlack = 1e-3;

    /// <summary>
    /// Radius r with P(|X| ≤ r) = <paramref name="probability"/> for X ~ N(0, diag(σ₁², σ₂²)) in principal axes.
    /// </summary>
    /// <param name="probability">p in [0, 1]; p = 0 gives 0 and p = 1 gives +∞ (unless both sigmas are 0).</param>
    /// <param name="sigma1">A principal standard deviation (length unit, e.g. m), finite, ≥ 0.</param>
    /// <param name="sigma2">The other principal standard deviation (same unit), finite, ≥ 0; either may be 0.</param>
    /// <returns>
    /// The radius in the sigmas' unit. Closed forms where they exist: both sigmas 0 → 0; one sigma 0 →
    /// σ·Φ⁻¹((1 + p)/2) = σ√2·erf⁻¹(p) (one-dimensional, LE-type); σ₁ = σ₂ = σ → σ·sqrt(−2 ln(1 − p)) (Rayleigh).
    /// Otherwise Newton's method on ln r (derivative from the same quadrature, bisection whenever a step would leave the
    /// bracket) between the analytic bounds
    /// max(σ₁√2·erf⁻¹(p), σ₂·sqrt(−2 ln(1 − p))) ≤ r ≤ σ₁·sqrt(−2 ln(1 − p)) (σ₁ ≥ σ₂), the probability being
    /// monotone in each sigma. Relative accuracy 1e-9 (see remarks).
    /// </returns>
    /// <exception cref="ArgumentException">NaN, negative or infinite sigma, or p outside [0, 1].</exception>
    public static double Exact(double probability, double sigma1, double sigma2)
    {
        CircleProbability.RequireSigmas(sigma1, sigma2);
        Percentile.RequireProbability(probability);
        double major = Math.Max(sigma1, sigma2);
        if (major == 0.0 || probability == 0.0)
        {
            return 0.0;
        }

        if (probability == 1.0)
        {
            return double.PositiveInfinity;
        }

        double q = Math.Min(sigma1, sigma2) / major;
        double rho = q switch
        {
            0.0 => OneDimensionalRadius(probability),
            1.0 => CircularRadius(probability),
            _ => ByRootFinding(probability, q),
        };
        return major * rho;
    }

    /// <summary>
    /// Radius holding <paramref name="probability"/> of N(0, M) where M is the second-moment matrix about zero
    /// [[meanSquareE, meanProductEN], [meanProductEN, meanSquareN]] (the contract's (1/n)Σ[dE dN]ᵀ[dE dN]):
    /// the eigen-decomposition (<see cref="PrincipalAxes.FromSecondMoments"/>) followed by <see cref="Exact"/>.
    /// Correlation between E and N therefore changes the radius.
    /// </summary>
    /// <param name="probability">p in [0, 1].</param>
    /// <param name="meanSquareE">Σ dE² / n in m², ≥ 0.</param>
    /// <param name="meanSquareN">Σ dN² / n in m², ≥ 0.</param>
    /// <param name="meanProductEN">Σ dE·dN / n in m² (positive semi-definite matrix).</param>
    /// <returns>The radius in metres, relative accuracy 1e-9.</returns>
    public static double FromSecondMoments(double probability, double meanSquareE, double meanSquareN, double meanProductEN)
    {
        (double major, double minor) = PrincipalAxes.FromSecondMoments(meanSquareE, meanSquareN, meanProductEN);
        return Exact(probability, major, minor);
    }

    /// <summary>Root finding on ln ρ, forcing the general path even for q = 0 or 1 (exposed for tests).</summary>
    internal static double ByRootFinding(double probability, double q) => ByRootFinding(probability, q, useStartTable: true, out _);

    /// <summary>
    /// <see cref="ByRootFinding(double, double)"/> with the choice of start: the tabulated radius for this probability
    /// (<see cref="CircularRadiusStarts"/>) or the middle of the analytic bracket (the table's own entries are found so).
    /// </summary>
    /// <param name="evaluations">Quadratures run (for tests).</param>
    internal static double ByRootFinding(double probability, double q, bool useStartTable, out int evaluations)
    {
        evaluations = 0;
        double lower = Math.Max(OneDimensionalRadius(probability), q * CircularRadius(probability));
        double upper = CircularRadius(probability);

        // Below p = 0.5 match ln P; above, match ln(1 − P) computed directly, so neither tail loses digits.
        // g(x) = ±(ln V(eˣ) − ln target) increases with x = ln ρ; g′(x) = ρ·(dP/dρ)/V. Newton's method kept inside the
        // analytic bracket (bisection when a step would leave it): each step costs one quadrature, as a Brent step does,
        // but converges quadratically: from the tabulated start 1–2 evaluations (4–6 from the bracket's middle, Brent 10–15).
        bool useComplement = probability > 0.5;
        double target = Math.Log(useComplement ? 1.0 - probability : probability);
        if (!CircleProbability.UsesQuadrature(q))
        {
            // The closed-form limits q = 0 and q = 1 (reached here only from tests): Brent on the closed forms.
            double Residual(double logRho)
            {
                double value = Math.Log(CircleProbability.Evaluate(Math.Exp(logRho), q, useComplement)) - target;
                return useComplement ? -value : value;
            }

            return Math.Exp(Brent.FindRoot(Residual, Math.Log(lower) - BracketSlack, Math.Log(upper) + BracketSlack, RootTolerance, RootMaximumIterations));
        }

        double low = Math.Log(lower) - BracketSlack, high = Math.Log(upper) + BracketSlack;
        double logRoot = useStartTable && CircularRadiusStarts.LogRadius(probability, q) is { } tabulated && tabulated > low && tabulated < high
            ? tabulated
            : 0.5 * (low + high);
        for (int iteration = 0; iteration < RootMaximumIterations; iteration++)
        {
            double rho = Math.Exp(logRoot);
            double value = CircleProbability.ByQuadrature(rho, q, useComplement, out double derivative);
            evaluations++;
            double residual = Math.Log(value) - target;
            if (useComplement)
                residual = -residual;
            if (residual > 0)
                high = logRoot;
            else
                low = logRoot;

            if (residual == 0)
                break;

            double next = logRoot - (residual / (rho * derivative / value));
            bool newton = next >= low && next <= high;
            if (!newton)
                next = 0.5 * (low + high);
            bool converged = Math.Abs(next - logRoot) <= (newton ? NewtonAcceptStep : RootTolerance);
            logRoot = next;
            if (converged)
                break;
        }

        return Math.Exp(logRoot);
    }

    /// <summary>√2·erf⁻¹(p) = Φ⁻¹((1 + p)/2): the one-dimensional (σ₂ = 0) radius in units of σ₁.</summary>
    internal static double OneDimensionalRadius(double probability) =>
        Math.Sqrt(2.0) * (probability <= 0.5 ? SpecialFunctions.ErfInv(probability) : SpecialFunctions.ErfcInv(1.0 - probability));

    /// <summary>sqrt(−2 ln(1 − p)): the circular (σ₁ = σ₂) radius in units of σ (Rayleigh quantile).</summary>
    internal static double CircularRadius(double probability) =>
        Math.Sqrt(-2.0 * AccurateElementary.LogOnePlus(-probability));
}
