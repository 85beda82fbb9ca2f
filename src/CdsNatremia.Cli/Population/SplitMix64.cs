namespace CdsNatremia.Cli.Population;

/// <summary>
/// A small seeded pseudo-random generator (SplitMix64, Steele, Lea and Flood, OOPSLA 2014) written out here so the
/// same seed gives the same population on every runtime and platform, independent of System.Random's implementation.
/// Not thread-safe; one instance per generation.
/// </summary>
internal sealed class SplitMix64(ulong seed)
{
    private ulong _state = seed;

    /// <summary>The next 64 random bits.</summary>
    public ulong Next()
    {
        var z = _state += 0x9E3779B97F4A7C15UL;
        z = (z ^ (z >> 30)) * 0xBF58476D1CE4E5B9UL;
        z = (z ^ (z >> 27)) * 0x94D049BB133111EBUL;
        return z ^ (z >> 31);
    }

    /// <summary>A double in [0, 1) from the top 53 bits.</summary>
    public double NextDouble() => (Next() >> 11) * (1.0 / (1UL << 53));

    /// <summary>An integer in [min, max] inclusive.</summary>
    public int Between(int min, int max) => min + (int)(NextDouble() * (max - min + 1));

    /// <summary>A double in [min, max).</summary>
    public double Between(double min, double max) => min + (NextDouble() * (max - min));

    /// <summary>True with probability <paramref name="p"/>.</summary>
    public bool Chance(double p) => NextDouble() < p;

    /// <summary>One item, chosen uniformly.</summary>
    public T Pick<T>(IReadOnlyList<T> items) => items[Between(0, items.Count - 1)];
}
