using QaService.Core.Standards;
using QaService.Core.Statistics;

namespace QaService.Core.Tests.Statistics;

/// <summary>The §1 synthetic 20-point vector of check-values.md (status C) through the report blocks.</summary>
public class AccuracyBlockTests
{
    private const double Tol = CheckValueVectors.SixDecimals;

    [Fact]
    public void Horizontal_block_of_the_synthetic_vector()
    {
        HorizontalAccuracy h = HorizontalAccuracy.Compute(CheckValueVectors.SyntheticDE, CheckValueVectors.SyntheticDN);
        Assert.Equal(20, h.N);
        Assert.Equal(0.018694, h.RmseE, Tol);
        Assert.Equal(0.017374, h.RmseN, Tol);
        Assert.Equal(0.025521, h.RmseR, Tol);
        Assert.Equal(0.9294, h.RmseN / h.RmseE, 0.5e-4);
        Assert.Equal(0.044141, h.Nssda95, Tol); // "Case 2" (ratio >= 0.6)
        Assert.Equal(Nssda.ApproximateMethod, h.NssdaMethod);
        Assert.Equal(0.044171, Nssda.HorizontalRadialFactor * h.RmseR, Tol); // "Case 1" 1.7308 RMSE_r
        Assert.Equal(0.044201, CircularErrorRadius.Exact(0.95, h.RmseE, h.RmseN), Tol); // exact, independent axes
        Assert.Equal(h.RmseR, h.Drms);
        Assert.Equal(2.0 * h.Drms, h.TwoDrms);

        // Mean radial error 0.024931 is neither RMSE_r nor any reported radius.
        double[] dH = CheckValueVectors.SyntheticDE.Zip(CheckValueVectors.SyntheticDN, double.Hypot).ToArray();
        Assert.Equal(0.024931, SampleMoments.Mean(dH), Tol);
        Assert.NotEqual(h.RmseR, SampleMoments.Mean(dH), 1e-4);

        // Exact radii of N(0, M), M the second-moment matrix WITH its cross moment (correlation -0.17):
        // scipy 1.10.1 via tests/reference-data/make-radius-reference.py, rows synthetic20-*.
        var reference = ScipyRadiusReference.Load().ToDictionary(r => r.Label, r => r.Radius);
        Assert.Equal(reference["synthetic20-cep50"], h.Cep50, reference["synthetic20-cep50"] * 1e-9);
        Assert.Equal(reference["synthetic20-ce90"], h.Ce90, reference["synthetic20-ce90"] * 1e-9);
        Assert.Equal(reference["synthetic20-r95"], h.R95, reference["synthetic20-r95"] * 1e-9);
        Assert.Equal(reference["synthetic20-independent-r95"], CircularErrorRadius.Exact(0.95, h.RmseE, h.RmseN), 1e-11);
        Assert.NotEqual(0.044201, h.R95, 1e-4); // 0.044367: the cross moment changes R95

        // Type-7 percentiles of dH: numpy 1.24.2 numpy.percentile (default 'linear' = type 7) on the same vector.
        Assert.Equal(0.024074016787572608, h.P50, 1e-15);
        Assert.Equal(0.031220951931024154, h.P90, 1e-15);
        Assert.Equal(0.03218297117641816, h.P95, 1e-15);

        // Means and n - 1 SDs: numpy mean and std(ddof=1) on the same vector.
        Assert.Equal(0.00145, h.MeanE, 1e-15);
        Assert.Equal(0.00145, h.MeanN, 1e-15);
        Assert.Equal(0.019121426394712846, h.SdE!.Value, 1e-15);
        Assert.Equal(0.017762986353947532, h.SdN!.Value, 1e-15);
    }

    [Fact]
    public void Vertical_block_of_the_synthetic_vector()
    {
        VerticalAccuracy v = VerticalAccuracy.Compute(CheckValueVectors.SyntheticDU);
        Assert.Equal(20, v.N);
        Assert.Equal(0.038578, v.Rmse, Tol);
        Assert.Equal(0.075614, v.Nssda95, Tol);
        Assert.Equal(0.062400, v.P95, Tol);
        Assert.Equal(LinearError.Le90Factor * v.Rmse, v.Le90);
        Assert.Equal(0.0073, v.Mean, 1e-15);
    }

    [Fact]
    public void Single_point_has_no_sd()
    {
        HorizontalAccuracy h = HorizontalAccuracy.Compute([0.03], [-0.04]);
        Assert.Null(h.SdE);
        Assert.Null(h.SdN);
        Assert.Equal(0.05, h.RmseR, 1e-15);
        Assert.Equal(0.05, h.P95, 1e-15);
        VerticalAccuracy v = VerticalAccuracy.Compute([-0.02]);
        Assert.Null(v.Sd);
        Assert.Equal(0.02, v.P95, 1e-15);
        Assert.Throws<ArgumentException>(() => HorizontalAccuracy.Compute([0.1, 0.2], [0.1]));
        Assert.Throws<ArgumentException>(() => VerticalAccuracy.Compute([]));
    }
}
