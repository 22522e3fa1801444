using System.Globalization;
using QaService.Core.Geodesy;
using QaService.Core.Geodesy.Projections;
using Xunit.Abstractions;
using static QaService.Core.Tests.Geodesy.ReferenceData;

namespace QaService.Core.Tests.Geodesy;

/// <summary>
/// Every implemented EPSG projection method over its whole domain — at and near both poles, up to 180° from the origin
/// (60° for Transverse Mercator), both hemispheres, south/west orientated forms, origins at a pole — forward and
/// inverse, against PROJ 9.1.1 <c>cs2cs</c> with the operation pinned as a PROJ string, and GeographicLib 2.1.2
/// <c>GeodSolve</c> for the ellipsoidal Equidistant Cylindrical that PROJ evaluates spherically
/// (tests/reference-data/projection-sweep-proj.tsv, made by make-method-sweep-reference.py).
/// </summary>
/// <remarks>Tolerance 1 mm; the file rounds to 1e-10 m and 1e-10° (≈ 11 µm).</remarks>
public sealed class ProjectionSweepProjReferenceTests(ITestOutputHelper output)
{
    private const double ToleranceMetres = 1e-3;

    /// <summary>Metres per degree of latitude, rounded up (meridian arc per degree is at most 111.7 km, at the poles).</summary>
    private const double MetresPerDegree = 111_700;

    /// <summary>Latitudes beyond this are "near a pole" for the ill-conditioned inverse fallback, degrees.</summary>
    private const double PoleBandDegrees = 89;

    [Fact]
    public void Every_method_over_its_domain_agrees_with_proj_within_a_millimetre()
    {
        var lines = File.ReadLines(Tests.ReferenceFiles.PathOf("projection-sweep-proj.tsv")).Where(l => l.Length > 0 && !l.StartsWith('#')).Select(l => l.Split('\t')).ToList();
        var projections = lines.Where(f => f[0] == "case").ToDictionary(f => f[1], Build);
        var methods = lines.Where(f => f[0] == "case").ToDictionary(f => f[1], f => int.Parse(f[2], CultureInfo.InvariantCulture));
        var worst = new Dictionary<string, (double Forward, double Inverse, int Count)>();
        var failures = new List<string>();
        var roundTrips = 0;
        foreach (var r in lines.Where(f => f[0] != "case"))
        {
            var projection = projections[r[1]];
            double error;
            try
            {
                if (r[0] == "fwd")
                {
                    var en = projection.Forward(D(r[2]), D(r[3]));
                    error = double.Hypot(en.EastingMetres - D(r[4]), en.NorthingMetres - D(r[5]));
                }
                else
                {
                    double lat = D(r[4]), lon = D(r[5]);
                    var (phi, lambda) = projection.Inverse(D(r[2]), D(r[3]));
                    double dLon = Math.IEEERemainder(lambda - lon, 360) * Math.Cos(lat * Math.PI / 180);
                    error = double.Hypot(phi - lat, dLon) * MetresPerDegree;
                    if (!(error <= ToleranceMetres) && Math.Abs(lat) > PoleBandDegrees && double.IsFinite(phi))
                    {
                        // Within 1° of a pole the inverse of conics, Cassini and the equal-area methods is ill-conditioned
                        // (dN/dφ → 0 there: the file's 1e-4 m rounding moves φ by metres), so PROJ's answer is one of
                        // many: ours must then map back onto the input within 1 mm by the forward checked above.
                        var back = projection.Forward(phi, lambda);
                        error = double.Hypot(back.EastingMetres - D(r[2]), back.NorthingMetres - D(r[3]));
                        roundTrips++;
                    }
                }
            }
            catch (ArgumentException e)
            {
                failures.Add($"{r[0]} {r[1]} ({r[2]}, {r[3]}): {e.Message}");
                continue;
            }

            var w = worst.GetValueOrDefault(r[1]);
            worst[r[1]] = r[0] == "fwd" ? (Math.Max(w.Forward, error), w.Inverse, w.Count + 1) : (w.Forward, Math.Max(w.Inverse, error), w.Count + 1);
            if (!(error <= ToleranceMetres))
                failures.Add($"{r[0]} {r[1]} ({r[2]}, {r[3]}) / ({r[4]}, {r[5]}): {error:E3} m");
        }

        foreach (var (name, w) in worst.OrderBy(p => methods[p.Key]))
            output.WriteLine($"EPSG {methods[name]} {name}: {w.Count} rows, max forward {w.Forward:E2} m, max inverse {w.Inverse:E2} m");
        output.WriteLine($"{roundTrips} ill-conditioned inverse rows near a pole checked by round trip instead");
        Assert.InRange(roundTrips, 0, 200); // a few; many would mean the fallback hides a real difference
        foreach (var f in failures.GroupBy(f => f.Split(' ')[1]).SelectMany(g => g.Take(4)))
            output.WriteLine(f);
        Assert.True(failures.Count == 0, $"{failures.Count} rows beyond 1 mm: " + string.Join("; ", failures.Take(12)));
        Assert.Equal(ProjectionFactory.SupportedMethods.Order(), methods.Values.Distinct().Order()); // every implemented method is swept
    }

    private static IMapProjection Build(string[] c)
    {
        double a = D(c[3]), rf = D(c[4]);
        var parameters = c[5].Split(';').Select(p => p.Split('=')).ToDictionary(p => int.Parse(p[0], CultureInfo.InvariantCulture), p => D(p[1]));
        return ProjectionFactory.Create(int.Parse(c[2], CultureInfo.InvariantCulture), new Ellipsoid(c[1], a, rf == 0 ? double.PositiveInfinity : rf), parameters)!;
    }
}
