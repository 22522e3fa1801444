using MathNet.Numerics;

namespace QaService.Core.Statistics;

/// <summary>
/// Exact probability that a zero-mean bivariate normal vector falls inside a circle centred on its mean.
/// </summary>
/// <remarks>
/// <para>
/// Method. Let X = (σ₁Z₁, σ₂Z₂) in its principal axes, Z standard normal. Write Z = s(cos φ, sin φ), where
/// s² ~ χ²₂ (so P(s² ≤ t) = 1 − e^(−t/2)) and φ ~ U(0, 2π) are independent. Then |X|² = s²·h(φ) with
/// h(φ) = σ₁² cos²φ + σ₂² sin²φ, and by the symmetry of h under φ → −φ and φ → π − φ,
/// </para>
/// <para>P(|X| ≤ r) = (2/π) ∫₀^{π/2} [1 − exp(−r² / (2h(φ)))] dφ.</para>
/// <para>
/// This is the polar-angle integral P = (1/(2πσ₁σ₂)) ∫₀^{2π} [1 − exp(−r²g(θ)/2)]/g(θ) dθ,
/// g = cos²θ/σ₁² + sin²θ/σ₂², under the substitution tan θ = (σ₂/σ₁) tan φ; the φ form has a bounded
/// integrand with no 1/g factor. The same integral with exp(−r²/(2h)) alone gives the complement
/// 1 − P without cancellation, which is what the radius search uses above p = 0.5. For the general
/// quadratic-form background see Imhof (1961), Biometrika 48:419–426, doi:10.1093/biomet/48.3-4.419.
/// </para>
/// <para>
/// Quadrature. With ψ = π/2 − φ and tan ψ = q·sinh s (q = σ₂/σ₁ ≤ 1, lengths in units of σ₁), h = q²cosh²s/(1 + q²sinh²s)
/// and dψ = q·cosh s/(1 + q²sinh²s) ds, so P = (2/π) ∫₀^∞ f(h(s)) w(s) ds with an integrand that is even in s,
/// analytic in the strip |Im s| &lt; π/2 whatever q is (the boundary layer of width ≈ q near ψ = 0 becomes a feature of
/// width ≈ 1), and decays like e^(−s) beyond s ≈ asinh(1/q). The trapezoid rule on such an integrand converges
/// geometrically in the number of points (Trefethen &amp; Weideman 2014, "The exponentially convergent trapezoidal rule",
/// SIAM Review 56(3):385–458, doi:10.1137/130932132, sections 5 and 14); the step is halved from 1/2 until two
/// successive sums agree to <see cref="QuadratureRelativeTolerance"/> (the finer sum is then accurate to rounding), and the range is cut at asinh(1/q) + 40
/// (relative truncation ≈ e^(−40)). Closed forms are used where they exist: σ₂ = 0 (or σ₂/σ₁ &lt; 1e-150) gives
/// erf(r/(σ₁√2)) (one-dimensional), σ₁ = σ₂ gives 1 − exp(−r²/(2σ²)) (Rayleigh), σ₁ = σ₂ = 0 gives 1 for every r ≥ 0.
/// Accuracy: relative error of the probability (and of its complement) below 1e-13, checked against the closed forms,
/// against scipy (tests/reference-data/make-radius-reference.py) and against the check values.
/// </para>
/// </remarks>
public static class CircleProbability
{
    /// <summary>
    /// Two successive trapezoid sums must agree to this relative difference; the finer one is returned. The rule's error
    /// on this integrand falls like exp(−2πd/h) (Trefethen &amp; Weideman 2014, §5), so halving the step squares it: a
    /// difference of 1e-10 leaves the finer sum ~1e-20 from the integral, below rounding. Measured against the earlier
    /// 1e-14 stopping rule over q 0.3–0.9, ρ 0.8–2.5 (a Python replica of this rule): the same values to 6e-16 relative
    /// with up to half the nodes; the scipy and closed-form checks in the tests pass unchanged.
    /// </summary>
    internal const double QuadratureRelativeTolerance = 1e-10;

    /// <summary>Below this axis ratio the one-dimensional closed form is exact to O(q²) and sinh would overflow.</summary>
    private const double NegligibleAxisRatio = 1e-150;

    /// <summary>Range of the s-integral beyond asinh(1/q): the integrand has decayed by e^(−40) ≈ 4e-18.</summary>
    private const double TailLength = 40.0;

    /// <summary>First trapezoid step in s.</summary>
    internal const double InitialStep = 0.5;

    /// <summary>Step halvings allowed (final step 2⁻¹³; convergence normally needs 3–5).</summary>
    private const int MaximumHalvings = 12;

    /// <summary>
    /// P(|X| ≤ radius) for X ~ N(0, Σ) in two dimensions, where Σ has principal standard deviations
    /// <paramref name="sigma1"/> and <paramref name="sigma2"/> (its eigenvalues are σ₁², σ₂²; the order does not matter).
    /// </summary>
    /// <param name="radius">Circle radius, same length unit as the sigmas, in [0, +∞].</param>
    /// <param name="sigma1">A principal standard deviation, finite, ≥ 0 (may be 0).</param>
    /// <param name="sigma2">The other principal standard deviation, finite, ≥ 0 (may be 0).</param>
    /// <returns>The probability in [0, 1], relative error below 1e-12.</returns>
    /// <exception cref="ArgumentException">An argument is NaN, negative, or a sigma is infinite.</exception>
    public static double ZeroMean(double radius, double sigma1, double sigma2)
    {
        RequireSigmas(sigma1, sigma2);
        if (!(radius >= 0.0))
        {
            throw new ArgumentException($"Radius {radius} must be ≥ 0.", nameof(radius));
        }

        double major = Math.Max(sigma1, sigma2);
        if (major == 0.0)
        {
            return 1.0;
        }

        return Evaluate(radius / major, Math.Min(sigma1, sigma2) / major, complement: false);
    }

