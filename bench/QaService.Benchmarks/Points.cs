namespace QaService.Benchmarks;

/// <summary>Invented, seeded points in UTM zone 33 (12–18° E, 40–55° N) shared by the kernel benchmarks.</summary>
internal static class Points
{
    public const int Count = 100_000;

    public static (double[] Latitudes, double[] Longitudes, double[] Heights) Geodetic()
    {
        var random = new Random(42);
        var lat = new double[Count];
        var lon = new double[Count];
        var h = new double[Count];
        for (var i = 0; i < Count; i++)
        {
            lat[i] = 40 + 15 * random.NextDouble();
            lon[i] = 12 + 6 * random.NextDouble();
            h[i] = 1000 * random.NextDouble();
        }
        return (lat, lon, h);
    }
}
