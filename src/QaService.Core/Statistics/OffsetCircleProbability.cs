using MathNet.Numerics;

namespace QaService.Core.Statistics;

/// <summary>
/// A bivariate normal error in east/north: mean (μE, μN) and covariance [[varE, covEN], [covEN, varN]]
/// (units: metres and m²). Unequal variances, correlation and a non-zero mean are all allowed.
/// </summary>
/// <param name="MeanEast">μE, metres, finite.</param>
/// <param name="MeanNorth">μN, metres, finite.</param>
/// <param name="VarianceEast">varE, m², finite, ≥ 0.</param>
/// <param name="VarianceNorth">varN, m², finite, ≥ 0.</param>
/// <param name="CovarianceEastNorth">covEN, m², with covEN² ≤ varE·varN (up to rounding).</param>
public readonly record struct BivariateNormal(double MeanEast, double MeanNorth, double VarianceEast, double VarianceNorth, double CovarianceEastNorth)
{
    /// <summary>Independent axes: standard deviations σE, σN (m), correlation ρ, mean (μE, μN) (m).</summary>
    public static BivariateNormal FromSigmas(double sigmaEast, double sigmaNorth, double correlation = 0.0, double meanEast = 0.0, double meanNorth = 0.0) =>
        new(meanEast, meanNorth, sigmaEast * sigmaEast, sigmaNorth * sigmaNorth, correlation * sigmaEast * sigmaNorth);
}

/// <summary>
/// Exact P(|X| ≤ r) for X ~ N(μ, Σ) in the plane — the probability that a fix lands within r of the mark when its error
/// has a systematic offset μ (the noncentral case: a weighted sum of noncentral χ²₁ variables, Imhof 1961,
/// Biometrika 48:419–426, doi:10.1093/biomet/48.3-4.419; Davies 1980, Applied Statistics 29:323–333, algorithm AS 155).
/// </summary>
/// <remarks>
/// <para>
/// Method (derivation, not taken from those papers; a periodic-integrand quadrature). In polar coordinates about the
/// mark, x = ρu with u = (cos θ, sin θ), the density is exp(−½(ρu − μ)ᵀΣ⁻¹(ρu − μ)) / (2π√det Σ). With a = uᵀΣ⁻¹u,
/// b = uᵀΣ⁻¹μ, c = μᵀΣ⁻¹μ, m = b/a, k = c − b²/a ≥ 0, the radial integral ∫₀^r ρ·e^(−(aρ² − 2bρ + c)/2) dρ is closed:
/// (e^(−c/2) − e^(−(k + a(r − m)²)/2))/a + e^(−k/2)·m·√(π/(2a))·[erf(√(a/2)(r − m)) + erf(√(a/2)m)]
/// (the erf pair is taken as an erfc difference when m &lt; 0, so no digits cancel). What remains is an integral over
/// θ ∈ [0, 2π) of a smooth periodic function, for which the trapezoid rule converges geometrically (Trefethen &amp;
/// Weideman 2014, SIAM Review 56(3):385–458, doi:10.1137/130932132); the number of nodes is doubled from
/// <see cref="InitialNodes"/> until two sums agree to <see cref="RelativeTolerance"/> (the first comparison is with the
/// rule on every other initial node).
/// With μ = 0 this reduces to the integral of <see cref="CircleProbability"/>.
/// </para>
/// <para>
/// Range and accuracy: absolute error of P below 1e-12 for axis ratios σmin/σmax ≥ 1e-3 (checked against scipy 1.10
/// double integration and the noncentral χ² CDF, tests/reference-data/make-offset-reference.py, and check-values §5).
/// A singular covariance (ratio below <see cref="SingularAxisRatio"/>) is treated as one-dimensional along the major
/// axis, where P = Φ(z₂) − Φ(z₁) is closed; both variances 0 gives the indicator |μ| ≤ r.
/// </para>
/// </remarks>
public static class OffsetCircleProbability
{
    /// <summary>Trapezoid nodes of the first sum over θ.</summary>
    public const int InitialNodes = 64;

    /// <summary>Most nodes allowed (2²⁰); reached only for axis ratios near 1e-4.</summary>
    public const int MaximumNodes = 1 << 20;

