using System.Text.Json;
using StringModes.Analysis.Units;
using StringModes.Video.Files;
using StringModes.Video.Synthesis;

namespace StringModes.Cli;

/// <summary>
/// What a rig file (JSON; docs/rig-file.md) says about the set-up. Quantities are SI numbers or text with a unit.
/// Command-line options override it.
/// </summary>
internal sealed record Rig
{
    public string Description { get; init; } = "";
    public double? LengthM { get; init; }
    public double? LengthUncertaintyM { get; init; }
    public double? LinearDensityKgPerM { get; init; }
    public double? LinearDensityUncertaintyKgPerM { get; init; }
    public double? SampleMassKg { get; init; }
    public double? SampleMassUncertaintyKg { get; init; }
    public double? SampleLengthM { get; init; }
    public double? SampleLengthUncertaintyM { get; init; }
    public double? MaterialDensityKgPerM3 { get; init; }
    public double? MaterialDensityUncertaintyKgPerM3 { get; init; }
    public double? DiameterM { get; init; }
    public double? DiameterUncertaintyM { get; init; }
    public double? UnstretchedLengthM { get; init; }
    public double? UnstretchedLengthUncertaintyM { get; init; }
    public double? CaptureFps { get; init; }
    public double? ReadoutS { get; init; }
    public IReadOnlyList<PixelPoint>? MarksPx { get; init; }
    public StringModes.Analysis.Geometry.Homography? Plane { get; init; }

    public static Rig Load(string path)
        => Parse(InputFiles.ReadText(path, "a rig file", "give a rig file (JSON, at least { }; see docs/rig-file.md)"), path);

    /// <summary>Parses and validates rig-file text; <paramref name="path"/> names the file in messages.</summary>
    public static Rig Parse(string text, string path)
    {
        JsonDocument doc;
        try { doc = JsonDocument.Parse(text, new JsonDocumentOptions { AllowTrailingCommas = true, CommentHandling = JsonCommentHandling.Skip }); }
        catch (JsonException e) { throw new InputFileException($"{path}: not valid JSON (line {e.LineNumber + 1}); fix the syntax near there"); }
        using (doc)
        {
            var f = new JsonFields(path, "", doc.RootElement);
            const string lengthFix = "give a length such as \"80 cm\" or 0.8 (metres)";
            var rig = new Rig
            {
                Description = f.OptionalString("description") ?? "",
                LengthM = f.OptionalQuantity("length", Dimension.Length, 0, true, lengthFix, Limits.LengthM),
                LengthUncertaintyM = f.OptionalQuantity("length_uncertainty", Dimension.Length, 0, false, lengthFix, Limits.LengthM),
                LinearDensityKgPerM = f.OptionalQuantity("linear_density", Dimension.LinearDensity, 0, true, "give a linear density such as \"0.987 g/m\" or 0.000987 (kg/m)", Limits.LinearDensityKgPerM),
                LinearDensityUncertaintyKgPerM = f.OptionalQuantity("linear_density_uncertainty", Dimension.LinearDensity, 0, false, "give a linear density such as \"0.005 g/m\"", Limits.LinearDensityKgPerM),
                SampleMassKg = f.OptionalQuantity("sample_mass", Dimension.Mass, 0, true, "give a mass such as \"1.234 g\"", Limits.MassKg),
                SampleMassUncertaintyKg = f.OptionalQuantity("sample_mass_uncertainty", Dimension.Mass, 0, false, "give a mass such as \"1 mg\"", Limits.MassKg),
                SampleLengthM = f.OptionalQuantity("sample_length", Dimension.Length, 0, true, lengthFix, Limits.LengthM),
                SampleLengthUncertaintyM = f.OptionalQuantity("sample_length_uncertainty", Dimension.Length, 0, false, lengthFix, Limits.LengthM),
                MaterialDensityKgPerM3 = f.OptionalQuantity("material_density", Dimension.Density, 0, true, "give a density such as \"1.14 g/cm3\"", Limits.DensityKgPerM3),
                MaterialDensityUncertaintyKgPerM3 = f.OptionalQuantity("material_density_uncertainty", Dimension.Density, 0, false, "give a density such as \"0.01 g/cm3\"", Limits.DensityKgPerM3),
                DiameterM = f.OptionalQuantity("diameter", Dimension.Length, 0, true, "give a diameter such as \"0.8 mm\"", Limits.DiameterM),
                DiameterUncertaintyM = f.OptionalQuantity("diameter_uncertainty", Dimension.Length, 0, false, "give a diameter such as \"0.01 mm\"", Limits.DiameterM),
                UnstretchedLengthM = f.OptionalQuantity("unstretched_length", Dimension.Length, 0, true, lengthFix, Limits.LengthM),
                UnstretchedLengthUncertaintyM = f.OptionalQuantity("unstretched_length_uncertainty", Dimension.Length, 0, false, lengthFix, Limits.LengthM),
                CaptureFps = f.OptionalQuantity("capture_fps", Dimension.Frequency, 0, true, "give the true capture rate in frames per second, e.g. 240", Limits.CaptureFps),
                ReadoutS = f.OptionalQuantity("readout", Dimension.Time, 0, false, "give the rolling-shutter readout time such as \"20 ms\"", Limits.ReadoutS),
                MarksPx = f.OptionalPoints("marks_px", "list the marks as [[x, y], ...] in pixels, ends first and last", 0, Limits.PixelCoordinate),
            };
            var planeImage = f.OptionalPoints("plane_image_px", "list four points of the rig plane as [[x, y], ...] in pixels", 0, Limits.PixelCoordinate);
            var planeMetres = f.OptionalPoints("plane_m", "list the same four points' positions on the rig plane as [[x, y], ...] in metres", -Limits.LengthM, Limits.LengthM);
            f.RefuseUnknown();
            rig = rig with { Plane = PlaneFrom(path, planeImage, planeMetres) };
            if (rig.MarksPx is { Count: < 5 })
                throw new InputFileException($"{path}: marks_px lists {rig.MarksPx.Count} points; give the two ends and at least 3 moving marks, in order along the string");
            // Half of a pair is not enough to give the linear density; silently ignoring it would lose the tension.
            Pair(path, rig.SampleMassKg, "sample_mass", rig.SampleLengthM, "sample_length", "μ = sample mass / sample length");
            Pair(path, rig.MaterialDensityKgPerM3, "material_density", rig.DiameterM, "diameter", "μ = ρπd²/4");
            return rig;
        }
    }

