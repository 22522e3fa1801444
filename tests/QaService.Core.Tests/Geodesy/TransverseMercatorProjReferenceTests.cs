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

    [Fact]
    public void BatchForward_EqualsSinglePointForward()
    {
        var rows = Rows().Where(p => p.Zone == 31 && !p.South).ToArray();
        double[] lat = rows.Select(r => r.Lat).ToArray();
        double[] lon = rows.Select(r => r.Lon).ToArray();
        double[] e = new double[rows.Length];
        double[] n = new double[rows.Length];
        var tm = Utm.Zone(31, southernHemisphere: false);

        tm.Forward(lat, lon, e, n);

        for (int i = 0; i < rows.Length; i++)
        {
            ProjectedCoordinate single = tm.Forward(lat[i], lon[i]);
            Assert.Equal(single.EastingMetres, e[i]);
            Assert.Equal(single.NorthingMetres, n[i]);
        }
    }
}
