namespace QaService.Core.Tests;

/// <summary>
/// Work spread over threads must behave as the sequential loop it replaces (the determinism the assessment relies on):
/// every index visited exactly once, and a failure surfacing as the loop's own first exception, not wrapped.
/// </summary>
public sealed class ParallelWorkTests
{
    [Theory]
    [InlineData(0)]
    [InlineData(1)]
    [InlineData(ParallelWork.MinimumRange * 2 - 1)]
    [InlineData(ParallelWork.MinimumRange * 7 + 3)]
    public void Ranges_cover_every_index_once(int count)
    {
        var visits = new int[count];
        ParallelWork.ForRanges(count, (start, end) =>
        {
            for (var i = start; i < end; i++)
                Interlocked.Increment(ref visits[i]);
        });
        Assert.All(visits, v => Assert.Equal(1, v));
    }

    [Fact]
    public void The_earliest_failure_is_rethrown_unwrapped()
    {
        var count = ParallelWork.MinimumRange * 8;
        var error = Assert.Throws<ArgumentOutOfRangeException>(() => ParallelWork.ForRanges(count, (start, end) =>
        {
            for (var i = start; i < end; i++)
            {
                if (i % ParallelWork.MinimumRange == 5)
                    throw new ArgumentOutOfRangeException(nameof(count), i, "fails");
            }
        }));
        Assert.Equal(5, error.ActualValue);

        var first = Assert.Throws<InvalidOperationException>(() => ParallelWork.Invoke(true,
            () => { },
            () => throw new InvalidOperationException("second"),
            () => throw new FormatException("third")));
        Assert.Equal("second", first.Message);
    }
}
