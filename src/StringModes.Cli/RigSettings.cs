using StringModes.Analysis.StringModel;
using StringModes.Analysis.Uncertainty;
using StringModes.Analysis.Units;
using StringModes.Video.Files;

namespace StringModes.Cli;

/// <summary>Rig values from the rig file merged with command-line options (options win).</summary>
internal sealed record RigSettings(Rig Rig, Measured? Length, LinearDensityInput? LinearDensity, double? CaptureFps, double ReadoutS, List<string> Notes)
{
    /// <summary>The rig file given with --rig, if any (for messages).</summary>
    public string? RigPath { get; init; }

    public static RigSettings From(ArgumentReader a, bool lengthRequired)
    {
        Rig rig;
        try { rig = a.Value("rig") is { } path ? Rig.Load(path) : new Rig(); }
        catch (InputFileException e) { throw new CliException(ExitCodes.BadInput, e.Message); }
        var notes = new List<string>();
        double? Q(string option, Dimension d, bool allowZero, double max, string example)
        {
            var text = a.Value(option);
            if (text is null) return null;
            if (!Quantity.TryParse(text, d, out var v, out var error)) throw a.Usage($"--{option}: {error}; e.g. --{option} {example}");
            if (!double.IsFinite(v) || v < 0 || (!allowZero && v == 0))
                throw a.Usage($"--{option} must be {(allowZero ? "zero or positive" : "positive")}, got '{text}'; e.g. --{option} {example}");
            if (v > max)
                throw a.Usage(FormattableString.Invariant($"--{option} must be at most {max:G} {Quantity.SiUnit(d)}, got '{text}'; check the value and its unit, e.g. --{option} {example}"));
            return v;
        }
        var length = Q("length", Dimension.Length, false, Limits.LengthM, "65cm") ?? rig.LengthM;
        var lengthU = Q("length-uncertainty", Dimension.Length, true, Limits.LengthM, "0.5mm") ?? rig.LengthUncertaintyM;
        if (length is null && lengthRequired)
            throw a.Usage("--length is required; give the vibrating length between the ends, e.g. --length 65cm, or 'length' in the rig file");
        Measured? lengthMeasured = length is { } l ? new Measured(l, lengthU ?? 0) : null;
        if (length is not null && lengthU is null)
            notes.Add("no uncertainty was given for the length; u(L) = 0 was used, so the tension uncertainty leaves it out (give --length-uncertainty)");

        var mu = Q("linear-density", Dimension.LinearDensity, false, Limits.LinearDensityKgPerM, "0.99g/m") ?? rig.LinearDensityKgPerM;
        var muU = Q("linear-density-uncertainty", Dimension.LinearDensity, true, Limits.LinearDensityKgPerM, "0.005g/m") ?? rig.LinearDensityUncertaintyKgPerM;
        LinearDensityInput? density = null;
        if (mu is { } m)
        {
            density = LinearDensityInput.Direct(new Measured(m, muU ?? 0));
            if (muU is null) notes.Add("no uncertainty was given for the linear density; u(μ) = 0 was used (give --linear-density-uncertainty)");
        }
        else if (rig.SampleMassKg is { } mass && rig.SampleLengthM is { } sampleLength)
            density = LinearDensityInput.FromSample(new Measured(mass, rig.SampleMassUncertaintyKg ?? 0), new Measured(sampleLength, rig.SampleLengthUncertaintyM ?? 0));
        else if (rig.MaterialDensityKgPerM3 is { } rho && rig.DiameterM is { } d)
            density = LinearDensityInput.FromDensityAndDiameter(new Measured(rho, rig.MaterialDensityUncertaintyKgPerM3 ?? 0), new Measured(d, rig.DiameterUncertaintyM ?? 0));
        if (density is not null && rig.UnstretchedLengthM is { } l0)
            density = density with { UnstretchedLengthM = new Measured(l0, rig.UnstretchedLengthUncertaintyM ?? 0) };

        var readoutMs = a.Number("readout-ms", 0, Limits.ReadoutS * 1000);
        var capture = a.Number("capture-fps", 0.001, Limits.CaptureFps) ?? rig.CaptureFps;
        return new RigSettings(rig, lengthMeasured, density, capture, readoutMs is { } r ? r / 1000 : rig.ReadoutS ?? 0, notes) { RigPath = a.Value("rig") };
    }
}
