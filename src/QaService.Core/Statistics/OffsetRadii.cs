namespace QaService.Core.Statistics;

/// <summary>
/// Radii about the mark predicted for errors with the observed systematic offset: the residuals modelled as
/// N(mean, covariance about the mean) instead of the contract's N(0, second moments about zero). Computed exactly by
/// <see cref="OffsetErrorRadius"/>. When the offset is zero the two models agree up to the n − 1 divisor.
/// All lengths in metres.
/// </summary>
/// <param name="MeanE">Offset east, m (the sample mean of dE).</param>
/// <param name="MeanN">Offset north, m.</param>
/// <param name="Cep50">Radius about the mark holding 50 %, m.</param>
/// <param name="Ce90">Radius holding 90 %, m.</param>
/// <param name="R95">Radius holding 95 %, m.</param>
/// <param name="VerticalMean">Mean dU, m; null without vertical residuals.</param>
/// <param name="Le90">|dU| bound holding 90 % for N(mean, sd²), m.</param>
/// <param name="Le95">|dU| bound holding 95 %, m.</param>
public sealed record OffsetRadii(double MeanE, double MeanN, double Cep50, double Ce90, double R95, double? VerticalMean, double? Le90, double? Le95)
{
    /// <summary>
    /// Thin but not singular spread (σmin/σmax between <see cref="OffsetCircleProbability.SingularAxisRatio"/> and
    /// <see cref="ValidatedAxisRatio"/>) with an offset that does not dominate it: the quadrature's accuracy is only
    /// validated from 1e-3 (see <see cref="OffsetCircleProbability"/>) and its node count grows as the ratio falls
    /// (about a second per report near 1e-4), so the model is left out rather than given unvalidated.
    /// </summary>
    private static bool OutsideValidatedRange(BivariateNormal distribution)
    {
        var (major, minor) = PrincipalAxes.FromSecondMoments(distribution.VarianceEast, distribution.VarianceNorth, distribution.CovarianceEastNorth);
        if (major == 0.0)
            return false;
        double ratio = minor / major;
        double offset = double.Hypot(distribution.MeanEast, distribution.MeanNorth);
        bool offsetDominates = major <= OffsetDominanceRatio * offset;
        return ratio >= OffsetCircleProbability.SingularAxisRatio && ratio < ValidatedAxisRatio && !offsetDominates;
    }

    /// <summary>Smallest σmin/σmax for which the offset quadrature is validated against scipy (1e-12 in P).</summary>
    public const double ValidatedAxisRatio = 1e-3;

    /// <summary>σmax/|μ| below which <see cref="OffsetErrorRadius"/> linearises along the offset (no quadrature).</summary>
    private const double OffsetDominanceRatio = 1e-4;

    /// <summary>From the sample means and covariances (divisor n − 1); null when n &lt; 2, or for a thin spread outside the validated range.</summary>
    /// <param name="dEMetres">East residuals, m.</param>
    /// <param name="dNMetres">North residuals, m.</param>
    /// <param name="dUMetres">Vertical residuals, m (may be empty).</param>
    public static OffsetRadii? Compute(ReadOnlySpan<double> dEMetres, ReadOnlySpan<double> dNMetres, ReadOnlySpan<double> dUMetres)
    {
        int n = dEMetres.Length;
        if (n < 2)
            return null;
        double meanE = SampleMoments.Mean(dEMetres), meanN = SampleMoments.Mean(dNMetres);
        double see = 0, snn = 0, sen = 0;
        for (int i = 0; i < n; i++)
        {
            double de = dEMetres[i] - meanE, dn = dNMetres[i] - meanN;
            see += de * de;
            snn += dn * dn;
            sen += de * dn;
        }
        var distribution = new BivariateNormal(meanE, meanN, see / (n - 1), snn / (n - 1), sen / (n - 1));
        if (OutsideValidatedRange(distribution))
            return null;
        double? meanU = null, le90 = null, le95 = null;
        if (dUMetres.Length >= 2)
        {
            meanU = SampleMoments.Mean(dUMetres);
            double sdU = SampleMoments.SampleStandardDeviation(dUMetres);
            le90 = OffsetErrorRadius.Linear(0.90, meanU.Value, sdU);
            le95 = OffsetErrorRadius.Linear(0.95, meanU.Value, sdU);
        }
        return new OffsetRadii(meanE, meanN,
            OffsetErrorRadius.Circular(0.50, distribution), OffsetErrorRadius.Circular(0.90, distribution), OffsetErrorRadius.Circular(0.95, distribution),
            meanU, le90, le95);
    }
}
