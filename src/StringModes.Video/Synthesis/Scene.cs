using StringModes.Analysis.Physics;

namespace StringModes.Video.Synthesis;

/// <summary>An RGB colour with components in digital numbers, 0–255.</summary>
public readonly record struct Rgb(double R, double G, double B);

/// <summary>A point in image pixels; origin at the centre of the top-left pixel, x right, y down.</summary>
public readonly record struct PixelPoint(double X, double Y);

/// <summary>
/// Everything needed to render a synthetic clip of a vibrating string: the string model, how it sits in the
/// image, its marks, the background and the camera. Built from a scene file by <see cref="SceneFile"/>.
/// </summary>
public sealed record Scene
{
    /// <summary>Free text describing the invented scenario.</summary>
    public string Description { get; init; } = "";

    /// <summary>The string's displacement field (the ground truth).</summary>
    public required StringMotion Motion { get; init; }

    /// <summary>Linear density in kg/m, when the scene states it (for the truth file); else NaN.</summary>
    public double LinearDensityKgPerM { get; init; } = double.NaN;

    /// <summary>Tension in N, when the scene states or implies it; else NaN.</summary>
    public double TensionN { get; init; } = double.NaN;

    /// <summary>Ideal-string fundamental f0 in Hz.</summary>
    public required double FundamentalHz { get; init; }

    /// <summary>Inharmonicity coefficient B (dimensionless, ≥ 0).</summary>
    public double Inharmonicity { get; init; }

    /// <summary>Image width in pixels.</summary>
    public required int WidthPx { get; init; }

    /// <summary>Image height in pixels.</summary>
    public required int HeightPx { get; init; }

    /// <summary>Pixel position of end 0 (s = 0).</summary>
    public required PixelPoint End0 { get; init; }

    /// <summary>Pixel position of end 1 (s = L).</summary>
    public required PixelPoint End1 { get; init; }

    /// <summary>Drawn string width in pixels; default 2.</summary>
    public double StringWidthPx { get; init; } = 2;

    /// <summary>String colour.</summary>
    public Rgb StringColour { get; init; } = new(225, 222, 205);

    /// <summary>How far the (still) string is drawn beyond each end, in pixels; default 40.</summary>
    public double StringExtensionPx { get; init; } = 40;

    /// <summary>Rest positions of the moving marks as fractions of L, strictly inside (0, 1), ascending.</summary>
    public required double[] MarkFractions { get; init; }

    /// <summary>Radius of the moving marks in pixels.</summary>
    public double MarkRadiusPx { get; init; } = 5;

    /// <summary>Colour of the moving marks.</summary>
    public Rgb MarkColour { get; init; } = new(215, 45, 40);

    /// <summary>Radius of the end marks in pixels.</summary>
    public double EndRadiusPx { get; init; } = 6;

    /// <summary>Colour of the end marks.</summary>
    public Rgb EndColour { get; init; } = new(215, 45, 40);

    /// <summary>Background base colour.</summary>
    public Rgb BackgroundColour { get; init; } = new(70, 78, 86);

    /// <summary>Relative contrast of the background texture, 0–1; default 0.15.</summary>
    public double TextureContrast { get; init; } = 0.15;

    /// <summary>Seed of the background texture.</summary>
    public int TextureSeed { get; init; } = 1;

    /// <summary>Left-to-right lighting gradient as a relative change across the image, −1..1; default 0.3.</summary>
    public double LightingGradient { get; init; } = 0.3;

    /// <summary>Relative amplitude of light flicker, 0–1; default 0 (none).</summary>
    public double FlickerFraction { get; init; }

    /// <summary>Flicker frequency in Hz (mains lighting flickers at twice the mains frequency); default 100.</summary>
    public double FlickerHz { get; init; } = 100;

    /// <summary>Static discs in the background, e.g. stray objects of the marks' colour.</summary>
    public IReadOnlyList<Distractor> Distractors { get; init; } = [];

    /// <summary>Opaque rectangles that hide part of the image for a time (a hand passing, say).</summary>
    public IReadOnlyList<Occluder> Occluders { get; init; } = [];

    /// <summary>Capture rate in frames per second.</summary>
    public required double CaptureFps { get; init; }

    /// <summary>Clip duration in seconds.</summary>
    public required double DurationS { get; init; }

    /// <summary>Exposure time in seconds; 0 &lt; exposure ≤ 1/capture rate.</summary>
    public double ExposureS { get; init; } = 0.001;

    /// <summary>Sub-frames averaged over the exposure to render motion blur; ≥ 1; default 8.</summary>
    public int Subframes { get; init; } = 8;

    /// <summary>Rolling-shutter readout time in seconds (row y exposed at t + (y/H)·readout); default 0 (global shutter).</summary>
    public double ReadoutS { get; init; }

    /// <summary>Standard deviation of the additive Gaussian sensor noise in 8-bit digital numbers; default 2.</summary>
    public double NoiseDn { get; init; } = 2;

    /// <summary>Frames before this time (s) use <see cref="ReleaseExposureS"/>: a blurred release; default 0.</summary>
    public double ReleaseDurationS { get; init; }

    /// <summary>Exposure time in seconds during the release; default 1/capture rate.</summary>
    public double ReleaseExposureS { get; init; }

    /// <summary>Sub-frames during the release; default 32.</summary>
    public int ReleaseSubframes { get; init; } = 32;

    /// <summary>Number of frames in the clip.</summary>
    public int FrameCount => (int)Math.Floor(DurationS * CaptureFps + 1e-9);

    /// <summary>Pixels per metre along the string: |end1 − end0| / L.</summary>
    public double PixelsPerMetre
        => Math.Sqrt(Math.Pow(End1.X - End0.X, 2) + Math.Pow(End1.Y - End0.Y, 2)) / Motion.LengthM;
}

/// <summary>A static disc drawn into the background.</summary>
public sealed record Distractor(PixelPoint Centre, double RadiusPx, Rgb Colour);

/// <summary>An opaque rectangle shown from <paramref name="FromS"/> to <paramref name="ToS"/> (seconds).</summary>
public sealed record Occluder(double XPx, double YPx, double WidthPx, double HeightPx, double FromS, double ToS, Rgb Colour);
