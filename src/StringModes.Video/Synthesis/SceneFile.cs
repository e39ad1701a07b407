using System.Text.Json;
using StringModes.Analysis.Physics;
using StringModes.Video.Files;

namespace StringModes.Video.Synthesis;

/// <summary>
/// Reads a scene file (JSON; format in docs/scene-file.md) into a validated <see cref="Scene"/>.
/// Every problem is reported as a <see cref="InputFileException"/> whose one-line message names the field and the fix.
/// </summary>
public static class SceneFile
{
    /// <summary>Reads and validates the scene file at <paramref name="path"/>.</summary>
    public static Scene Load(string path)
    {
        var text = InputFiles.ReadText(path, "a scene file", "give a scene file (JSON; see docs/scene-file.md)");
        return Parse(text, path);
    }

    /// <summary>Parses and validates scene-file text; <paramref name="fileName"/> is used in messages.</summary>
    public static Scene Parse(string text, string fileName)
    {
        JsonDocument doc;
        try
        {
            doc = JsonDocument.Parse(text, new JsonDocumentOptions { AllowTrailingCommas = true, CommentHandling = JsonCommentHandling.Skip });
        }
        catch (JsonException e)
        {
            throw new InputFileException($"{fileName}: not valid JSON (line {e.LineNumber + 1}); fix the syntax near there");
        }
        using (doc)
            return Build(new JsonFields(fileName, "", doc.RootElement));
    }

