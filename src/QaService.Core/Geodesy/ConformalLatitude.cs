namespace QaService.Core.Geodesy;

/// <summary>
/// Conversion between τ = tan φ (geodetic latitude) and τ′ = tan χ (conformal latitude), following
/// C. F. F. Karney (2011), "Transverse Mercator with an accuracy of a few nanometers",
/// J. Geodesy 85(8):475–485, doi:10.1007/s00190-011-0445-3, §2 (conformal latitude; Newton's method for its inverse).
/// </summary>
internal static class ConformalLatitude
{
    /// <summary>Maximum Newton iterations for <see cref="TauFromTauPrime"/>; GeographicLib's <c>Math::tauf</c> documents convergence in at most 2 (mean 1.95) in double precision.</summary>
    private const int MaxNewtonIterations = 5;

    /// <summary>Relative stopping tolerance for the Newton step, √ε/10 (Karney 2011 §2 / GeographicLib <c>Math::tauf</c>), ε = 2^−52.</summary>
    private const double NewtonRelativeTolerance = 1.4901161193847656e-8 / 10;

    /// <summary>|τ′| above which the starting guess uses the asymptotic relation τ ≈ τ′·exp(e·atanh e) (GeographicLib <c>Math::tauf</c>).</summary>
    private const double LargeTauPrime = 70;

    /// <summary>
    /// τ′ = τ√(1 + σ²) − σ√(1 + τ²), σ = sinh(e·atanh(e τ/√(1 + τ²))) (Karney 2011 §2).
    /// </summary>
    /// <param name="tau">τ = tan φ, any finite value.</param>
    /// <param name="e">First eccentricity e (0 ≤ e &lt; 1).</param>
    internal static double TauPrime(double tau, double e)
    {
        double tau1 = double.Hypot(1.0, tau);
        double sigma = Math.Sinh(e * Math.Atanh(e * tau / tau1));
        return (double.Hypot(1.0, sigma) * tau) - (sigma * tau1);
    }

    /// <summary>
    /// Inverse of <see cref="TauPrime"/> by Newton's method (Karney 2011 §2) with the derivative
    /// dτ′/dτ = (1 − e²)√(1 + τ′²)√(1 + τ²)/(1 + (1 − e²)τ²). Starting value τ = τ′/(1 − e²).
    /// </summary>
    /// <param name="tauPrime">τ′ = tan χ, any finite value.</param>
    /// <param name="e">First eccentricity e (0 ≤ e &lt; 1).</param>
    internal static double TauFromTauPrime(double tauPrime, double e)
    {
        double e2m = 1.0 - (e * e);
        double tau = Math.Abs(tauPrime) > LargeTauPrime
            ? tauPrime * Math.Exp(e * Math.Atanh(e))
            : tauPrime / e2m;
        double stopTolerance = NewtonRelativeTolerance * Math.Max(1.0, Math.Abs(tauPrime));
        for (int i = 0; i < MaxNewtonIterations; i++)
        {
            double tauPrimeOfTau = TauPrime(tau, e);
            double step = (tauPrime - tauPrimeOfTau) * (1.0 + (e2m * tau * tau))
                / (e2m * double.Hypot(1.0, tau) * double.Hypot(1.0, tauPrimeOfTau));
            tau += step;
            if (!(Math.Abs(step) >= stopTolerance))
            {
                break;
            }
        }

        return tau;
    }
}
