using QaService.Core.Geodesy.Catalog;

namespace QaService.Core.Tests.Geodesy.Catalog;

/// <summary>
/// Distance outside an EPSG extent box. The figures follow from the definition (degrees of latitude, and degrees of
/// longitude scaled by cos φ, the larger of the two); the sweep checks the shortcut for points inside in longitude
/// against the full expression, bit for bit, including NaN, infinities and boxes across the antimeridian.
/// </summary>
public sealed class AreaOfUseTests
{
    private static readonly AreaOfUse Europe = new("box", 34.0, 72.0, -10.0, 32.0);
    private static readonly AreaOfUse Pacific = new("across the antimeridian", -50.0, -30.0, 160.0, -170.0);

    [Fact]
    public void Inside_is_zero_and_outside_is_degrees_of_arc()
    {
        Assert.Equal(0.0, Europe.DegreesOutside(50.0, 15.0));
        Assert.Equal(3.0, Europe.DegreesOutside(75.0, 15.0), 12);
        Assert.Equal(8.0 * Math.Cos(60.0 * Math.PI / 180.0), Europe.DegreesOutside(60.0, 40.0), 12);
        Assert.Equal(0.0, Pacific.DegreesOutside(-40.0, 175.0));
        Assert.Equal(0.0, Pacific.DegreesOutside(-40.0, -175.0 + 720.0));
        Assert.Equal(5.0 * Math.Cos(40.0 * Math.PI / 180.0), Pacific.DegreesOutside(-40.0, 155.0), 12);
    }

    [Fact]
    public void Shortcut_inside_in_longitude_equals_the_full_expression()
    {
        var random = new Random(5);
        double[] special = [double.NaN, double.PositiveInfinity, double.NegativeInfinity, 180.0, -180.0, 540.0, 0.0];
        foreach (var box in new[] { Europe, Pacific, new AreaOfUse("world", -90, 90, -180, 180) })
        {
            for (int i = 0; i < 20_000; i++)
            {
                double lat = i % 50 == 0 ? special[random.Next(special.Length)] : (random.NextDouble() * 200.0) - 100.0;
                double lon = i % 37 == 0 ? special[random.Next(special.Length)] : (random.NextDouble() * 1000.0) - 500.0;
                Assert.Equal(FullExpression(box, lat, lon), box.DegreesOutside(lat, lon));
            }
        }
    }

    /// <summary>The expression without the shortcut (each term as in AreaOfUse, remainders by Math.IEEERemainder).</summary>
    private static double FullExpression(AreaOfUse box, double lat, double lon)
    {
        double dLat = lat < box.SouthDegrees ? box.SouthDegrees - lat : lat > box.NorthDegrees ? lat - box.NorthDegrees : 0;
        double reduced = Math.IEEERemainder(lon, 360.0);
        double width = Math.IEEERemainder(box.EastDegrees - box.WestDegrees, 360.0);
        if (width <= 0)
            width += 360.0;
        double fromWest = reduced - box.WestDegrees;
        fromWest -= 360.0 * Math.Floor(fromWest / 360.0);
        double dLon = fromWest <= width ? 0 : Math.Min(fromWest - width, 360.0 - fromWest);
        double cosLat = Math.Cos(Math.Clamp(lat, -90.0, 90.0) * (Math.PI / 180.0));
        return Math.Max(dLat, dLon * cosLat);
    }
}
