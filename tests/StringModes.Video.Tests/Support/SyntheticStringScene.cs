using OpenCvSharp;

namespace StringModes.Video.Tests.Support;

/// <summary>
/// Small test renderer (stand-in until the clip synthesiser lands): a near-horizontal string between two fixed end
/// marks over a smooth random texture, with disc marks whose transverse (y) displacement is a sum of decaying sine
/// modes. Discs are antialiased by area coverage (8×8 supersampling on edge pixels); exposure blur averages
/// <see cref="ExposureSteps"/> renders spread over the exposure, and the truth is the same average of the centres.
/// Pixel centres sit at integer coordinates.
/// </summary>
internal sealed class SyntheticStringScene
{
    private readonly float[] background;
    private readonly float[] accum;

    public SyntheticStringScene(int width, int height, int seed = 1, double textureAmplitudeDn = 12)
    {
        Width = width;
        Height = height;
        End0 = (0.08 * width, 0.5 * height);
        End1 = (0.92 * width, 0.5 * height + 0.02 * height);
        background = new float[width * height];
        accum = new float[width * height];
        var rng = new Random(seed);
        // Texture: a few random plane waves of 8–40 px wavelength (smooth, deterministic, not periodic on the clip scale).
        int waves = 12;
        var k = new (double kx, double ky, double ph, double a)[waves];
        for (int i = 0; i < waves; i++)
        {
            double lambda = 8 + 32 * rng.NextDouble();
            double ang = rng.NextDouble() * Math.PI;
            k[i] = (2 * Math.PI / lambda * Math.Cos(ang), 2 * Math.PI / lambda * Math.Sin(ang), rng.NextDouble() * 2 * Math.PI, textureAmplitudeDn / Math.Sqrt(waves / 2.0) * rng.NextDouble());
        }

        for (int y = 0; y < height; y++)
        {
            for (int x = 0; x < width; x++)
            {
                double v = BackgroundDn;
                foreach (var w in k)
                {
                    v += w.a * Math.Sin(w.kx * x + w.ky * y + w.ph);
                }

                background[y * width + x] = (float)v;
            }
        }
    }

    public int Width { get; }
    public int Height { get; }
    public (double X, double Y) End0 { get; init; }
    public (double X, double Y) End1 { get; init; }
    public double BackgroundDn { get; init; } = 150;
    public double StringDn { get; init; } = 110;
    public double StringWidthPx { get; init; } = 1.6;
    public double MarkDn { get; init; } = 25;
    public double EndMarkDn { get; init; } = 25;
    public double MarkRadiusPx { get; init; } = 3.5;

    /// <summary>Fractions s/L of the moving marks.</summary>
    public double[] MarkFractions { get; init; } = [0.2, 0.4, 0.6, 0.8];

    /// <summary>Modes: amplitude at an antinode in px, frequency in Hz, decay rate in 1/s, phase in rad.</summary>
    public (double AmplitudePx, double FrequencyHz, double DecayPerS, double Phase)[] Modes { get; init; } =
        [(6, 7.3, 0.3, 0.4), (2, 14.7, 0.5, 1.1)];

    public int ExposureSteps { get; init; } = 1;

    /// <summary>Marks hidden (not drawn) during [from, to) seconds: (mark index among all marks incl. ends, from, to).</summary>
    public (int Mark, double FromS, double ToS)[] Hidden { get; init; } = [];

    /// <summary>Number of marks including both ends.</summary>
    public int MarkCount => MarkFractions.Length + 2;

    /// <summary>Centre of mark m (0 = end 0, last = end 1) at time t.</summary>
    public (double X, double Y) Centre(int m, double tS)
    {
        double s = m == 0 ? 0 : m == MarkCount - 1 ? 1 : MarkFractions[m - 1];
        double x = End0.X + s * (End1.X - End0.X);
        double y = End0.Y + s * (End1.Y - End0.Y);
        if (m == 0 || m == MarkCount - 1)
        {
            return (x, y);
        }

        return (x, y + Displacement(s, tS));
    }

