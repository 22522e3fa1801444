using BenchmarkDotNet.Attributes;
using QaService.Core.Statistics;

namespace QaService.Benchmarks;

/// <summary>Horizontal figures of 100,000 residuals, the exact circular-error radius and the 95th-percentile bootstrap.</summary>
[MemoryDiagnoser]
public class StatisticsBenchmarks
{
    private double[] dE = [], dN = [], radial = [], small = [];

    [GlobalSetup]
    public void Setup()
    {
        var random = new Random(7);
        double Normal() => Math.Sqrt(-2 * Math.Log(1 - random.NextDouble())) * Math.Cos(2 * Math.PI * random.NextDouble());
        dE = Enumerable.Range(0, 100_000).Select(_ => 0.3 * Normal()).ToArray();
        dN = Enumerable.Range(0, 100_000).Select(_ => 0.2 * Normal()).ToArray();
        radial = dE.Zip(dN, double.Hypot).ToArray();
        small = radial[..24];
    }

    [Benchmark]
    public HorizontalAccuracy HorizontalFigures100k() => HorizontalAccuracy.Compute(dE, dN);

    [Benchmark]
    public double ExactRadius95() => CircularErrorRadius.Exact(0.95, 0.3, 0.2);

    [Benchmark]
    public (double, double) Bootstrap24Points() => BootstrapInterval.OfQuantile(small, 0.95, 0.95);

    /// <summary>The largest sample still resampled (2,000 × 10,000 draws).</summary>
    [Benchmark]
    public (double, double) Bootstrap10kPoints() => BootstrapInterval.OfQuantile(radial.AsSpan(0, BootstrapInterval.MonteCarloLimit), 0.95, 0.95);

    [Benchmark]
    public (double, double) Bootstrap100kPoints() => BootstrapInterval.OfQuantile(radial, 0.95, 0.95);
}