    /// <summary>
    /// Two successive trapezoid sums must agree to this difference relative to max(P, 1e-3); the finer one is returned.
    /// On a smooth periodic integrand doubling the nodes squares the error (Trefethen &amp; Weideman 2014, §3), so the
    /// finer sum is then accurate to rounding; the scipy checks in the tests hold as they did with 1e-13.
    /// </summary>
    public const double RelativeTolerance = 1e-10;

    /// <summary>Below this σmin/σmax the covariance is treated as singular (one-dimensional).</summary>
    public const double SingularAxisRatio = 1e-6;

    /// <summary>P(|X| ≤ radius) for X ~ <paramref name="distribution"/>.</summary>
    /// <param name="radiusMetres">Circle radius about the origin (the mark), metres, ≥ 0.</param>
    /// <param name="distribution">Mean and covariance of the error, metres and m².</param>
    /// <returns>Probability in [0, 1] (see remarks for accuracy).</returns>
    /// <exception cref="ArgumentException">Negative or NaN radius, non-finite moments, or a covariance that is not positive semi-definite.</exception>
    public static double Probability(double radiusMetres, BivariateNormal distribution)
    {
        if (!(radiusMetres >= 0.0))
            throw new ArgumentException($"Radius {radiusMetres} must be ≥ 0.", nameof(radiusMetres));
        var (muE, muN, varE, varN, cov) = distribution;
        if (!double.IsFinite(muE) || !double.IsFinite(muN))
            throw new ArgumentException("The mean must be finite.", nameof(distribution));
        var (major, minor) = PrincipalAxes.FromSecondMoments(varE, varN, cov);
        if (double.IsPositiveInfinity(radiusMetres))
            return 1.0;
        if (major == 0.0)
            return double.Hypot(muE, muN) <= radiusMetres ? 1.0 : 0.0;
        if (minor < SingularAxisRatio * major)
            return OneDimensional(radiusMetres, muE, muN, varE, varN, cov, major);
        return ByQuadrature(radiusMetres, distribution);
    }

    /// <summary>Mass on the line X = μ + σ·Z·e (e the major axis): |X|² ≤ r² is a quadratic inequality in Z.</summary>
    private static double OneDimensional(double r, double muE, double muN, double varE, double varN, double cov, double sigma)
    {
        // Major-axis direction of the covariance.
        double angle = 0.5 * Math.Atan2(2.0 * cov, varE - varN);
        double along = (muE * Math.Cos(angle)) + (muN * Math.Sin(angle));
        double across = (-muE * Math.Sin(angle)) + (muN * Math.Cos(angle));
        double halfChord = (r * r) - (across * across);
        if (halfChord <= 0.0)
            return 0.0;
        double h = Math.Sqrt(halfChord);
        double upper = (h - along) / sigma;
        double lower = (-h - along) / sigma;
        return NormalInterval(lower, upper);
    }

    /// <summary>Φ(upper) − Φ(lower) without cancellation in either tail.</summary>
    internal static double NormalInterval(double lower, double upper)
    {
        const double InverseSqrtTwo = 0.70710678118654752440;
        if (lower >= 0.0)
            return 0.5 * (SpecialFunctions.Erfc(lower * InverseSqrtTwo) - SpecialFunctions.Erfc(upper * InverseSqrtTwo));
        if (upper <= 0.0)
            return 0.5 * (SpecialFunctions.Erfc(-upper * InverseSqrtTwo) - SpecialFunctions.Erfc(-lower * InverseSqrtTwo));
        return 0.5 * (SpecialFunctions.Erf(upper * InverseSqrtTwo) - SpecialFunctions.Erf(lower * InverseSqrtTwo));
    }

    private static double ByQuadrature(double r, BivariateNormal distribution) => ByQuadratureWithDensity(r, distribution).Probability;

