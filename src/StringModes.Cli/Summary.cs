using System.Globalization;
using StringModes.Analysis;
using StringModes.Analysis.Uncertainty;

namespace StringModes.Cli;

/// <summary>The human summary table printed after an analysis.</summary>
internal static class Summary
{
    public static void Write(TextWriter o, ModalAnalysisResult r, string outDir)
    {
        var ic = CultureInfo.InvariantCulture;
        o.WriteLine(" n   frequency (Hz)          decay rate (1/s)     damping ratio          f_n/(n f_1)");
        var ratios = r.String?.HarmonicRatios.ToDictionary(h => h.N, h => h.Ratio) ?? [];
        foreach (var m in r.Fits.Modes.Where(m => m.IsUsable).OrderBy(m => m.N))
        {
            var ratio = ratios.TryGetValue(m.N, out var h) ? F(h) : "-";
            o.WriteLine(string.Create(ic, $"{m.N,2}   {F(m.FrequencyHz),-22}  {F(m.DecayRatePerS),-19}  {F(m.DampingRatio),-21}  {ratio}"));
        }
        if (r.String is { } s)
        {
            o.WriteLine();
            o.WriteLine($"ideal fundamental f0   {F(s.FundamentalHz)} Hz");
            o.WriteLine($"inharmonicity B        {(s.InharmonicityAssumed ? "assumed 0 (fewer than 3 modes)" : F(s.Inharmonicity))}");
            if (s.WaveSpeedMPerS is { } c) o.WriteLine($"wave speed c           {F(c)} m/s");
            if (s.TensionN is { } t) o.WriteLine($"tension T              {F(t)} N");
            else o.WriteLine("tension T              not computed (give --linear-density)");
            if (s.SecondHarmonic is { } check)
                o.WriteLine(string.Create(ic, $"f2 = 2 f1 ?           {(check.Passes ? "yes" : "NO")}: {F(check.Ratio)}, {check.DeviationInUncertainties:F1} standard uncertainties from 2 (tolerance k = {check.CoverageFactor:G3})"));
        }
        o.WriteLine();
        o.WriteLine($"results: {Path.Combine(outDir, "results.json")}");
    }

    /// <summary>Value ± standard uncertainty with the uncertainty to two significant digits (JCGM 100:2008 §7.2.6).</summary>
    public static string F(Measured m)
    {
        var ic = CultureInfo.InvariantCulture;
        if (!(m.StandardUncertainty > 0) || !double.IsFinite(m.StandardUncertainty)) return m.Value.ToString("G6", ic);
        var exponent = (int)Math.Floor(Math.Log10(m.StandardUncertainty)) - 1;
        var decimals = Math.Max(0, -exponent);
        if (decimals > 12) return string.Create(ic, $"{m.Value:G6} ± {m.StandardUncertainty:G2}");
        var scale = Math.Pow(10, exponent);
        var v = Math.Round(m.Value / scale) * scale;
        var u = Math.Round(m.StandardUncertainty / scale) * scale;
        return v.ToString("F" + decimals, ic) + " ± " + u.ToString("F" + decimals, ic);
    }
}
