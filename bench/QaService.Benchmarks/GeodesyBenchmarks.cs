using BenchmarkDotNet.Attributes;
using QaService.Core.Geodesy;
using QaService.Core.Geodesy.Transformations;

namespace QaService.Benchmarks;

/// <summary>Projection forward/inverse (Krüger series, UTM 33N), geodetic → geocentric, ENU difference and a Helmert step, per 100,000 points.</summary>
[MemoryDiagnoser]
public class GeodesyBenchmarks
{
    private readonly TransverseMercator utm = Utm.Zone(33, southernHemisphere: false);
    private double[] lat = [], lon = [], h = [], e = [], n = [];
    private CoordinateBuffer geocentric = null!;
    private HelmertStep helmert = null!;

    [GlobalSetup]
    public void Setup()
    {
        (lat, lon, h) = Points.Geodetic();
        e = new double[Points.Count];
        n = new double[Points.Count];
        utm.Forward(lat, lon, e, n);
        geocentric = new CoordinateBuffer(Points.Count, withEpochs: true);
        for (var i = 0; i < Points.Count; i++)
        {
            var g = GeocentricConversion.ToGeocentric(new GeodeticCoordinate(lat[i], lon[i], h[i]), Ellipsoid.Wgs84);
            (geocentric.First[i], geocentric.Second[i], geocentric.Third[i], geocentric.EpochYears![i]) = (g.XMetres, g.YMetres, g.ZMetres, 2024.5);
        }
        helmert = new HelmertStep(HelmertTable.Transformations.First(t => t.Parameters.IsTimeDependent), reversed: false);
    }

    [Benchmark(OperationsPerInvoke = Points.Count)]
    public void TransverseMercatorForwardBatch() => utm.Forward(lat, lon, e, n);

    [Benchmark(OperationsPerInvoke = Points.Count)]
    public double TransverseMercatorInverse()
    {
        var sum = 0.0;
        for (var i = 0; i < Points.Count; i++)
            sum += utm.Inverse(e[i], n[i]).LatitudeDegrees;
        return sum;
    }

    [Benchmark(OperationsPerInvoke = Points.Count)]
    public double GeodeticToGeocentric()
    {
        var sum = 0.0;
        for (var i = 0; i < Points.Count; i++)
            sum += GeocentricConversion.ToGeocentric(new GeodeticCoordinate(lat[i], lon[i], h[i]), Ellipsoid.Wgs84).XMetres;
        return sum;
    }

    [Benchmark(OperationsPerInvoke = Points.Count)]
    public double EnuDifference()
    {
        var origin = new GeodeticCoordinate(lat[0], lon[0], h[0]);
        var originXyz = GeocentricConversion.ToGeocentric(origin, Ellipsoid.Wgs84);
        var sum = 0.0;
        for (var i = 0; i < Points.Count; i++)
            sum += LocalTangentPlane.Difference(originXyz, origin, new GeocentricCoordinate(geocentric.First[i], geocentric.Second[i], geocentric.Third[i])).EastMetres;
        return sum;
    }

    /// <summary>Time-dependent 14-parameter Helmert, in place (applied repeatedly: the cost does not depend on the values).</summary>
    [Benchmark(OperationsPerInvoke = Points.Count)]
    public void HelmertTimeDependent() => helmert.Apply(geocentric);
}
