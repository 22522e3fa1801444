using QaService.Core.Statistics;

namespace QaService.Core.Tests.Statistics;

/// <summary>
/// Selection must return exactly what a full sort puts at each rank (the definition of the k-th order statistic,
/// Hoare 1961), so the type-7 percentile built on it (Hyndman &amp; Fan 1996, definition 7) is bit for bit the
/// sort-based one written out here: on random data, heavy ties, sorted and reversed input, and one value.
/// </summary>
public sealed class OrderStatisticTests
{
    public static TheoryData<string> Shapes => new() { "random", "ties", "sorted", "reversed", "constant" };

    private static double[] Values(string shape, int n)
    {
        var random = new Random(20261202);
        var values = shape switch
        {
            "random" => Enumerable.Range(0, n).Select(_ => random.NextDouble() * 2 - 1).ToArray(),
            // Rounded to 1 cm: many equal values, as in real residuals.
            "ties" => Enumerable.Range(0, n).Select(_ => Math.Round(random.NextDouble() * 0.2, 2)).ToArray(),
            "sorted" => Enumerable.Range(0, n).Select(i => i * 0.001).ToArray(),
            "reversed" => Enumerable.Range(0, n).Select(i => -i * 0.001).ToArray(),
            _ => Enumerable.Repeat(0.25, n).ToArray(),
        };
        return values;
    }

    /// <summary>Type-7 quantile from a full sort: x₍⌊h⌋+1₎ + (h − ⌊h⌋)(x₍⌊h⌋+2₎ − x₍⌊h⌋+1₎), h = (n − 1)p.</summary>
    private static double SortedType7(double[] values, double p)
    {
        var sorted = values.ToArray();
        Array.Sort(sorted);
        var h = (sorted.Length - 1) * p;
        var lower = (int)Math.Floor(h);
        return lower >= sorted.Length - 1 ? sorted[^1] : sorted[lower] + ((h - lower) * (sorted[lower + 1] - sorted[lower]));
    }

    [Theory]
    [MemberData(nameof(Shapes))]
    public void Select_gives_the_value_a_sort_puts_at_each_rank(string shape)
    {
        var values = Values(shape, 1_001);
        var sorted = values.ToArray();
        Array.Sort(sorted);
        foreach (var k in new[] { 0, 1, 250, 500, 999, 1_000 })
        {
            var scratch = values.ToArray();
            Assert.Equal(sorted[k], OrderStatistic.Select(scratch, k));
            Assert.All(scratch[..k], v => Assert.True(v <= sorted[k]));
            Assert.All(scratch[(k + 1)..], v => Assert.True(v >= sorted[k]));
        }
    }

    [Theory]
    [MemberData(nameof(Shapes))]
    public void Percentile_by_selection_equals_percentile_by_sort(string shape)
    {
        foreach (var n in new[] { 1, 2, 7, 10_000 })
        {
            var values = Values(shape, n);
            foreach (var p in new[] { 0.0, 0.05, 0.5, 0.5 + 1e-9, 0.9, 0.95, 1.0 })
                Assert.Equal(SortedType7(values, p), Percentile.LinearInterpolation(values, p));
        }
    }

    [Theory]
    [MemberData(nameof(Shapes))]
    public void Ascending_ranks_give_the_values_a_sort_puts_there(string shape)
    {
        foreach (var n in new[] { 1, 2, 3, 7, 20, 10_000 })
        {
            var values = Values(shape, n);
            var probabilities = new[] { 0.0, 0.05, 0.5, 0.5 + 1e-9, 0.9, 0.95, 0.975, 1.0 };
            var ranks = new OrderStatistic.AscendingRanks(values.ToArray());
            // Each quantile's two ranks, quantiles ascending: a quantile's lower rank may repeat one already read.
            foreach (var p in probabilities)
                Assert.Equal(SortedType7(values, p), Percentile.LinearInterpolation(ref ranks, n, p));
        }
    }

    [Fact]
    public void Ascending_ranks_refuse_a_rank_no_longer_in_place()
    {
        var ranks = new OrderStatistic.AscendingRanks(Values("random", 100));
        ranks.At(10);
        ranks.At(11);
        ranks.At(50);
        var threw = false;
        try
        {
            ranks.At(10);
        }
        catch (InvalidOperationException)
        {
            threw = true;
        }
        Assert.True(threw);
    }
}
