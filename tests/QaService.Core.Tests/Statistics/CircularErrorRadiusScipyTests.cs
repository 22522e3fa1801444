using QaService.Core.Statistics;

namespace QaService.Core.Tests.Statistics;

/// <summary>
/// Independent cross-check: scipy 1.10.1 via tests/reference-data/make-radius-reference.py (a different formula:
/// conditional one-dimensional integral with scipy.integrate.quad and scipy.optimize.brentq).
/// </summary>
public class CircularErrorRadiusScipyTests
{
    /// <summary>1e-7 relative: the brief's agreement target; the script's own accuracy is about 1e-11.</summary>
    private const double RelativeTolerance = 1e-7;

    [Fact]
    public void Every_scipy_row_agrees_through_FromSecondMoments()
    {
        IReadOnlyList<ScipyRadiusReference> rows = ScipyRadiusReference.Load();
        Assert.Contains("scipy 1.10.1", ScipyRadiusReference.ScipyVersionLine());
        Assert.True(rows.Count >= 200, $"expected ~200 reference rows, found {rows.Count}");
        var failures = new List<string>();
        double worst = 0.0;
        foreach (ScipyRadiusReference row in rows)
        {
            double radius = CircularErrorRadius.FromSecondMoments(row.Probability, row.MeanSquareE, row.MeanSquareN, row.MeanProductEN);
            double relative = Math.Abs(radius - row.Radius) / row.Radius;
            worst = Math.Max(worst, relative);
            if (!(relative <= RelativeTolerance))
            {
                failures.Add($"{row.Label}: p={row.Probability} got {radius:R}, scipy {row.Radius:R} (rel {relative:E2})");
            }
        }

        Assert.True(failures.Count == 0, string.Join(Environment.NewLine, failures));
        Assert.True(worst <= RelativeTolerance, $"worst relative difference {worst:E2}");
    }

    [Fact]
    public void Principal_axes_agree_with_numpy_eigvalsh()
    {
        // numpy 1.24.2 eigvalsh via the same script; 1e-9 relative (eigenvalues of a symmetric 2x2 matrix, except
        // the minor axis of the nearly singular edge rows, which loses digits to cancellation in numpy itself).
        foreach (ScipyRadiusReference row in ScipyRadiusReference.Load())
        {
            (double major, double minor) = PrincipalAxes.FromSecondMoments(row.MeanSquareE, row.MeanSquareN, row.MeanProductEN);
            Assert.Equal(row.SigmaMajor, major, row.SigmaMajor * 1e-12);
            Assert.Equal(row.SigmaMinor, minor, row.SigmaMajor * 1e-9);
        }
    }
}
