namespace StringModes.Analysis.Uncertainty;

/// <summary>Summary of a Monte Carlo propagation.</summary>
/// <param name="Mean">Mean of the output draws.</param>
/// <param name="StandardDeviation">Standard deviation of the output draws: the standard uncertainty (JCGM 101 §7.6).</param>
/// <param name="Low95">2.5th percentile of the output draws.</param>
/// <param name="High95">97.5th percentile: [Low95, High95] is the probabilistically symmetric 95 % coverage interval (JCGM 101 §7.7).</param>
/// <param name="Draws">Number of draws whose output was finite.</param>
public sealed record MonteCarloSummary(double Mean, double StandardDeviation, double Low95, double High95, int Draws);

/// <summary>
/// Propagation of distributions by Monte Carlo (JCGM 101:2008, GUM Supplement 1): every input is drawn from a
/// Gaussian with its value and standard uncertainty, the model is evaluated per draw, and the output draws are
/// summarised. Seeded, so a given seed always returns the same summary.
/// </summary>
public static class MonteCarloPropagation
{
    /// <summary>Propagates independent Gaussian inputs through <paramref name="model"/>.</summary>
    /// <param name="model">Output as a function of one draw of the inputs (in the order of <paramref name="inputs"/>).</param>
    /// <param name="inputs">Input estimates and standard uncertainties.</param>
    /// <param name="draws">Number of draws, ≥ 2 (JCGM 101 §7.2 suggests 10⁶ for a 95 % interval to two digits).</param>
    /// <param name="seed">Seed of the pseudo-random generator.</param>
    public static MonteCarloSummary Propagate(Func<double[], double> model, IReadOnlyList<Measured> inputs, int draws, int seed)
    {
        ArgumentOutOfRangeException.ThrowIfLessThan(draws, 2);
        var random = new Random(seed);
        var x = new double[inputs.Count];
        var outputs = new List<double>(draws);
        for (var d = 0; d < draws; d++)
        {
            for (var i = 0; i < x.Length; i++) x[i] = inputs[i].Value + inputs[i].StandardUncertainty * StandardNormal(random);
            var y = model(x);
            if (double.IsFinite(y)) outputs.Add(y);
        }
        if (outputs.Count < 2) return new MonteCarloSummary(0, 0, 0, 0, outputs.Count);
        outputs.Sort();
        var mean = outputs.Average();
        var ss = outputs.Sum(v => (v - mean) * (v - mean));
        return new MonteCarloSummary(mean, Math.Sqrt(ss / (outputs.Count - 1)),
            Percentile(outputs, 0.025), Percentile(outputs, 0.975), outputs.Count);
    }

    /// <summary>Standard normal deviate by the Box–Muller transform (Box &amp; Muller 1958, Ann. Math. Stat. 29:610).</summary>
    internal static double StandardNormal(Random random)
    {
        var u1 = 1.0 - random.NextDouble();
        var u2 = random.NextDouble();
        return Math.Sqrt(-2.0 * Math.Log(u1)) * Math.Cos(2.0 * Math.PI * u2);
    }

    private static double Percentile(List<double> sorted, double p)
    {
        var h = (sorted.Count - 1) * p;
        var lo = (int)Math.Floor(h);
        var hi = Math.Min(lo + 1, sorted.Count - 1);
        return sorted[lo] + (h - lo) * (sorted[hi] - sorted[lo]);
    }
}
