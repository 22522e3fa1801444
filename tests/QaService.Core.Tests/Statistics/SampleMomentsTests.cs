using QaService.Core.Standards;
using QaService.Core.Statistics;

namespace QaService.Core.Tests.Statistics;

public class SampleMomentsTests
{
    // USGS lidar vertical accuracy report LA_Barataria_2013 (VA.txt), check-values.md §1, status V.
    private const int UsgsN = 51;
    private const double UsgsMean = -0.005333;
    private const double UsgsSd = 0.057721;
    private const double UsgsRmse = 0.0574002119585;
    private const double UsgsAccuracyZ = 0.112504415439;

    /// <summary>Any 51 values moved by an affine map to a chosen mean and sample SD (n − 1).</summary>
    private static double[] VectorWith(double mean, double sampleSd)
    {
        double[] raw = Enumerable.Range(0, UsgsN).Select(i => Math.Sin(1.7 * i) + (0.01 * i)).ToArray();
        double rawMean = raw.Average();
        double rawSd = Math.Sqrt(raw.Sum(x => (x - rawMean) * (x - rawMean)) / (UsgsN - 1));
        return raw.Select(x => mean + ((x - rawMean) * sampleSd / rawSd)).ToArray();
    }

    [Fact]
    public void Usgs_example_with_printed_mean_and_sd_gives_printed_rmse_within_rounding()
    {
        double[] dz = VectorWith(UsgsMean, UsgsSd);
        Assert.Equal(UsgsMean, SampleMoments.Mean(dz), 1e-15);
        Assert.Equal(UsgsSd, SampleMoments.SampleStandardDeviation(dz), 1e-15);
        // mean and SD are printed to 6 decimals; ±0.5e-6 in each moves RMSE by at most ~0.55e-6.
        Assert.Equal(UsgsRmse, SampleMoments.RootMeanSquareAboutZero(dz), 0.6e-6);
    }

    [Fact]
    public void Usgs_example_rmse_and_accuracy_z_to_1e9_and_rmse_is_not_sd()
    {
        // The unrounded SD implied by the published RMSE: RMSE^2 = mean^2 + SD^2 (n-1)/n (check-values.md §1, C).
        double impliedSd = Math.Sqrt(((UsgsRmse * UsgsRmse) - (UsgsMean * UsgsMean)) * UsgsN / (UsgsN - 1));
        Assert.Equal(UsgsSd, impliedSd, 0.5e-6); // it rounds to the printed SD, so the report used n - 1

        double[] dz = VectorWith(UsgsMean, impliedSd);
        VerticalAccuracy vertical = VerticalAccuracy.Compute(dz);
        Assert.Equal(UsgsN, vertical.N);
        Assert.Equal(UsgsRmse, vertical.Rmse, 1e-9);
        Assert.Equal(UsgsAccuracyZ, vertical.Nssda95, 1e-9);
        Assert.Equal(UsgsAccuracyZ, Nssda.Vertical(UsgsRmse), 1e-9);
        Assert.NotEqual(vertical.Sd!.Value, vertical.Rmse, 1e-4); // 0.057721 vs 0.057400: RMSE is not the SD
    }

    [Fact]
    public void Sensors_2023_table_population_versus_sample_sd()
    {
        // Sensors 2023, 23(19):8020, doi:10.3390/s23198020, Table 1 (check-values.md §7): data V, figures C.
        // The paper prints sigma = 0.012, 0.006, 0.013 m, reproduced only by the population SD (divisor n).
        double[][] columns =
        [
            [0.007, 0.009, -0.017, 0.002, -0.006, 0.022],
            [-0.009, 0.008, -0.003, 0.001, 0.000, 0.010],
            [-0.009, 0.004, -0.015, 0.007, -0.009, 0.024],
        ];
        double[] population = [0.0122122, 0.00641396, 0.0130852];
        double[] sample = [0.0133778, 0.00702614, 0.0143341];
        double[] rmse = [0.0125366, 0.00651920, 0.0130894];
        double[] printed = [0.012, 0.006, 0.013];
        for (int i = 0; i < 3; i++)
        {
            // check-values prints 6 significant digits: tolerance half a unit of the 6th digit.
            Assert.Equal(population[i], SampleMoments.PopulationStandardDeviation(columns[i]), 0.5e-7);
            Assert.Equal(sample[i], SampleMoments.SampleStandardDeviation(columns[i]), 0.5e-7);
            Assert.Equal(rmse[i], SampleMoments.RootMeanSquareAboutZero(columns[i]), 0.5e-7);
            Assert.Equal(printed[i], Math.Round(SampleMoments.PopulationStandardDeviation(columns[i]), 3));
        }

        // Our report's sdE is the n - 1 estimator: the east column gives 0.0133778, not the paper's 0.012.
        HorizontalAccuracy horizontal = HorizontalAccuracy.Compute(columns[0], columns[1]);
        Assert.Equal(0.0133778, horizontal.SdE!.Value, 0.5e-7);
        Assert.Equal(0.00702614, horizontal.SdN!.Value, 0.5e-8);
        Assert.Equal(0.0125366, horizontal.RmseE, 0.5e-7);
        Assert.NotEqual(0.012, Math.Round(horizontal.SdE.Value, 3));
    }

    [Fact]
    public void Invalid_input()
    {
        Assert.Throws<ArgumentException>(() => SampleMoments.Mean([]));
        Assert.Throws<ArgumentException>(() => SampleMoments.SampleStandardDeviation([1.0]));
        Assert.Throws<ArgumentException>(() => SampleMoments.RootMeanSquareAboutZero([1.0, double.NaN]));
        Assert.Throws<ArgumentException>(() => SampleMoments.MeanProductAboutZero([1.0], [1.0, 2.0]));
    }
}