    private static StringModes.Analysis.Geometry.Homography? PlaneFrom(string path, IReadOnlyList<PixelPoint>? image, IReadOnlyList<PixelPoint>? metres)
    {
        if (image is null && metres is null) return null;
        if (image is null || metres is null)
            throw new InputFileException($"{path}: {(image is null ? "plane_m" : "plane_image_px")} is given without {(image is null ? "plane_image_px" : "plane_m")}; give both (four points in pixels and the same points in metres on the rig plane) or neither");
        if (image.Count != 4 || metres.Count != 4)
            throw new InputFileException($"{path}: plane_image_px and plane_m must list exactly four points each (got {image.Count} and {metres.Count}); give the four corners of a known rectangle on the rig plane");
        try
        {
            return StringModes.Analysis.Geometry.Homography.FromPoints(image.Select(p => (p.X, p.Y)).ToList(), metres.Select(p => (p.X, p.Y)).ToList());
        }
        catch (ArgumentException)
        {
            throw new InputFileException($"{path}: the four plane points are degenerate (three lie on one line, or two coincide); choose four corners of a rectangle on the rig plane");
        }
    }

    private static void Pair(string path, double? a, string aName, double? b, string bName, string law)
    {
        if (a is not null && b is null)
            throw new InputFileException($"{path}: {aName} is given without {bName}; give both ({law}) or remove {aName}");
        if (b is not null && a is null)
            throw new InputFileException($"{path}: {bName} is given without {aName}; give both ({law}) or remove {bName}");
    }
}

/// <summary>
/// Largest values accepted from a rig file or the command line, in SI units: far beyond any string a camera can film
/// (a kilometre-long cable, a metre-thick rope, a megahertz camera), so only mistakes and overflows are refused.
/// </summary>
internal static class Limits
{
    public const double LengthM = 1000;
    public const double DiameterM = 1;
    public const double LinearDensityKgPerM = 1000;
    public const double MassKg = 1000;
    public const double DensityKgPerM3 = 100_000;
    public const double CaptureFps = 1e6;
    public const double ReadoutS = 1;
    public const double PixelCoordinate = 100_000;
}
