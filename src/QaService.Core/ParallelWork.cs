using System.Runtime.ExceptionServices;

namespace QaService.Core;

/// <summary>
/// Independent work spread over the thread pool so that the result cannot depend on the scheduling: every output slot
/// is written by exactly one worker, and nothing is summed across workers. A failure is rethrown as the sequential
/// code would have thrown it: unwrapped, and the earliest one (lowest index, or first action) when several fail.
/// Small work runs inline, where handing it to other threads would cost more than it saves.
/// </summary>
internal static class ParallelWork
{
    /// <summary>Fewest items worth a range of their own (a few hundred microseconds of per-item arithmetic).</summary>
    public const int MinimumRange = 32_768;

    /// <summary>Ranges per processor, so that a worker slowed by other load does not hold up the rest.</summary>
    private const int RangesPerProcessor = 4;

    /// <summary>Calls <paramref name="body"/>(start, end) over consecutive ranges covering [0, count).</summary>
    public static void ForRanges(int count, Action<int, int> body)
    {
        var ranges = Math.Min(Environment.ProcessorCount * RangesPerProcessor, count / MinimumRange);
        if (ranges < 2)
        {
            body(0, count);
            return;
        }
        var failures = new Exception?[ranges];
        Parallel.For(0, ranges, r =>
        {
            try
            {
                body((int)((long)count * r / ranges), (int)((long)count * (r + 1) / ranges));
            }
            catch (Exception e)
            {
                failures[r] = e;
            }
        });
        RethrowFirst(failures);
    }

    /// <summary>Runs the actions side by side when <paramref name="worthIt"/>, else one after the other.</summary>
    public static void Invoke(bool worthIt, params Action[] actions)
    {
        if (!worthIt)
        {
            foreach (var action in actions)
                action();
            return;
        }
        var failures = new Exception?[actions.Length];
        Parallel.For(0, actions.Length, i =>
        {
            try
            {
                actions[i]();
            }
            catch (Exception e)
            {
                failures[i] = e;
            }
        });
        RethrowFirst(failures);
    }

    private static void RethrowFirst(Exception?[] failures)
    {
        foreach (var failure in failures)
        {
            if (failure is not null)
                ExceptionDispatchInfo.Capture(failure).Throw();
        }
    }
}
