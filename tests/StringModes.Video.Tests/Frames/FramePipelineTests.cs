using OpenCvSharp;
using StringModes.Video.Files;
using StringModes.Video.Frames;
using StringModes.Video.Synthesis;
using StringModes.Video.Tests.Synthesis;

namespace StringModes.Video.Tests.Frames;

/// <summary>Decoding ahead on a second thread changes nothing about what the consumer sees.</summary>
public class FramePipelineTests
{
    private static string Clip(TempFolder temp, string file)
    {
        var scene = SceneFixtures.Parse(SceneFixtures.Small(noiseDn: 2, textureContrast: 0.12, stringColour: "[215, 210, 195]"));
        ClipSynthesiser.Run(scene, temp.File(file), new SynthesisOptions { Seed = 5 }, "s.json");
        return temp.File(file);
    }

    [Fact]
    public void Frames_and_timestamps_equal_those_read_in_order()
    {
        using var temp = new TempFolder();
        var path = Clip(temp, "clip.mkv");
        var expected = new List<(byte[] Pixels, double T)>();
        using (var direct = FrameSources.Open(path, null))
            while (direct.Read(out var frame, out var t))
            {
                frame.GetArray(out Vec3b[] px);
                expected.Add((px.SelectMany(p => new[] { p.Item0, p.Item1, p.Item2 }).ToArray(), t));
            }
        using var source = FrameSources.Open(path, null);
        using var pipeline = new FramePipeline(source, depth: 3);
        var k = 0;
        foreach (var (frame, t) in pipeline.Frames())
        {
            frame.GetArray(out Vec3b[] px);
            Assert.True(k < expected.Count, "more frames than in order");
            Assert.Equal(expected[k].T, t); // same decoder, same arithmetic: exactly equal
            Assert.Equal(expected[k].Pixels, px.SelectMany(p => new[] { p.Item0, p.Item1, p.Item2 }).ToArray());
            k++;
        }
        Assert.Equal(expected.Count, k);
        Assert.True(k > 10, $"only {k} frames");
    }

    [Fact]
    public void Error_of_the_decoding_thread_reaches_the_consumer()
    {
        using var temp = new TempFolder();
        var folder = Clip(temp, "seq");
        // A frame of another size in the middle of the sequence: the source throws on the decoding thread.
        var files = Directory.GetFiles(folder).Order(StringComparer.Ordinal).ToArray();
        using (var odd = new Mat(10, 10, MatType.CV_8UC3, Scalar.All(0))) Cv2.ImWrite(files[5], odd);
        using var source = FrameSources.Open(folder, 400);
        using var pipeline = new FramePipeline(source);
        var seen = 0;
        var e = Assert.Throws<InputFileException>(() => { foreach (var _ in pipeline.Frames()) seen++; });
        Assert.Contains("one size", e.Message);
        Assert.Equal(5, seen);
    }

    [Fact]
    public void Cancellation_stops_the_consumer()
    {
        using var temp = new TempFolder();
        var path = Clip(temp, "clip.mkv");
        using var cancel = new CancellationTokenSource();
        using var source = FrameSources.Open(path, null);
        using var pipeline = new FramePipeline(source, cancel: cancel.Token);
        var seen = 0;
        Assert.ThrowsAny<OperationCanceledException>(() =>
        {
            foreach (var _ in pipeline.Frames())
            {
                if (++seen == 3) cancel.Cancel();
            }
        });
        // Frames already decoded ahead may still be handed out, but no more than the pipeline depth (4) plus one.
        Assert.InRange(seen, 3, 8);
    }
}
