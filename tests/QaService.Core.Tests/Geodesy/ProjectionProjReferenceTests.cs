using QaService.Core.Geodesy;
using QaService.Core.Geodesy.Catalog;
using Xunit.Abstractions;
using static QaService.Core.Tests.Geodesy.ReferenceData;

namespace QaService.Core.Tests.Geodesy;

/// <summary>
/// Every projection method of the catalog against PROJ 9.1.1 <c>cs2cs</c> (tests/reference-data/projections-proj.tsv,
/// made by make-projection-reference.py): forward and inverse, 73 CRSs, points over each CRS's EPSG area of
/// use widened by 1° (zone edges), southern hemisphere, high latitudes, US survey foot and international foot.
/// </summary>
/// <remarks>
/// Tolerance 1 mm (the target for projections): the file rounds grid values to 1e-10 unit and
/// angles to 1e-10° (≈ 11 µm), so anything above a few µm is a formula difference; 1 mm leaves room only for
/// the documented series truncation of LAEA's inverse, which PROJ 9.1.1 shares.
/// </remarks>
public sealed class ProjectionProjReferenceTests(ITestOutputHelper output)
{
    private const double ToleranceMetres = 1e-3;

    /// <summary>Metres per degree of latitude, rounded up (a·π/180 on GRS 80/WGS 84 is 111 319.5 m), to turn angle errors into lengths.</summary>
    private const double MetresPerDegree = 111_320;

    [Fact]
    public void Forward_and_inverse_agree_with_proj_within_a_millimetre()
    {
        var rows = Load("projections-proj.tsv");
        Assert.True(rows.Count >= 8000, $"only {rows.Count} reference rows");
        var worst = new Dictionary<string, (double Forward, double Inverse, int Count)>();
        var failures = new List<string>();
        foreach (var r in rows)
        {
            var crs = CrsCatalog.ByCode(int.Parse(r[1], System.Globalization.CultureInfo.InvariantCulture))!;
            var projection = crs.Projection!;
            double unit = crs.Unit.MetresPerUnit;
            double lat = D(r[2]), lon = D(r[3]), e = D(r[4]), n = D(r[5]);
            double error;
            if (r[0] == "fwd")
            {
                var en = projection.Forward(lat, lon);
                error = double.Hypot(en.EastingMetres - (e * unit), en.NorthingMetres - (n * unit));
            }
            else
            {
                var (phi, lambda) = projection.Inverse(e * unit, n * unit);
                double dLon = Math.IEEERemainder(lambda - lon, 360) * Math.Cos(lat * Math.PI / 180);
                error = double.Hypot(phi - lat, dLon) * MetresPerDegree;
            }

            var method = crs.Conversion!.MethodName;
            var w = worst.GetValueOrDefault(method);
            worst[method] = r[0] == "fwd" ? (Math.Max(w.Forward, error), w.Inverse, w.Count + 1) : (w.Forward, Math.Max(w.Inverse, error), w.Count + 1);
            if (!(error <= ToleranceMetres))
                failures.Add($"{r[0]} {crs.Identifier} ({r[2]}, {r[3]}) / ({r[4]}, {r[5]}): {error:E3} m");
        }

        foreach (var (method, w) in worst.OrderBy(p => p.Key))
            output.WriteLine($"{method}: {w.Count} rows, max forward {w.Forward:E2} m, max inverse {w.Inverse:E2} m");
        Assert.True(failures.Count == 0, $"{failures.Count} rows beyond 1 mm (PROJ 9.1.1 cs2cs): " + string.Join("; ", failures.Take(10)));
        Assert.Equal(15, worst.Count); // every catalog method PROJ 9.1.1 runs from an EPSG code (not 1028, 9824, 9826: see projection-sweep-proj.tsv)
    }
}
