using QaService.Core.Geodesy;
using Xunit.Abstractions;

namespace QaService.Core.Tests.Geodesy;

/// <summary>
/// Series truncation error far from the central meridian, against GeographicLib 2.1.2's exact transverse Mercator
/// (<c>TransverseMercatorProj -k 0.9996</c>, elliptic-function formulation; tests/reference-data/tm-exact-geographiclib.tsv).
/// </summary>
public sealed class TransverseMercatorExactTests(ITestOutputHelper output)
{
    [Fact]
    public void SeriesMatchesExactTransverseMercator_AsKarney2011States()
    {
        var tm = new TransverseMercator(Ellipsoid.Wgs84, 0, 0.9996, 0, 0);
        var byOffset = new SortedDictionary<double, double>();
        foreach (string[] r in ReferenceData.Load("tm-exact-geographiclib.tsv"))
        {
            double lat = ReferenceData.D(r[0]), lon = ReferenceData.D(r[1]);
            ProjectedCoordinate xy = tm.Forward(lat, lon);
            double error = double.Hypot(xy.EastingMetres - ReferenceData.D(r[2]), xy.NorthingMetres - ReferenceData.D(r[3]));
            double offset = Math.Abs(lon);
            byOffset[offset] = Math.Max(byOffset.GetValueOrDefault(offset), error);

            // Outside source: GeographicLib 2.1.2 exact TM (file precision 1e-9 m). Karney (2011,
            // doi:10.1007/s00190-011-0445-3) states ≤ 5 nm for the 6th-order series within 3900 km of the CM;
            // 1e-8 m allows for the file rounding. Beyond that the truncation error grows quickly (documented on the class).
            double tolerance = offset switch
            {
                <= 40 => 1e-8,
                <= 50 => 1e-6,
                <= 60 => 1e-4,
                _ => 1e-2,
            };
            Assert.True(error < tolerance, $"({lat}, {lon}): {error:E3} m vs exact TM");
        }

        foreach ((double offset, double error) in byOffset)
        {
            output.WriteLine($"|λ−λ0| = {offset,4}°: max series − exact = {error:E3} m");
        }
    }
}