    /// <summary>
    /// Renders the frame exposed over [t − e/2, t + e/2] into an 8-bit or 16-bit grey Mat (reused if given) and
    /// returns the exposure-averaged mark centres.
    /// </summary>
    public (double X, double Y)[] Render(double tS, double exposureS, double noiseDn, Random rng, Mat target, bool sixteenBit = false)
    {
        Array.Copy(background, accum, background.Length);
        var truth = new (double X, double Y)[MarkCount];
        int steps = Math.Max(1, ExposureSteps);
        double maxAmp = Modes.Sum(m => Math.Abs(m.AmplitudePx));
        int yLo = (int)Math.Floor(Math.Min(End0.Y, End1.Y) - maxAmp - MarkRadiusPx - StringWidthPx - 3);
        int yHi = (int)Math.Ceiling(Math.Max(End0.Y, End1.Y) + maxAmp + MarkRadiusPx + StringWidthPx + 3);
        yLo = Math.Max(0, yLo);
        yHi = Math.Min(Height - 1, yHi);
        int bandRows = yHi - yLo + 1;
        var band = new float[bandRows * Width];
        var layer = new float[bandRows * Width];
        var centres = new (double X, double Y)[MarkCount];
        for (int k = 0; k < steps; k++)
        {
            double t = steps == 1 ? tS : tS + exposureS * ((k + 0.5) / steps - 0.5);
            for (int m = 0; m < MarkCount; m++)
            {
                centres[m] = Centre(m, t);
                truth[m] = (truth[m].X + centres[m].X / steps, truth[m].Y + centres[m].Y / steps);
            }

            for (int r = 0; r < bandRows; r++)
            {
                Array.Copy(background, (yLo + r) * Width, layer, r * Width, Width);
            }

            DrawString(layer, yLo, bandRows, t);
            for (int m = 0; m < MarkCount; m++)
            {
                if (Hidden.Any(h => h.Mark == m && t >= h.FromS && t < h.ToS))
                {
                    continue;
                }

                DrawDisc(layer, yLo, bandRows, centres[m].X, centres[m].Y, MarkRadiusPx, m == 0 || m == MarkCount - 1 ? EndMarkDn : MarkDn);
            }

            for (int i = 0; i < band.Length; i++)
            {
                band[i] += layer[i] / steps;
            }
        }

        for (int r = 0; r < bandRows; r++)
        {
            Array.Copy(band, r * Width, accum, (yLo + r) * Width, Width);
        }

        Write(target, noiseDn, rng, sixteenBit);
        return truth;
    }

    /// <summary>Transverse displacement of the string at fraction s of its length, px.</summary>
    public double Displacement(double s, double tS)
    {
        double u = 0;
        for (int n = 0; n < Modes.Length; n++)
        {
            var md = Modes[n];
            u += md.AmplitudePx * Math.Sin((n + 1) * Math.PI * s) * Math.Exp(-md.DecayPerS * tS) * Math.Cos(2 * Math.PI * md.FrequencyHz * tS + md.Phase);
        }

        return u;
    }

    private void DrawString(float[] layer, int yLo, int rows, double tS)
    {
        // The string follows the smooth mode shape (not straight segments between marks).
        for (int x = (int)Math.Ceiling(End0.X); x <= (int)Math.Floor(End1.X); x++)
        {
            double s = (x - End0.X) / (End1.X - End0.X);
            double yc = End0.Y + s * (End1.Y - End0.Y) + Displacement(s, tS);
            for (int r = 0; r < rows; r++)
            {
                double d = Math.Abs(yLo + r - yc);
                double cov = Math.Clamp(StringWidthPx / 2 + 0.5 - d, 0, 1);
                if (cov > 0)
                {
                    int i = r * Width + x;
                    layer[i] = (float)(layer[i] * (1 - cov) + StringDn * cov);
                }
            }
        }
    }

    private void DrawDisc(float[] layer, int yLo, int rows, double cx, double cy, double radius, double level)
    {
        int x0 = Math.Max(0, (int)Math.Floor(cx - radius - 1)), x1 = Math.Min(Width - 1, (int)Math.Ceiling(cx + radius + 1));
        int y0 = Math.Max(yLo, (int)Math.Floor(cy - radius - 1)), y1 = Math.Min(yLo + rows - 1, (int)Math.Ceiling(cy + radius + 1));
        const int ss = 8;
        for (int y = y0; y <= y1; y++)
        {
            for (int x = x0; x <= x1; x++)
            {
                double d = Math.Sqrt((x - cx) * (x - cx) + (y - cy) * (y - cy));
                double cov;
                if (d + 0.7072 <= radius)
                {
                    cov = 1;
                }
                else if (d - 0.7072 >= radius)
                {
                    continue;
                }
                else
                {
                    int inside = 0;
                    for (int a = 0; a < ss; a++)
                    {
                        for (int b = 0; b < ss; b++)
                        {
                            double px = x - 0.5 + (a + 0.5) / ss - cx, py = y - 0.5 + (b + 0.5) / ss - cy;
                            if (px * px + py * py <= radius * radius)
                            {
                                inside++;
                            }
                        }
                    }

                    cov = inside / (double)(ss * ss);
                }

                int i = (y - yLo) * Width + x;
                layer[i] = (float)(layer[i] * (1 - cov) + level * cov);
            }
        }
    }

    private unsafe void Write(Mat target, double noiseDn, Random rng, bool sixteenBit)
    {
        var type = sixteenBit ? MatType.CV_16UC1 : MatType.CV_8UC1;
        if (target.Width != Width || target.Height != Height || target.Type() != type)
        {
            target.Create(Height, Width, type);
        }

        for (int y = 0; y < Height; y++)
        {
            byte* row = (byte*)target.Ptr(y);
            for (int x = 0; x < Width; x++)
            {
                double v = accum[y * Width + x];
                if (noiseDn > 0)
                {
                    v += noiseDn * Gaussian(rng);
                }

                if (sixteenBit)
                {
                    ((ushort*)row)[x] = (ushort)Math.Clamp(Math.Round(v * 256), 0, 65535);
                }
                else
                {
                    row[x] = (byte)Math.Clamp(Math.Round(v), 0, 255);
                }
            }
        }
    }

    private static double Gaussian(Random rng)
    {
        double u1 = 1 - rng.NextDouble(), u2 = rng.NextDouble();
        return Math.Sqrt(-2 * Math.Log(u1)) * Math.Cos(2 * Math.PI * u2);
    }
}
