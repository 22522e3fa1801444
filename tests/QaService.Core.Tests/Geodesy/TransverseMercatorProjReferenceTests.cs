using QaService.Core.Geodesy;
using Xunit.Abstractions;

namespace QaService.Core.Tests.Geodesy;

/// <summary>
/// UTM forward/inverse against PROJ 9.1.1 (tests/reference-data/tm-utm-proj.tsv: cs2cs EPSG:4326 → EPSG:326zz/327zz,
/// 2 400 points in 16 zones × 2 hemispheres, up to 12° from the central meridian and latitudes up to ±84°).
/// </summary>
public sealed class TransverseMercatorProjReferenceTests(ITestOutputHelper output)
{
    /// <summary>
    /// Forward tolerance 0.1 mm. PROJ's UTM (<c>+proj=utm</c>, "extended" tmerc of Poder/Engsager) evaluates the same
    /// 6th-order Krüger series as Karney (2011), so the two should agree to nanometres; the file holds 1e-6 m
    /// (rounding ≤ 5e-7 m). 0.1 mm leaves margin while staying far below the ProjNet drift (22 mm) we must catch.
    /// </summary>
    private const double ForwardToleranceMetres = 1e-4;

    /// <summary>Inverse tolerance 1e-9° (≈ 0.1 mm on the ground); PROJ's 1e-6 m rounding maps to ≈ 1e-11°.</summary>
    private const double InverseToleranceDegrees = 1e-9;

    private static IEnumerable<(double Lat, double Lon, int Zone, bool South, double E, double N)> Rows()
        => ReferenceData.Load("tm-utm-proj.tsv").Select(r => (
            ReferenceData.D(r[0]), ReferenceData.D(r[1]), int.Parse(r[2], System.Globalization.CultureInfo.InvariantCulture),
            r[3] == "S", ReferenceData.D(r[4]), ReferenceData.D(r[5])));

    [Fact]
    public void Forward_MatchesProjCs2cs_WithinATenthOfAMillimetre()
    {
        double maxError = 0;
        int count = 0;
        foreach (var p in Rows())
        {
            ProjectedCoordinate en = Utm.Zone(p.Zone, p.South).Forward(p.Lat, p.Lon);
            double error = double.Hypot(en.EastingMetres - p.E, en.NorthingMetres - p.N);
            maxError = Math.Max(maxError, error);
            // Outside source: PROJ 9.1.1 cs2cs, tm-utm-proj.tsv.
            Assert.True(error < ForwardToleranceMetres, $"zone {p.Zone}{(p.South ? "S" : "N")} ({p.Lat}, {p.Lon}): {error:E3} m vs PROJ");
            count++;
        }

        Assert.True(count >= 2000, $"only {count} reference points");
        output.WriteLine($"UTM forward vs PROJ 9.1.1: {count} points, max |ΔEN| = {maxError:E3} m");
    }

    /// <summary>
    /// The batch method (vector kernel where the hardware has 256-bit vectors, else scalar) against PROJ, zone by zone:
    /// within 1e-6 m, the rounding of the reference file (PROJ's series is the same as ours to nanometres), and within
    /// 1e-8 m of the scalar method, so any fault of the vectorised elementary functions would show.
    /// </summary>
    [Fact]
    public void BatchForward_MatchesProjCs2cs_WithinTheFileRounding()
    {
        const double ProjToleranceMetres = 1e-6;
        const double ScalarToleranceMetres = 1e-8;
        double maxError = 0, maxFromScalar = 0;
        int count = 0;
        foreach (var zone in Rows().GroupBy(p => (p.Zone, p.South)))
        {
            var points = zone.ToArray();
            var tm = Utm.Zone(zone.Key.Zone, zone.Key.South);
            var e = new double[points.Length];
            var n = new double[points.Length];
            tm.Forward(points.Select(p => p.Lat).ToArray(), points.Select(p => p.Lon).ToArray(), e, n);
            for (int i = 0; i < points.Length; i++)
            {
                double error = double.Hypot(e[i] - points[i].E, n[i] - points[i].N);
                var scalar = tm.Forward(points[i].Lat, points[i].Lon);
                double fromScalar = double.Hypot(e[i] - scalar.EastingMetres, n[i] - scalar.NorthingMetres);
                maxError = Math.Max(maxError, error);
                maxFromScalar = Math.Max(maxFromScalar, fromScalar);
                // Outside source: PROJ 9.1.1 cs2cs, tm-utm-proj.tsv.
                Assert.True(error <= ProjToleranceMetres, $"zone {zone.Key.Zone} ({points[i].Lat}, {points[i].Lon}): {error:E3} m vs PROJ");
                Assert.True(fromScalar <= ScalarToleranceMetres, $"zone {zone.Key.Zone} ({points[i].Lat}, {points[i].Lon}): {fromScalar:E3} m vs scalar");
                count++;
            }
        }

        Assert.True(count >= 2000, $"only {count} reference points");
        output.WriteLine($"UTM batch forward (vector kernel: {TransverseMercator.VectorKernelAvailable}) vs PROJ 9.1.1: {count} points, max |ΔEN| = {maxError:E3} m; vs scalar {maxFromScalar:E3} m");
    }

