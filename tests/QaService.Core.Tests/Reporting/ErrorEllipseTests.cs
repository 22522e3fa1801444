using QaService.Core.Statistics;
using QaService.Core.Tests.Geodesy;

namespace QaService.Core.Tests.Reporting;

public sealed class ErrorEllipseTests
{
    [Fact]
    public void Scale_for_95_percent_is_the_chi_square_2_quantile()
    {
        // scipy 1.10.1: sqrt(chi2.ppf(0.95, 2)) = 2.44774683068082 (header of error-ellipse-numpy.tsv).
        Assert.Equal(2.44774683068082, ErrorEllipse.ScaleFor(0.95), 1e-13);
        Assert.Throws<ArgumentOutOfRangeException>(() => ErrorEllipse.ScaleFor(1.0));
    }

    [Fact]
    public void Axes_and_direction_match_numpy_eigh()
    {
        // Outside source: numpy 1.24.2 linalg.eigh and scipy 1.10.1 chi2 (tests/reference-data/make-ellipse-reference.py).
        // Tolerance: 1e-12 m on axes of ≤ 1 m (closed form vs LAPACK, both a few ulps); 1e-7° on the direction,
        // looser where the ellipse is nearly a circle and the direction is ill-conditioned.
        var rows = ReferenceData.Load("error-ellipse-numpy.tsv");
        Assert.True(rows.Count >= 50);
        foreach (var row in rows)
        {
            var e = ErrorEllipse.FromSecondMoments(ReferenceData.D(row[0]), ReferenceData.D(row[1]), ReferenceData.D(row[2]), 0.95);
            Assert.Equal(ReferenceData.D(row[3]), e.SemiMajorMetres, 1e-12);
            Assert.Equal(ReferenceData.D(row[4]), e.SemiMinorMetres, 1e-12);
            double expected = ReferenceData.D(row[5]);
            double difference = Math.Abs(e.MajorAxisAzimuthDegrees - expected);
            difference = Math.Min(difference, 180.0 - difference);
            double roundness = (e.SemiMajorMetres - e.SemiMinorMetres) / e.SemiMajorMetres;
            Assert.True(difference < (roundness > 1e-3 ? 1e-7 : 1e-3), $"azimuth {e.MajorAxisAzimuthDegrees} vs numpy {expected}");
        }
    }

    [Theory]
    [InlineData(4.0, 1.0, 0.0, 90.0)] // wider east-west: major axis points east
    [InlineData(1.0, 4.0, 0.0, 0.0)] // taller north-south: major axis points north
    [InlineData(1.0, 1.0, 0.9, 45.0)] // positive E-N correlation: north-east
    [InlineData(1.0, 1.0, -0.9, 135.0)] // negative correlation: south-east
    public void Direction_follows_the_shape_of_the_cloud(double mE, double mN, double mEN, double azimuth) =>
        // Geometry of the principal axes (common practice); azimuth clockwise from north.
        Assert.Equal(azimuth, ErrorEllipse.FromSecondMoments(mE, mN, mEN, 0.95).MajorAxisAzimuthDegrees, 1e-9);
}