    /// <summary>
    /// P(|X| ≤ ρ) (or its complement) in units of the major standard deviation: ρ = r/σ₁, q = σ₂/σ₁ ∈ [0, 1].
    /// </summary>
    internal static double Evaluate(double rho, double q, bool complement)
    {
        if (double.IsPositiveInfinity(rho))
        {
            return complement ? 0.0 : 1.0;
        }

        if (q < NegligibleAxisRatio)
        {
            double z = rho / Math.Sqrt(2.0);
            return complement ? SpecialFunctions.Erfc(z) : SpecialFunctions.Erf(z);
        }

        if (q == 1.0)
        {
            double halfSquare = rho * rho / 2.0;
            return complement ? Math.Exp(-halfSquare) : -AccurateElementary.ExpMinusOne(-halfSquare);
        }

        return ByQuadrature(rho, q, complement);
    }

    /// <summary>The s-integral of the class remarks, for 0 &lt; q &lt; 1 (exposed for tests).</summary>
    /// <summary>Whether <see cref="Evaluate"/> integrates for this axis ratio (not one of its closed-form limits).</summary>
    /// <param name="q">Axis ratio in [0, 1].</param>
    internal static bool UsesQuadrature(double q) => q >= NegligibleAxisRatio && q != 1.0;

    internal static double ByQuadrature(double rho, double q, bool complement) => ByQuadrature(rho, q, complement, out _);

    /// <summary>
    /// <see cref="ByQuadrature(double, double, bool)"/> and, from the same nodes, dP/dρ = (2/π)∫ ρ/h·e^(−ρ²/2h)·q cosh s/(1 + q²sinh²s) ds
    /// (≥ 0; the complement's derivative is its negative), for Newton's method in <see cref="CircularErrorRadius"/>.
    /// The value is computed exactly as without the derivative.
    /// </summary>
    /// <param name="rho">Radius in units of the major sigma, ≥ 0.</param>
    /// <param name="q">Axis ratio, 0 &lt; q &lt; 1.</param>
    /// <param name="complement">Return 1 − P instead of P.</param>
    /// <param name="derivative">dP/dρ at <paramref name="rho"/> (to the quadrature's converged step).</param>
    internal static double ByQuadrature(double rho, double q, bool complement, out double derivative)
    {
        double halfRhoSquare = rho * rho / 2.0;
        var nodes = CircleQuadratureNodes.For(q, Math.Asinh(1.0 / q) + TailLength);
        double derivativeSum = 0.0;

        // Integrand f(h)·q·cosh s/(1 + q²sinh²s), f = 1 − exp(−ρ²/2h) (or exp(−ρ²/2h) for the complement); the
        // s-dependent factors come from the node table. Node 0 has weight ½ in the trapezoid sum.
        // Added node by node into the running sum, in the order of the direct rule.
        void AddLevel(ref double total, ref double derivativeTotal, CircleQuadratureNodes.Level level, int from)
        {
            double[] qCosh = level.QCosh, denominator = level.Denominator, h = level.H;
            for (int i = from; i < h.Length; i++)
            {
                double exponent = -halfRhoSquare / h[i];
                double f, decay;
                if (complement)
                {
                    f = Math.Exp(exponent);
                    decay = f;
                }
                else
                {
                    double expMinusOne = AccurateElementary.ExpMinusOne(exponent);
                    f = -expMinusOne;
                    decay = 1.0 + expMinusOne;
                }

                double weight = qCosh[i] / denominator[i];
                total += f * qCosh[i] / denominator[i];
                derivativeTotal += decay * rho / h[i] * weight;
            }
        }

        var level0 = nodes[0];
        double exponent0 = -halfRhoSquare / level0.H[0];
        double f0 = complement ? Math.Exp(exponent0) : -AccurateElementary.ExpMinusOne(exponent0);
        double step = InitialStep;
        double sum = f0 * level0.QCosh[0] / level0.Denominator[0] / 2.0;
        derivativeSum = Math.Exp(exponent0) * rho / level0.H[0] * (level0.QCosh[0] / level0.Denominator[0]) / 2.0;
        AddLevel(ref sum, ref derivativeSum, level0, 1);

        double estimate = sum * step;
        for (int halving = 0; halving < MaximumHalvings; halving++)
        {
            step /= 2.0;
            AddLevel(ref sum, ref derivativeSum, nodes[halving + 1], 0);

            double refined = sum * step;
            bool converged = Math.Abs(refined - estimate) <= QuadratureRelativeTolerance * refined;
            estimate = refined;
            if (converged)
            {
                break;
            }
        }

        derivative = derivativeSum * step * 2.0 / Math.PI;
        return Math.Clamp(estimate * 2.0 / Math.PI, 0.0, 1.0);
    }

    internal static void RequireSigmas(double sigma1, double sigma2)
    {
        if (!(sigma1 >= 0.0 && double.IsFinite(sigma1)))
        {
            throw new ArgumentException($"sigma1 = {sigma1}; a standard deviation must be finite and ≥ 0.", nameof(sigma1));
        }

        if (!(sigma2 >= 0.0 && double.IsFinite(sigma2)))
        {
            throw new ArgumentException($"sigma2 = {sigma2}; a standard deviation must be finite and ≥ 0.", nameof(sigma2));
        }
    }
}
