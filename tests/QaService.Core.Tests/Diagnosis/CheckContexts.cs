using QaService.Core.Assessment;
using QaService.Core.Diagnosis;
using QaService.Core.Geodesy;
using QaService.Core.Geodesy.Catalog;
using QaService.Core.Reporting;
using QaService.Core.Statistics;

namespace QaService.Core.Tests.Diagnosis;

/// <summary>Builds check inputs from plain residuals; marks on a regular grid around 48.75 N 15 E (invented).</summary>
internal static class CheckContexts
{
    public static CheckContext From(IReadOnlyList<(double DE, double DN, double? DU)> residuals, RequiredAccuracy? spec = null,
        double? sigmaHorizontalMetres = null, bool heightsStated = true)
    {
        var side = (int)Math.Ceiling(Math.Sqrt(residuals.Count));
        var marks = residuals.Select((_, i) => new FramedPoint(i, $"M{i:00}", null,
            new GeodeticCoordinate(48.75 + (i / side) * 0.001, 15.0 + (i % side) * 0.0015, 200.0), true, sigmaHorizontalMetres, null, null)).ToList();
        var rows = residuals.Select((r, i) => new Residual(marks[i].Id, $"F{i:00}", r.DE, r.DN, r.DU, Math.Sqrt(r.DE * r.DE + r.DN * r.DN),
            MarkPairing.ById, null, marks[i].Geodetic.LatitudeDegrees, marks[i].Geodetic.LongitudeDegrees)).ToList();
        var frame = new PointSetFrame(CrsCatalog.ByCode(4979)!, HeightReference.Ellipsoidal, null, null, heightsStated);
        var input = new ValidatedAssessment("test", frame, frame, marks, [], spec, null, new Dictionary<string, string>());
        var horizontal = HorizontalAccuracy.Compute(rows.Select(r => r.DE).ToArray(), rows.Select(r => r.DN).ToArray());
        var up = rows.Where(r => r.DU is not null).Select(r => r.DU!.Value).ToArray();
        return new CheckContext(input, rows, horizontal, up.Length == 0 ? null : VerticalAccuracy.Compute(up));
    }

    /// <summary>
    /// Residuals at the normal quantiles Φ⁻¹((i + ½)/n)·σ, shuffled differently per component: a sample
    /// as clean as normal data can be, for checks that must stay quiet. The largest |z| is Φ⁻¹(1 − ½/n).
    /// </summary>
    public static List<(double DE, double DN, double? DU)> Quantiles(int count, double sigmaMetres)
    {
        double At(int i) => sigmaMetres * MathNet.Numerics.Distributions.Normal.InvCDF(0, 1, (i + 0.5) / count);
        return Enumerable.Range(0, count)
            .Select(i => (At(i), At(i * 7 % count), (double?)At(i * 11 % count)))
            .ToList();
    }

    /// <summary>Deterministic pseudo-normal residuals (Box–Muller on a fixed-seed generator).</summary>
    public static List<(double DE, double DN, double? DU)> Normal(int count, double sigmaMetres, int seed, double offsetE = 0, double offsetN = 0, double offsetU = 0)
    {
        var random = new Random(seed);
        double Gauss() => Math.Sqrt(-2 * Math.Log(1 - random.NextDouble())) * Math.Cos(2 * Math.PI * random.NextDouble());
        return Enumerable.Range(0, count)
            .Select(_ => (offsetE + sigmaMetres * Gauss(), offsetN + sigmaMetres * Gauss(), (double?)(offsetU + sigmaMetres * Gauss())))
            .ToList();
    }
}
