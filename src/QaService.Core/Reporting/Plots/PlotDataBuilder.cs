using QaService.Core.Geodesy;
using QaService.Core.Statistics;

namespace QaService.Core.Reporting.Plots;

/// <summary>Derives <see cref="PlotData"/> from a stored report (works for every stored report, old or new).</summary>
public static class PlotDataBuilder
{
    /// <summary>Radius steps of the model CDF: fine enough that straight segments look smooth at print size.</summary>
    public const int ModelCdfSteps = 80;

    /// <summary>The model CDF runs past the largest of the empirical errors and R95 by this factor, so both tails show.</summary>
    public const double ModelCdfReach = 1.15;

    public static PlotData Build(AssessmentReport report)
    {
        var included = report.Residuals.Where(r => r.Excluded is null).ToList();
        double[] dE = included.Select(r => r.DE).ToArray();
        double[] dN = included.Select(r => r.DN).ToArray();
        double[] sorted = included.Select(r => r.DH).Order().ToArray();

        ErrorEllipse? ellipse = null;
        var cdf = new List<CdfPoint>();
        if (report.Horizontal is { } h && included.Count > 0)
        {
            ellipse = ErrorEllipse.FromResiduals(dE, dN, ErrorEllipse.ReportProbability);
            cdf.AddRange(ModelCdf(dE, dN, Math.Max(sorted[^1], h.R95) * ModelCdfReach));
        }

        return new PlotData(ellipse, cdf, sorted, Plan(report.Residuals), ResidualFlags.For(report));
    }

    /// <summary>
    /// P(dH ≤ r) of the zero-mean bivariate normal with the residuals' second-moment matrix — the model behind
    /// cep50/ce90/r95 — from <see cref="CircleProbability.ZeroMean"/> (relative error below 1e-12).
    /// </summary>
    private static IEnumerable<CdfPoint> ModelCdf(double[] dE, double[] dN, double reachMetres)
    {
        (double major, double minor) = PrincipalAxes.FromSecondMoments(
            SampleMoments.MeanSquareAboutZero(dE), SampleMoments.MeanSquareAboutZero(dN), SampleMoments.MeanProductAboutZero(dE, dN));
        // P(dH ≤ 0) = 0 exactly; asking the integrator for a zero integral to a relative tolerance never converges.
        yield return new CdfPoint(0.0, 0.0);
        for (int i = 1; i <= ModelCdfSteps; i++)
        {
            double r = reachMetres * i / ModelCdfSteps;
            yield return new CdfPoint(r, CircleProbability.ZeroMean(r, major, minor));
        }
    }

    /// <summary>
    /// Marks in east-north-up at the marks' mean latitude/longitude on the WGS 84 ellipsoid (heights taken as 0:
    /// a plan, not a survey). ENU rotation per EPSG Guidance Note 7-2 §4.1.2 (<see cref="LocalTangentPlane"/>);
    /// over a few kilometres the plan differs from a map projection by parts per million, invisible at plot size.
    /// Assumes the marks do not straddle the ±180° meridian (their mean longitude would then be wrong).
    /// </summary>
    private static IReadOnlyList<PlanPosition> Plan(IReadOnlyList<Residual> residuals)
    {
        var marks = residuals
            .GroupBy(r => r.Mark, StringComparer.Ordinal)
            .Select(g => g.First())
            .ToList();
        if (marks.Count == 0)
            return [];

        var origin = new GeodeticCoordinate(marks.Average(m => m.MarkLatitude), marks.Average(m => m.MarkLongitude), 0.0);
        var originGeocentric = GeocentricConversion.ToGeocentric(origin, Ellipsoid.Wgs84);
        return marks
            .Select(m =>
            {
                var at = GeocentricConversion.ToGeocentric(new GeodeticCoordinate(m.MarkLatitude, m.MarkLongitude, 0.0), Ellipsoid.Wgs84);
                var enu = LocalTangentPlane.Difference(originGeocentric, origin, at);
                return new PlanPosition(m.Mark, enu.EastMetres, enu.NorthMetres);
            })
            .ToList();
    }
}
