namespace QaService.Core.Statistics;

/// <summary>
/// SplitMix64 pseudo-random generator (Steele, Lea &amp; Flood 2014, "Fast splittable pseudorandom number generators",
/// OOPSLA, doi:10.1145/2714064.2660195): a fixed, documented sequence for a given seed on every platform and .NET
/// version, so a seeded bootstrap gives the same report bytes forever (System.Random promises no such thing).
/// </summary>
internal struct SplitMix64(ulong seed)
{
    private ulong _state = seed;

    /// <summary>Next 64-bit output; the arithmetic is modulo 2⁶⁴ by design (unchecked under the build's overflow checks).</summary>
    public ulong Next()
    {
        unchecked
        {
            ulong z = _state += 0x9E3779B97F4A7C15UL;
            z = (z ^ (z >> 30)) * 0xBF58476D1CE4E5B9UL;
            z = (z ^ (z >> 27)) * 0x94D049BB133111EBUL;
            return z ^ (z >> 31);
        }
    }

    /// <summary>Uniform integer in [0, count) by Lemire's multiply-shift (bias below count/2⁶⁴, negligible here): the high
    /// 64 bits of the 128-bit product, by <see cref="Math.BigMul(ulong, ulong, out ulong)"/> (one hardware multiply, same value
    /// as the UInt128 product shifted right by 64).</summary>
    public int NextIndex(int count) => (int)Math.BigMul(Next(), (ulong)count, out _);
}