    private static Scene Build(JsonFields root)
    {
        var description = root.OptionalString("description") ?? "";
        var str = root.Object("string");
        var image = root.Object("image");
        var marks = root.Object("marks");
        var camera = root.Object("camera");
        var background = root.OptionalObject("background");
        var lighting = root.OptionalObject("lighting");
        var release = root.OptionalObject("release");
        var distractorItems = root.Objects("distractors");
        var occluderItems = root.Objects("occluders");
        root.RefuseUnknown();

        // Camera first: mode frequencies are checked against its rate.
        var fps = camera.Number("capture_fps", null, 0, 100_000, true, "give the capture rate in frames per second, e.g. 480");
        var duration = camera.Number("duration_s", null, 0, 600, true, "give the clip length in seconds, e.g. 2");
        var exposure = camera.Number("exposure_s", 0.001, 0, 1.0 / fps, true, $"give an exposure time in seconds no longer than the frame period {1.0 / fps:G4} s");
        var subframes = camera.Integer("subframes", 8, 1, 256, "give how many sub-frames to average over the exposure, e.g. 8");
        var readout = camera.Number("readout_s", 0, 0, 1.0 / fps, false, "give the rolling-shutter readout time in seconds (0 for a global shutter), at most one frame period");
        var noise = camera.Number("noise_dn", 2, 0, 100, false, "give the sensor noise standard deviation in 8-bit digital numbers, e.g. 2");
        camera.RefuseUnknown();
        if (duration * fps < 2)
            throw camera.Error("camera.duration_s", "gives fewer than 2 frames", "lengthen the clip or raise camera.capture_fps");

        var length = str.Number("length_m", null, 0, 1000, true, "give the vibrating length in metres, e.g. 0.65");
        var mu = str.Number("linear_density_kg_per_m", double.NaN, 0, 1000, true, "give the linear density in kg/m, e.g. 0.000987");
        var inharmonicity = str.Number("inharmonicity", 0, 0, 0.1, false, "give the inharmonicity coefficient B (0 for an ideal string)");
        double f0, tension = double.NaN;
        if (str.Has("fundamental_hz"))
        {
            f0 = str.Number("fundamental_hz", null, 0, fps, true, "give the ideal-string fundamental in Hz");
            if (!double.IsNaN(mu)) tension = StringLaw.Tension(mu, length, f0);
            if (str.Has("tension_n"))
                throw str.Error("string.tension_n", "conflicts with string.fundamental_hz", "give either the tension or the fundamental, not both");
        }
        else
        {
            tension = str.Number("tension_n", null, 0, 1e7, true, "give string.tension_n (with string.linear_density_kg_per_m) or string.fundamental_hz");
            if (double.IsNaN(mu))
                throw str.Error("string.linear_density_kg_per_m", "is missing", "a tension needs the linear density in kg/m to give a frequency");
            f0 = StringLaw.Fundamental(tension, mu, length);
        }

        var decay = str.OptionalObject("decay");
        double s0 = 0, s2 = 0;
        if (decay is not null)
        {
            s0 = decay.Number("s0_per_s", 0, 0, 1e4, false, "give the frequency-independent decay rate in 1/s");
            s2 = decay.Number("s2_s", 0, 0, 1, false, "give the coefficient of f² in the decay rate, in s");
            decay.RefuseUnknown();
        }

        var modes = new List<ModeComponent>();
        var explicitModes = str.Objects("modes");
        var pluck = str.OptionalObject("pluck");
        if (explicitModes.Count > 0 && pluck is not null)
            throw str.Error("string.pluck", "conflicts with string.modes", "give either explicit modes or a pluck, not both");
        foreach (var m in explicitModes)
        {
            var n = m.Integer("n", null, 1, 1000, "give the mode number, 1 or more");
            var f = StringLaw.ModeFrequency(n, f0, inharmonicity);
            var amplitude = m.Number("amplitude_m", null, -1, 1, false, "give the mode amplitude in metres, e.g. 0.002");
            var phase = m.Number("phase_rad", 0, -100, 100, false, "give the phase in radians");
            var sigma = m.Number("decay_rate_per_s", s0 + s2 * f * f, 0, 1e4, false, "give the amplitude decay rate in 1/s");
            m.RefuseUnknown();
            modes.Add(new ModeComponent(n, f, sigma, amplitude, phase));
        }
        if (pluck is not null)
        {
            var p = pluck.Number("position_fraction", null, 0, 1, true, "give where the string is plucked as a fraction of its length, between 0 and 1");
            if (p >= 1) throw pluck.Error("string.pluck.position_fraction", "must be < 1", "give a fraction between 0 and 1");
            var peak = pluck.Number("peak_m", null, 0, 1, true, "give the pluck height in metres, e.g. 0.003");
            var count = pluck.Integer("mode_count", 12, 1, 1000, "give how many modes the pluck excites in the model");
            pluck.RefuseUnknown();
            for (var n = 1; n <= count; n++)
            {
                var f = StringLaw.ModeFrequency(n, f0, inharmonicity);
                var a = Pluck.TriangularAmplitude(n, p, peak);
                if (Math.Abs(a) < 1e-15) continue;
                modes.Add(new ModeComponent(n, f, s0 + s2 * f * f, a, 0));
            }
        }
        if (modes.Count == 0)
            throw str.Error("string.modes", "is missing", "give string.modes (a list of modes) or string.pluck");
        if (modes.Select(m => m.N).Distinct().Count() != modes.Count)
            throw str.Error("string.modes", "lists a mode number twice", "give each mode once");
        var aliasing = modes.FirstOrDefault(m => m.FrequencyHz >= fps / 2);
        if (aliasing is not null)
            throw str.Error(explicitModes.Count > 0 ? "string.modes" : "string.pluck.mode_count",
                $"has mode {aliasing.N} at {aliasing.FrequencyHz:F1} Hz, at or above half the capture rate ({fps / 2:G6} Hz)",
                "drop the modes above half the capture rate or raise camera.capture_fps");
        var width = str.Number("width_px", 2, 0.5, 100, false, "give the drawn string width in pixels, e.g. 2");
        var colour = str.Colour("colour_rgb", new Rgb(225, 222, 205));
        var extension = str.Number("extension_px", 40, 0, 10_000, false, "give how far the still string is drawn beyond each end, in pixels");
        str.RefuseUnknown();

        var widthPx = image.Integer("width_px", null, 16, 8192, "give the image width in pixels, e.g. 1280");
        var heightPx = image.Integer("height_px", null, 16, 8192, "give the image height in pixels, e.g. 720");
        var end0 = image.Point("end0_px", "give end 0 as [x, y] in pixels");
        var end1 = image.Point("end1_px", "give end 1 as [x, y] in pixels");
        image.RefuseUnknown();
        var spanPx = Math.Sqrt(Math.Pow(end1.X - end0.X, 2) + Math.Pow(end1.Y - end0.Y, 2));
        if (spanPx < 20)
            throw image.Error("image.end1_px", "is closer than 20 px to image.end0_px", "place the ends further apart");

        double[] fractions;
        var given = marks.OptionalNumbers("positions_fraction", null, 0, 1, true, "give mark positions as fractions of the length, strictly between 0 and 1");
        if (given is not null)
        {
            if (given.Any(x => x >= 1)) throw marks.Error("marks.positions_fraction", "has a value ≥ 1", "give fractions strictly between 0 and 1");
            fractions = given.OrderBy(x => x).ToArray();
            if (fractions.Length == 0) throw marks.Error("marks.positions_fraction", "is empty", "give at least one mark");
        }
        else
        {
            var k = marks.Integer("count", null, 1, 500, "give marks.count (equally spaced marks) or marks.positions_fraction");
            fractions = Enumerable.Range(1, k).Select(i => i / (k + 1.0)).ToArray();
        }
        var radius = marks.Number("radius_px", 5, 0.5, 200, false, "give the mark radius in pixels, e.g. 5");
        var markColour = marks.Colour("colour_rgb", new Rgb(215, 45, 40));
        var endRadius = marks.Number("end_radius_px", radius + 1, 0.5, 200, false, "give the end-mark radius in pixels");
        var endColour = marks.Colour("end_colour_rgb", markColour);
        marks.RefuseUnknown();

        var scene = new Scene
        {
            Description = description,
            Motion = new StringMotion(length, modes),
            LinearDensityKgPerM = mu,
            TensionN = tension,
            FundamentalHz = f0,
            Inharmonicity = inharmonicity,
            WidthPx = widthPx,
            HeightPx = heightPx,
            End0 = end0,
            End1 = end1,
            StringWidthPx = width,
            StringColour = colour,
            StringExtensionPx = extension,
            MarkFractions = fractions,
            MarkRadiusPx = radius,
            MarkColour = markColour,
            EndRadiusPx = endRadius,
            EndColour = endColour,
            CaptureFps = fps,
            DurationS = duration,
            ExposureS = exposure,
            Subframes = subframes,
            ReadoutS = readout,
            NoiseDn = noise,
        };

        if (background is not null)
        {
            scene = scene with
            {
                BackgroundColour = background.Colour("colour_rgb", scene.BackgroundColour),
                TextureContrast = background.Number("texture_contrast", scene.TextureContrast, 0, 1, false, "give the texture contrast as a fraction, 0–1"),
                TextureSeed = background.Integer("texture_seed", scene.TextureSeed, 0, int.MaxValue, "give a whole-number seed"),
                LightingGradient = background.Number("lighting_gradient", scene.LightingGradient, -1, 1, false, "give the left-to-right lighting change as a fraction, −1..1"),
            };
            background.RefuseUnknown();
        }
        if (lighting is not null)
        {
            scene = scene with
            {
                FlickerFraction = lighting.Number("flicker_fraction", 0, 0, 1, false, "give the flicker depth as a fraction, 0–1"),
                FlickerHz = lighting.Number("flicker_hz", 100, 0, 100_000, true, "give the flicker frequency in Hz, e.g. 100"),
            };
            lighting.RefuseUnknown();
        }
        if (release is not null)
        {
            var releaseDuration = release.Number("duration_s", null, 0, duration, true, "give how long the blurred release lasts, in seconds");
            var releaseExposure = release.Number("exposure_s", 1.0 / fps, 0, 1.0 / fps, true, "give the release exposure in seconds, at most one frame period");
            var releaseSubframes = release.Integer("subframes", 32, 1, 1024, "give how many sub-frames to average over the release exposure");
            release.RefuseUnknown();
            scene = scene with { ReleaseDurationS = releaseDuration, ReleaseExposureS = releaseExposure, ReleaseSubframes = releaseSubframes };
        }
        scene = scene with
        {
            Distractors = distractorItems.Select(d =>
            {
                var r = new Distractor(d.Point("centre_px", "give the centre as [x, y] in pixels"),
                    d.Number("radius_px", null, 0.5, 10_000, false, "give the radius in pixels"),
                    d.Colour("colour_rgb", scene.MarkColour));
                d.RefuseUnknown();
                return r;
            }).ToArray(),
            Occluders = occluderItems.Select(o =>
            {
                var rect = o.OptionalNumbers("rect_px", 4, double.NegativeInfinity, double.PositiveInfinity, false, "give [x, y, width, height] in pixels")
                    ?? throw o.Error("occluder.rect_px", "is missing", "give [x, y, width, height] in pixels");
                var from = o.Number("from_s", null, double.NegativeInfinity, double.PositiveInfinity, false, "give when it appears, in seconds");
                var to = o.Number("to_s", null, from, double.PositiveInfinity, true, "give when it disappears, in seconds, after from_s");
                var r = new Occluder(rect[0], rect[1], rect[2], rect[3], from, to, o.Colour("colour_rgb", new Rgb(196, 150, 120)));
                o.RefuseUnknown();
                return r;
            }).ToArray(),
        };

        CheckMarksInside(scene, image);
        return scene;
    }

    private static void CheckMarksInside(Scene scene, JsonFields image)
    {
        var geometry = new StringGeometry(scene);
        var maxAmplitudePx = scene.Motion.Modes.Sum(m => Math.Abs(m.AmplitudeM)) * geometry.PixelsPerMetre;
        void Check(PixelPoint p, double radius, string what)
        {
            var margin = radius + maxAmplitudePx + 1;
            if (p.X - margin < -0.5 || p.Y - margin < -0.5 || p.X + margin > scene.WidthPx - 0.5 || p.Y + margin > scene.HeightPx - 0.5)
                throw image.Error("image", $"puts {what} at ({p.X:F1}, {p.Y:F1}) px, which with its radius and the string's swing of up to {maxAmplitudePx:F1} px leaves the {scene.WidthPx}×{scene.HeightPx} image",
                    "move image.end0_px/end1_px inwards, enlarge the image or reduce the amplitude");
        }
        Check(scene.End0, scene.EndRadiusPx, "end 0");
        Check(scene.End1, scene.EndRadiusPx, "end 1");
        for (var i = 0; i < scene.MarkFractions.Length; i++)
            Check(geometry.RestPosition(scene.MarkFractions[i]), scene.MarkRadiusPx, $"mark {i + 1}");
    }
}
