namespace StringModes.Video.Synthesis;

/// <summary>
/// Fast seeded Gaussian noise: SplitMix64 (Steele, Lea and Flood 2014) feeding the Box–Muller transform.
/// Each frame gets its own stream from (seed, frame index), so frames can be rendered in any order or in
/// parallel and still be identical run to run.
/// </summary>
internal struct NoiseSource
{
    private ulong _state;
    private double _spare;
    private bool _hasSpare;

    public NoiseSource(long seed, long stream)
    {
        _state = (ulong)seed * 0x9E3779B97F4A7C15UL ^ ((ulong)stream + 0x632BE59BD9B4E019UL) * 0xBF58476D1CE4E5B9UL;
        _spare = 0;
        _hasSpare = false;
        NextUInt64();
    }

    private ulong NextUInt64()
    {
        var z = _state += 0x9E3779B97F4A7C15UL;
        z = (z ^ (z >> 30)) * 0xBF58476D1CE4E5B9UL;
        z = (z ^ (z >> 27)) * 0x94D049BB133111EBUL;
        return z ^ (z >> 31);
    }

    /// <summary>Uniform in (0, 1).</summary>
    public double NextUniform() => ((NextUInt64() >> 11) + 0.5) * (1.0 / (1UL << 53));

    /// <summary>Raw 64 random bits.</summary>
    public ulong NextBits() => NextUInt64();

    /// <summary>Standard normal deviate.</summary>
    public double NextGaussian()
    {
        if (_hasSpare)
        {
            _hasSpare = false;
            return _spare;
        }
        var u = NextUniform();
        var v = NextUniform();
        var radius = Math.Sqrt(-2.0 * Math.Log(u));
        var (sin, cos) = Math.SinCos(2.0 * Math.PI * v);
        _spare = radius * sin;
        _hasSpare = true;
        return radius * cos;
    }
}

/// <summary>
/// A fixed table of 2^20 standard normal deviates (seeded once) drawn from at random indices: independent
/// Gaussian-distributed noise per pixel at a fraction of the cost of a Box–Muller call per pixel.
/// </summary>
internal static class GaussianTable
{
    public const int Bits = 20;
    public static readonly float[] Values = Build();

    private static float[] Build()
    {
        var source = new NoiseSource(20261201, 0);
        var values = new float[1 << Bits];
        for (var i = 0; i < values.Length; i++) values[i] = (float)source.NextGaussian();
        return values;
    }
}