    /// <summary>
    /// P(|X| ≤ r) and its derivative in r, the density of |X| at r: dP/dr = r·∫ e^(−(k + a(r − m)²)/2) dθ / (2π√det Σ), the
    /// radial integrand at ρ = r (same substitution as above). The exponential is already evaluated for P, so the
    /// derivative costs one more sum over the same nodes. Null when the quadrature does not apply (a singular or
    /// degenerate spread); then only <see cref="Probability"/> is defined.
    /// </summary>
    internal static (double Probability, double DensityPerMetre)? WithDensity(double radiusMetres, BivariateNormal distribution)
    {
        var (major, minor) = PrincipalAxes.FromSecondMoments(distribution.VarianceEast, distribution.VarianceNorth, distribution.CovarianceEastNorth);
        if (!(radiusMetres >= 0.0) || double.IsPositiveInfinity(radiusMetres) || major == 0.0 || minor < SingularAxisRatio * major)
            return null;
        return ByQuadratureWithDensity(radiusMetres, distribution);
    }

    private static (double Probability, double DensityPerMetre) ByQuadratureWithDensity(double r, BivariateNormal distribution)
    {
        var (muE, muN, varE, varN, cov) = distribution;
        double det = (varE * varN) - (cov * cov);
        // Σ⁻¹ = [[varN, −cov], [−cov, varE]] / det.
        double iEE = varN / det, iNN = varE / det, iEN = -cov / det;
        double c = (iEE * muE * muE) + (2.0 * iEN * muE * muN) + (iNN * muN * muN);
        double expHalfC = Math.Exp(-c / 2.0);
        var table = OffsetCircleNodes.For(distribution, iEE, iNN, iEN, c);

        // The radial integral in direction θ (and the integrand at ρ = r); the θ-only terms come from the node table (see OffsetCircleNodes).
        void AddLevel(ref double total, ref double atRadius, ref double evenTotal, OffsetCircleNodes.Level level)
        {
            double[] aAt = level.A, mAt = level.M, kAt = level.K, sAt = level.S, erfAtMean = level.ErfAtMean, secondFactor = level.SecondFactor;
            for (int i = 0; i < aAt.Length; i++)
            {
                double a = aAt[i], m = mAt[i], k = kAt[i], s = sAt[i];
                double edge = Math.Exp(-(k + (a * (r - m) * (r - m))) / 2.0);
                double first = (expHalfC - edge) / a;
                double erfPair = m >= 0.0
                    ? SpecialFunctions.Erf(s * (r - m)) + erfAtMean[i]
                    : erfAtMean[i] - SpecialFunctions.Erfc(s * (r - m));
                double second = m == 0.0 ? 0.0 : secondFactor[i] * erfPair;
                total += first + second;
                atRadius += edge;
                if ((i & 1) == 0)
                    evenTotal += first + second;
            }
        }

        double scale = 1.0 / (2.0 * Math.PI * Math.Sqrt(det));
        int nodes = InitialNodes;
        double sum = 0.0, edgeSum = 0.0, evenSum = 0.0, unused = 0.0;
        AddLevel(ref sum, ref edgeSum, ref evenSum, table[0]);
        double estimate = scale * sum * (2.0 * Math.PI / nodes);
        // The first level's even nodes are the rule with half as many: when the two agree, the first level has converged
        // by the same test as two levels do below, and no node of the next level is needed (half the work and half the
        // node table, for most distributions: the rule's error falls geometrically, Trefethen & Weideman 2014).
        double half = scale * evenSum * (2.0 * Math.PI / (nodes / 2));
        if (Math.Abs(estimate - half) <= RelativeTolerance * Math.Max(estimate, 1e-3))
            return (Math.Clamp(estimate, 0.0, 1.0), scale * r * edgeSum * (2.0 * Math.PI / nodes));
        for (int level = 1; nodes < MaximumNodes; level++)
        {
            // Add the midpoints: the new nodes of the doubled rule.
            AddLevel(ref sum, ref edgeSum, ref unused, table[level]);
            nodes *= 2;
            double refined = scale * sum * (2.0 * Math.PI / nodes);
            bool converged = Math.Abs(refined - estimate) <= RelativeTolerance * Math.Max(refined, 1e-3);
            estimate = refined;
            if (converged)
                break;
        }

        return (Math.Clamp(estimate, 0.0, 1.0), scale * r * edgeSum * (2.0 * Math.PI / nodes));
    }
}
