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
/// Quadrature: MathNet.Numerics adaptive Gauss–Kronrod (31 points) on [0, π/2] to a relative tolerance of
/// <see cref="QuadratureRelativeTolerance"/>; its boundary layer of width ≈ σ₂/σ₁ near φ = π/2 is resolved by
/// the adaptive splitting. Closed forms are used where they exist: σ₂ = 0 gives erf(r/(σ₁√2)) (one-dimensional),
/// σ₁ = σ₂ gives 1 − exp(−r²/(2σ²)) (Rayleigh), σ₁ = σ₂ = 0 gives 1 for every r ≥ 0.
/// Accuracy: relative error of the probability (and of its complement) below 1e-12, checked against the closed
/// forms, against scipy (see tests/reference-data/make-radius-reference.py) and against the check values.
/// </para>
/// </remarks>
public static class CircleProbability
{
    /// <summary>Relative tolerance handed to the Gauss–Kronrod integrator.</summary>
    internal const double QuadratureRelativeTolerance = 1e-14;

    /// <summary>Largest number of interval bisections the integrator may make (resolves σ₂/σ₁ down to ~1e-15).</summary>
    private const int QuadratureMaximumDepth = 60;

    /// <summary>Gauss–Kronrod order (one of MathNet's precomputed rules).</summary>
    private const int QuadratureOrder = 31;

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

        if (q == 0.0)
        {
            double z = rho / Math.Sqrt(2.0);
            return complement ? SpecialFunctions.Erfc(z) : SpecialFunctions.Erf(z);
        }

        if (q == 1.0)
        {
            double halfSquare = rho * rho / 2.0;
            return complement ? Math.Exp(-halfSquare) : -SpecialFunctions.Expm1(-halfSquare);
        }

        return ByQuadrature(rho, q, complement);
    }

    /// <summary>The φ-integral of the class remarks, evaluated for 0 &lt; q &lt; 1 (exposed for tests).</summary>
    internal static double ByQuadrature(double rho, double q, bool complement)
    {
        double halfRhoSquare = rho * rho / 2.0;
        double qSquare = q * q;
        Func<double, double> integrand = complement
            ? phi => Math.Exp(-halfRhoSquare / H(phi, qSquare))
            : phi => -SpecialFunctions.Expm1(-halfRhoSquare / H(phi, qSquare));
        double integral = Integrate.GaussKronrod(
            integrand, 0.0, Math.PI / 2.0, out _, out _,
            QuadratureRelativeTolerance, QuadratureMaximumDepth, QuadratureOrder);
        return Math.Clamp(integral * 2.0 / Math.PI, 0.0, 1.0);
    }

    private static double H(double phi, double qSquare)
    {
        double c = Math.Cos(phi);
        double s = Math.Sin(phi);
        return (c * c) + (qSquare * s * s);
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
