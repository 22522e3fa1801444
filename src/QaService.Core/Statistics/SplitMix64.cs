namespace QaService.Core.Statistics;

/// <summary>
/// SplitMix64 pseudo-random generator (Steele, Lea &amp; Flood 2014, "Fast splittable pseudorandom number generators",
/// OOPSLA, doi:10.1145/2714064.2660195): a fixed, documented sequence for a given seed on every platform and .NET
/// version, so a seeded bootstrap gives the same report bytes forever (System.Random promises no such thing).
/// </summary>
internal struct SplitMix64(ulong seed)
{
    /// <summary>The generator's increment γ, the golden-ratio constant of Steele, Lea &amp; Flood 2014 (Fig. 2).</summary>
    private const ulong Gamma = 0x9E3779B97F4A7C15UL;

    private ulong _state = seed;

    /// <summary>
    /// The generator seeded with <paramref name="seed"/> after <paramref name="outputsDrawn"/> calls of <see cref="Next"/>
    /// (or <see cref="NextIndex"/>, which takes exactly one): the state is a Weyl sequence, seed + k·γ mod 2⁶⁴ (Steele, Lea
    /// &amp; Flood 2014, §3), so the jump is one multiply and gives exactly the outputs the skipped calls would have led to.
    /// </summary>
    public static SplitMix64 After(ulong seed, ulong outputsDrawn) => new(unchecked(seed + (outputsDrawn * Gamma)));

    /// <summary>Next 64-bit output; the arithmetic is modulo 2⁶⁴ by design (unchecked under the build's overflow checks).</summary>
    public ulong Next()
    {
        unchecked
        {
            ulong z = _state += Gamma;
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
