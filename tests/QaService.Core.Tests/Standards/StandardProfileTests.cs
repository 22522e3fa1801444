using QaService.Core.Geodesy.Catalog;
using QaService.Core.Standards;
using QaService.Core.Statistics;
using QaService.Core.Tests.Statistics;

namespace QaService.Core.Tests.Standards;

/// <summary>The selectable standards: their own figures, requirements and statements.</summary>
public sealed class StandardProfileTests
{
    private static StandardInput Input(double? requiredH = null, double? requiredV = null, double? scale = null, double? contour = null,
        double? sigmaH = null, double? sigmaV = null)
    {
        // check-values.md §1 synthetic 20-point vector (C): RMSE_x 0.018694, RMSE_y 0.017374, RMSE_r 0.025521, RMSE_z 0.038578.
        var h = HorizontalAccuracy.Compute(CheckValueVectors.SyntheticDE, CheckValueVectors.SyntheticDN);
        var v = VerticalAccuracy.Compute(CheckValueVectors.SyntheticDU);
        var radial = CheckValueVectors.SyntheticDE.Zip(CheckValueVectors.SyntheticDN, double.Hypot).ToArray();
        var sigmasH = Enumerable.Repeat(sigmaH, 20).ToArray();
        var sigmasV = Enumerable.Repeat(sigmaV, 20).ToArray();
        return new StandardInput(h, v, radial, CheckValueVectors.SyntheticDU.Select(Math.Abs).ToArray(), sigmasH, sigmasV, requiredH, requiredV, scale, contour, LinearUnit.Metre);
    }

    [Fact]
    public void Nssda_profile_keeps_the_contract_figures_and_sentence()
    {
        var result = AccuracyStandards.Evaluate("nssda", Input(0.05, 0.07));
        Assert.Equal("FGDC-STD-007.3-1998", result.Edition);
        Assert.Equal(0.044141, result.Figures[0].Value, 6); // check-values §1 case 2
        Assert.True(result.HorizontalMet);
        Assert.False(result.VerticalMet); // 0.075614 > 0.07
        Assert.StartsWith("Tested 0.044 meters horizontal accuracy at 95% confidence level", result.Statement);
    }

    [Fact]
    public void Asprs_edition_2_folds_the_check_points_accuracy_into_rmse_h()
    {
        // RMSE_H = sqrt(RMSE_H1² + RMSE_H2²) (Ed.2, from memory, check-values §2 M): H1 = 0.025521 m, H2 = sqrt(2)·0.01 m.
        var result = AccuracyStandards.Evaluate("asprs-2023", Input(0.03, 0.04, sigmaH: 0.01, sigmaV: 0.01));
        var rmseH = result.Figures.Single(f => f.Name == "RMSE_H");
        Assert.Equal(Math.Sqrt(0.025521 * 0.025521 + 2 * 0.01 * 0.01), rmseH.Value, 5);
        Assert.Equal(Math.Sqrt(0.038578 * 0.038578 + 0.01 * 0.01), result.Figures.Single(f => f.Name == "RMSE_V").Value, 5);
        Assert.Equal(30, result.MinimumPoints);
        Assert.Contains("Edition 2", result.Edition);
        Assert.Contains("meets the 0.030 meters RMSE_H horizontal positional accuracy class", result.Statement);
        Assert.Contains(result.Notes, n => n.Contains("from memory"));
    }

    [Fact]
    public void Asprs_without_declared_sigmas_uses_the_product_figure_alone()
    {
        var result = AccuracyStandards.Evaluate("asprs-2023", Input(0.02));
        Assert.Equal(0.025521, result.Figures.Single(f => f.Name == "RMSE_H").Value, 6);
        Assert.False(result.HorizontalMet);
        Assert.Contains("does not meet", result.Statement);
    }

    [Theory]
    [InlineData(24000, 12.192)]     // 1/50 inch at 1:24,000 = 40 ft = 12.192 m (USGS leaflet; check-values §3 V/C)
    [InlineData(20000, 10.16)]      // 1:20,000 is "or smaller": 1/50 inch
    [InlineData(10000, 8.466667)]   // larger than 1:20,000: 1/30 inch
    public void Nmas_tolerance_follows_the_1947_rule(double scale, double metres) =>
        Assert.Equal(metres, Nmas1947.HorizontalToleranceMetres(scale), 6);

    [Fact]
    public void Nmas_counts_points_over_the_tolerance()
    {
        // 1:100 map: 1/30 inch = 0.084667 m; contour interval 0.06 m → 0.03 m tolerance: |dz| > 0.03 for 9 of 20 points.
        var result = AccuracyStandards.Evaluate("nmas-1947", Input(scale: 100, contour: 0.06));
        var h = result.Figures.Single(f => f.Name == "share over horizontal tolerance");
        var v = result.Figures.Single(f => f.Name == "share over vertical tolerance");
        Assert.Equal(0.0, h.Value);
        Assert.Equal(CheckValueVectors.SyntheticDU.Count(d => Math.Abs(d) > 0.03) / 20.0, v.Value);
        Assert.True(result.HorizontalMet);
        Assert.False(result.VerticalMet);
        Assert.StartsWith("This map does not comply with National Map Accuracy Standards", result.Statement);
    }

    [Fact]
    public void Nga_judges_predictive_ce90_and_le90()
    {
        // LE90 = 1.6449·RMSE_z (check-values §3); CE90 exact from the second moments.
        var input = Input(0.05, 0.06);
        var result = AccuracyStandards.Evaluate("nga-ce90", input);
        Assert.Equal(input.Horizontal!.Ce90, result.Figures.Single(f => f.Name == "CE90").Value);
        Assert.Equal(1.6449 * 0.038578, result.Figures.Single(f => f.Name == "LE90").Value, 5);
        Assert.True(result.HorizontalMet);
        Assert.False(result.VerticalMet);
        Assert.Contains("at 90 % probability", result.Statement);
    }
}
