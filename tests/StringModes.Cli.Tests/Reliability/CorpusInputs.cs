using System.Runtime.InteropServices;
using System.Text.Json;
using OpenCvSharp;

namespace StringModes.Cli.Tests.Reliability;

/// <summary>
/// Builds the bad-input corpus from one small good clip (<see cref="SmallClipFixture"/>, a PNG sequence of
/// <see cref="Scenes.Small"/>): re-encoded videos that are then truncated or corrupted, doctored image folders, rig
/// and scene files with every kind of wrong value, unreadable files. Everything is derived with fixed seeds, so two
/// builds give the same bytes and the same messages. Paths are relative to <see cref="Root"/>, the folder the
/// command runs in, as a user's would be.
/// </summary>
internal sealed class CorpusInputs
{
    public const double CaptureFps = 400;

    private readonly string[] _frames;

    public CorpusInputs(string root, SmallClipFixture clip)
    {
        Root = root;
        _frames = Directory.GetFiles(clip.Clip, "*.png").Order(StringComparer.Ordinal).ToArray();
        using var truth = JsonDocument.Parse(clip.Truth);
        MarkRestPx = truth.RootElement.GetProperty("marks").EnumerateArray()
            .Select(m => (m.GetProperty("rest_px")[0].GetDouble(), m.GetProperty("rest_px")[1].GetDouble())).ToArray();
        Directory.CreateDirectory(Path.Combine(root, "out"));
        Directory.CreateDirectory(Path.Combine(root, "existing"));
        CopyFolder(clip.Clip, Full("good"));
    }

    /// <summary>The folder the command runs in; inputs are created directly inside it.</summary>
    public string Root { get; }

    /// <summary>Rest positions of the clip's marks in pixels, ends first and last (from the synthesiser's truth file).</summary>
    public (double X, double Y)[] MarkRestPx { get; }

    public string Full(string relative) => Path.Combine(Root, relative);

    // ---- videos ----------------------------------------------------------------------------------------------------

    /// <summary>The good clip re-encoded through OpenCV's FFmpeg writer (fourcc FFV1, MJPG or mp4v) at 400 frames/s.</summary>
    public string Encode(string name, string fourcc, int frameCount = -1, int width = 0, int height = 0)
    {
        var path = Full(name);
        var frames = frameCount < 0 ? _frames : _frames.Take(frameCount).ToArray();
        using var first = Cv2.ImRead(_frames[0], ImreadModes.Color);
        var size = width > 0 ? new Size(width, height) : first.Size();
        using (var writer = new VideoWriter(path, VideoCaptureAPIs.FFMPEG, VideoWriter.FourCC(fourcc), CaptureFps, size, true))
        {
            if (!writer.IsOpened()) throw new InvalidOperationException($"OpenCV could not open a {fourcc} writer for {path}");
            foreach (var f in frames)
            {
                using var m = Cv2.ImRead(f, ImreadModes.Color);
                if (width > 0)
                {
                    using var resized = new Mat();
                    Cv2.Resize(m, resized, size, 0, 0, InterpolationFlags.Area);
                    writer.Write(resized);
                }
                else writer.Write(m);
            }
        }
        return name;
    }

    /// <summary>The first <paramref name="fraction"/> of <paramref name="source"/>'s bytes (at least <paramref name="minimumBytes"/>).</summary>
    public string Truncate(string source, string name, double fraction, int minimumBytes = 0)
    {
        var bytes = File.ReadAllBytes(Full(source));
        var keep = Math.Max(minimumBytes, (int)(bytes.Length * fraction));
        File.WriteAllBytes(Full(name), bytes[..Math.Min(keep, bytes.Length)]);
        return name;
    }

    /// <summary>A copy of <paramref name="source"/> with <paramref name="count"/> bytes at <paramref name="fraction"/> of its length overwritten by seeded noise.</summary>
    public string Corrupt(string source, string name, double fraction, int count, int seed)
    {
        var bytes = File.ReadAllBytes(Full(source));
        var at = (int)(bytes.Length * fraction);
        var noise = new byte[Math.Min(count, bytes.Length - at)];
        new Random(seed).NextBytes(noise);
        noise.CopyTo(bytes, at);
        File.WriteAllBytes(Full(name), bytes);
        return name;
    }

    public string WriteBytes(string name, byte[] bytes)
    {
        File.WriteAllBytes(Full(name), bytes);
        return name;
    }

    public string WriteText(string name, string text)
    {
        File.WriteAllText(Full(name), text);
        return name;
    }

    public string RandomBytes(string name, int count, int seed)
    {
        var bytes = new byte[count];
        new Random(seed).NextBytes(bytes);
        return WriteBytes(name, bytes);
    }

    /// <summary>
    /// A PNG whose header claims <paramref name="width"/>×<paramref name="height"/> pixels but holds no image data: the
    /// 8-byte signature, an IHDR chunk with a correct CRC and an IEND chunk (PNG specification, ISO/IEC 15948 §5).
    /// </summary>
    public string PngHeaderOnly(string name, int width, int height)
    {
        var ihdr = new byte[13];
        System.Buffers.Binary.BinaryPrimitives.WriteInt32BigEndian(ihdr, width);
        System.Buffers.Binary.BinaryPrimitives.WriteInt32BigEndian(ihdr.AsSpan(4), height);
        ihdr[8] = 8; // bit depth
        ihdr[9] = 2; // colour type: RGB
        using var s = new MemoryStream();
        s.Write([0x89, 0x50, 0x4E, 0x47, 0x0D, 0x0A, 0x1A, 0x0A]);
        Chunk(s, "IHDR", ihdr);
        Chunk(s, "IEND", []);
        return WriteBytes(name, s.ToArray());
    }

