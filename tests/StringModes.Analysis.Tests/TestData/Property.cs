using CsCheck;

namespace StringModes.Analysis.Tests.TestData;

/// <summary>
/// Property checks with CsCheck generators drawn from fixed PCG seeds, so a run is the same on every machine and
/// every time (CsCheck's own sampler draws fresh random seeds each run). A failure names the iteration and its
/// CsCheck seed; the value is reproduced by rerunning the test.
/// </summary>
internal static class Property
{
    public static void ForAll<T>(Gen<T> gen, int iterations, ulong seed, Action<T> assert)
    {
        for (var i = 0; i < iterations; i++)
        {
            var pcg = new PCG(1, seed + (ulong)i);
            var seedText = pcg.ToString();
            var value = gen.Generate(pcg, null, out _);
            try
            {
                assert(value);
            }
            catch (Exception e)
            {
                throw new Xunit.Sdk.XunitException($"property failed at iteration {i} (CsCheck seed {seedText}) for {Describe(value)}:\n{e.Message}");
            }
        }
    }

    private static string Describe<T>(T value) => value switch
    {
        System.Collections.IEnumerable items and not string => "[" + string.Join(", ", items.Cast<object>()) + "]",
        _ => value?.ToString() ?? "null",
    };
}
