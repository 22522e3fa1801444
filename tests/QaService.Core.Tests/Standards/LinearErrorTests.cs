using QaService.Core.Standards;

namespace QaService.Core.Tests.Standards;

public class LinearErrorTests
{
    [Fact]
    public void Le90_factor_is_the_95th_normal_quantile()
    {
        // check-values.md §3, status V (alias) / C (factor): LE90 = VMAS = 1.6449 sigma, exact 1.644854 = Phi^-1(0.95).
        Assert.Equal(LinearError.Le90Factor, MathNet.Numerics.Distributions.Normal.InvCDF(0.0, 1.0, 0.95), 0.5e-4);
        Assert.Equal(1.6449 * 0.1, LinearError.Le90(0.1), 1e-15);
    }

    [Fact]
    public void Globe_dted_example()
    {
        // check-values.md §3, status V: NGDC GLOBE documentation, "±30 m LE90 ≈ RMSE 18 m" (whole metres).
        Assert.Equal(18.0, 30.0 / LinearError.Le90Factor, 0.5);
    }

    [Fact]
    public void Nmas_ratios()
    {
        // FGDC-STD-007.3-1998 appendix on other standards (check-values §1: M section, ratios C), 4 decimals:
        // CMAS = 2.1460 RMSE_x = 1.5175 RMSE_r; Accuracy_r = 1.1406 CMAS; Accuracy_z = 1.1916 VMAS.
        Assert.Equal(Nmas.CircularMapAccuracyFactor, Math.Sqrt(-2.0 * Math.Log(0.1)), 0.5e-4); // 2.145966, check-values §3, C
        Assert.Equal(1.5175, Nmas.CmasFromRadialRmse(1.0), 0.5e-4);
        Assert.Equal(1.1406, Nssda.HorizontalFactor / Nmas.CircularMapAccuracyFactor, 0.5e-4);
        Assert.Equal(1.1916, Nssda.VerticalFactor / LinearError.Le90Factor, 0.5e-4);
    }
}