    private static void Chunk(Stream s, string type, byte[] data)
    {
        Span<byte> word = stackalloc byte[4];
        System.Buffers.Binary.BinaryPrimitives.WriteInt32BigEndian(word, data.Length);
        s.Write(word);
        var typed = System.Text.Encoding.ASCII.GetBytes(type).Concat(data).ToArray();
        s.Write(typed);
        System.Buffers.Binary.BinaryPrimitives.WriteUInt32BigEndian(word, Crc32(typed));
        s.Write(word);
    }

    // CRC-32 of the PNG specification (ISO/IEC 15948 Annex D): reflected polynomial 0xEDB88320.
    private static uint Crc32(byte[] data)
    {
        var c = 0xFFFFFFFFu;
        foreach (var b in data)
        {
            c ^= b;
            for (var k = 0; k < 8; k++) c = (c & 1) != 0 ? 0xEDB88320u ^ (c >> 1) : c >> 1;
        }
        return c ^ 0xFFFFFFFFu;
    }

    // ---- image folders ---------------------------------------------------------------------------------------------

    // Lossless like any PNG; the lowest compression level only makes the files larger and the writing fast.
    private static readonly ImageEncodingParam[] FastPng = [new(ImwriteFlags.PngCompression, 1)];

    /// <summary>A folder of the good clip's frames passed through <paramref name="edit"/> (frame index, image in place).</summary>
    public string Frames(string name, Action<int, Mat>? edit = null, int count = -1)
    {
        var folder = Directory.CreateDirectory(Full(name)).FullName;
        var frames = count < 0 ? _frames : _frames.Take(count).ToArray();
        for (var k = 0; k < frames.Length; k++)
        {
            var target = Path.Combine(folder, Path.GetFileName(frames[k]));
            if (edit is null) { File.Copy(frames[k], target); continue; }
            using var m = Cv2.ImRead(frames[k], ImreadModes.Unchanged);
            edit(k, m);
            Cv2.ImWrite(target, m, FastPng);
        }
        return name;
    }

    /// <summary>Each frame the mean of <paramref name="span"/> consecutive frames of the good clip (one fewer frame per extra span): a long exposure, motion blur on every frame.</summary>
    public string MotionBlurred(string name, int span)
    {
        var folder = Directory.CreateDirectory(Full(name)).FullName;
        var images = _frames.Select(f => { using var m = Cv2.ImRead(f, ImreadModes.Color); var d = new Mat(); m.ConvertTo(d, MatType.CV_32FC3); return d; }).ToArray();
        try
        {
            for (var k = 0; k + span <= images.Length; k++)
            {
                using var sum = new Mat(images[0].Size(), MatType.CV_32FC3, Scalar.All(0));
                for (var j = 0; j < span; j++) Cv2.Add(sum, images[k + j], sum);
                using var mean = new Mat();
                sum.ConvertTo(mean, MatType.CV_8UC3, 1.0 / span);
                Cv2.ImWrite(Path.Combine(folder, Path.GetFileName(_frames[k])), mean, FastPng);
            }
        }
        finally
        {
            foreach (var m in images) m.Dispose();
        }
        return name;
    }

    /// <summary>Same-sized plain images (every one the background grey of the scene).</summary>
    public string PlainFrames(string name, int count, int width, int height)
    {
        var folder = Directory.CreateDirectory(Full(name)).FullName;
        using var plain = new Mat(height, width, MatType.CV_8UC3, Scalar.All(150));
        for (var k = 0; k < count; k++) Cv2.ImWrite(Path.Combine(folder, $"frame_{k:D6}.png"), plain, FastPng);
        return name;
    }

    /// <summary>Paints the scene's background grey over a box of half-size <paramref name="half"/> px around a mark's rest position.</summary>
    public void HideMark(Mat frame, int mark, int half = 14)
    {
        var (x, y) = MarkRestPx[mark];
        var box = new Rect((int)Math.Round(x) - half, (int)Math.Round(y) - 2 * half, 2 * half + 1, 4 * half + 1);
        Cv2.Rectangle(frame, box, Scalar.All(150), -1);
    }

    public static void CopyFolder(string from, string to)
    {
        Directory.CreateDirectory(to);
        foreach (var f in Directory.GetFiles(from)) File.Copy(f, Path.Combine(to, Path.GetFileName(f)));
    }

    // ---- unreadable inputs -----------------------------------------------------------------------------------------

    /// <summary>A named pipe: opening it for reading blocks until a writer appears, which none ever does.</summary>
    public string Fifo(string name)
    {
        if (MakeFifo(Full(name), 0b110_100_100) != 0) throw new InvalidOperationException($"mkfifo {name} failed: errno {Marshal.GetLastPInvokeError()}");
        return name;
    }

    /// <summary>Removes every permission bit (mode 000) from a file or folder.</summary>
    public string Lock(string name)
    {
        File.SetUnixFileMode(Full(name), UnixFileMode.None);
        return name;
    }

    /// <summary>Gives back the permissions so that the folder can be deleted.</summary>
    public void UnlockAll()
    {
        foreach (var e in Directory.EnumerateFileSystemEntries(Root, "*", new EnumerationOptions { RecurseSubdirectories = false }))
            File.SetUnixFileMode(e, UnixFileMode.UserRead | UnixFileMode.UserWrite | UnixFileMode.UserExecute);
        foreach (var d in Directory.GetDirectories(Root))
            foreach (var e in Directory.EnumerateFileSystemEntries(d))
                File.SetUnixFileMode(e, UnixFileMode.UserRead | UnixFileMode.UserWrite | UnixFileMode.UserExecute);
    }

    [DllImport("libc", EntryPoint = "mkfifo", SetLastError = true)]
    private static extern int MakeFifo(string path, uint mode);
}