    [Fact]
    public void Inverse_OfProjGridCoordinates_RecoversInputLatLon()
    {
        double maxLat = 0, maxLon = 0;
        foreach (var p in Rows())
        {
            var tm = Utm.Zone(p.Zone, p.South);
            (double lat, double lon) = tm.Inverse(p.E, p.N);
            double dLon = Math.IEEERemainder(lon - p.Lon, 360.0);
            maxLat = Math.Max(maxLat, Math.Abs(lat - p.Lat));
            maxLon = Math.Max(maxLon, Math.Abs(dLon));
            // Outside source: PROJ 9.1.1 cs2cs grid coordinates of the listed lat/lon, tm-utm-proj.tsv.
            Assert.True(Math.Abs(lat - p.Lat) < InverseToleranceDegrees, $"lat {p.Lat}: {lat - p.Lat:E3}°");
            Assert.True(Math.Abs(dLon) < InverseToleranceDegrees, $"lon {p.Lon}: {dLon:E3}°");
        }

        output.WriteLine($"UTM inverse of PROJ E/N: max |Δlat| = {maxLat:E3}°, max |Δlon| = {maxLon:E3}°");
    }

    [Fact]
    public void InverseOfForward_RoundTripsWithinOneNanodegree()
    {
        double max = 0;
        foreach (var p in Rows())
        {
            var tm = Utm.Zone(p.Zone, p.South);
            ProjectedCoordinate en = tm.Forward(p.Lat, p.Lon);
            (double lat, double lon) = tm.Inverse(en.EastingMetres, en.NorthingMetres);
            double err = Math.Max(Math.Abs(lat - p.Lat), Math.Abs(Math.IEEERemainder(lon - p.Lon, 360.0)));
            max = Math.Max(max, err);
            Assert.True(err < InverseToleranceDegrees, $"({p.Lat}, {p.Lon}): {err:E3}°");
        }

        output.WriteLine($"UTM round trip: max angular error {max:E3}°");
    }

    /// <summary>
    /// Blocks the vector kernel declines (a pole, a longitude given 360° out, a point outside the domain) go through the
    /// scalar method: the same results (within the kernel's 1e-8 m), and an error raised at its element with the
    /// outputs before it written, as the batch method documents.
    /// </summary>
    [Fact]
    public void BatchForward_FallsBackToTheScalarMethod_WhereTheKernelCannotGo()
    {
        var tm = Utm.Zone(31, southernHemisphere: false);
        double[] lat = [10, 20, 30, 40, 50, 90, -60, 0, 45, 12];
        double[] lon = [3, 4, 5 + 360, 1, 2, 3, 7, 0, 8, -1];
        double[] e = new double[lat.Length], n = new double[lat.Length];
        tm.Forward(lat, lon, e, n);
        for (int i = 0; i < lat.Length; i++)
        {
            ProjectedCoordinate single = tm.Forward(lat[i], lon[i]);
            Assert.Equal(single.EastingMetres, e[i], 1e-8);
            Assert.Equal(single.NorthingMetres, n[i], 1e-8);
        }

        double[] badLon = [3, 4, 5, 1, 2, 3, 100, 0];
        double[] e2 = new double[badLon.Length], n2 = new double[badLon.Length];
        Assert.Throws<ArgumentOutOfRangeException>(() => tm.Forward(lat.AsSpan(0, badLon.Length), badLon, e2, n2));
        for (int i = 0; i < 6; i++)
            Assert.Equal(tm.Forward(lat[i], badLon[i]).EastingMetres, e2[i], 1e-8);
        Assert.Equal(0.0, e2[6]);
    }
}
