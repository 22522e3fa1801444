using System.Runtime;

namespace QaService.Api.Assessments;

/// <summary>
/// Between the stages of a large assessment (read and validate, assess, serialise) the previous stage's data and
/// working arrays are garbage, but two things keep them: continuations of completed async methods run inline, so
/// the finished stage's frames (and their locals) stay on the stack under the next one; and the large arrays are
/// only reclaimed by a full collection, which the collector defers while the heap grows. Yielding unwinds those
/// frames, and one compacting full collection then returns the memory before the next stage allocates: the
/// 1,000,000-fix upload (bench/upload-million.sh) held its parsed columns and validated points through the
/// assessment and peaked at 537 MiB, with this 465–477 MiB (DEVELOPERS.md "Performance").
/// </summary>
internal static class LargeRequestMemory
{
    /// <summary>
    /// Fewest fixes for which this is worth its cost (a thread-pool hop and tens of milliseconds of collection on a
    /// heap of a few hundred MB); an ordinary request stays far below and never pays it. Common practice: only
    /// batch-sized work collects explicitly.
    /// </summary>
    public const int MinimumFixes = 100_000;

    /// <summary>
    /// Managed heap (live and not yet collected) below which an upload under <see cref="AlwaysFromFixes"/> skips the
    /// collection. There it cost about 15 % of a 400,000-fix upload (1.08–1.21 s against 0.90–1.00 s, bench/run-all.sh
    /// part b shape, alternated) and freed only 14–20 MiB, the heap holding 77–105 MiB at these points; a 1,000,000-fix
    /// upload holds 153–247 MiB and frees 36–48 MiB (probe build, 2026-12-05).
    /// </summary>
    public const long CollectAboveHeapBytes = 128L << 20;

    /// <summary>From this many fixes the collection always runs, whatever the heap holds (the 1,000,000-fix peak target).</summary>
    public const int AlwaysFromFixes = 500_000;

    public static async ValueTask ReleaseAsync(int fixes)
    {
        if (fixes < MinimumFixes || (fixes < AlwaysFromFixes && GC.GetTotalMemory(forceFullCollection: false) < CollectAboveHeapBytes))
            return;
        await Task.Yield();
        GCSettings.LargeObjectHeapCompactionMode = GCLargeObjectHeapCompactionMode.CompactOnce;
        GC.Collect(GC.MaxGeneration, GCCollectionMode.Forced, blocking: true, compacting: true);
    }
}
