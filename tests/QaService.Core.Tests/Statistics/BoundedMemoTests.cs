using MathNet.Numerics.Distributions;
using QaService.Core.Statistics;

namespace QaService.Core.Tests.Statistics;

/// <summary>The per-count quantile memo: the function's own bits, computed once per key, and no growth past its bound.</summary>
public sealed class BoundedMemoTests
{
    [Fact]
    public void Gives_the_functions_own_value_and_computes_each_kept_key_once()
    {
        int calls = 0;
        var memo = new BoundedMemo<int, double>(freedom => { calls++; return StudentT.InvCDF(0, 1, freedom, 0.975); }, mostEntries: 3);
        foreach (int freedom in new[] { 23, 23, 5, 23, 5, 1 })
            Assert.Equal(StudentT.InvCDF(0, 1, freedom, 0.975), memo[freedom]);
        Assert.Equal(3, calls);
        // Past the bound: still right, computed each time.
        Assert.Equal(StudentT.InvCDF(0, 1, 40, 0.975), memo[40]);
        Assert.Equal(StudentT.InvCDF(0, 1, 40, 0.975), memo[40]);
        Assert.Equal(5, calls);
    }
}
