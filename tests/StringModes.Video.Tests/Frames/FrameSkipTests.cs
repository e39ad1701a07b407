using OpenCvSharp;
using StringModes.Video.Frames;
using StringModes.Video.Synthesis;
using StringModes.Video.Tests.Synthesis;

namespace StringModes.Video.Tests.Frames;

/// <summary>Skipping to a frame returns the same pixels as reading every frame up to it.</summary>
public class FrameSkipTests
{
    private static Mat InOrder(string path, int index)
    {
        using var source = FrameSources.Open(path, 400);
        Mat? last = null;
        for (var k = 0; k <= index; k++)
        {
            Assert.True(source.Read(out var frame, out _), $"frame {k} of {path}");
            last?.Dispose();
            last = frame.Clone();
        }
        return last!;
    }

    // Lossless, intra-only and long-GOP inter-frame codecs (the OpenCV writer's MPEG-4, and H.264 with B-frames as
    // phones write it). A skip that lands on the wrong frame shows as a non-zero difference: the string moves every frame.
    [Theory]
    [InlineData("clip.mkv", null)]
    [InlineData("clip.mp4", null)]
    [InlineData("h264.mp4", "libx264")]
    [InlineData("seq", null)]
    public void Skipped_frame_equals_frame_read_in_order(string file, string? codec)
    {
        var scene = SceneFixtures.Parse(SceneFixtures.Small(noiseDn: 2, textureContrast: 0.12, stringColour: "[215, 210, 195]"));
        using var temp = new TempFolder();
        if (codec is null) ClipSynthesiser.Run(scene, temp.File(file), new SynthesisOptions { Seed = 4 }, "s.json");
        else
        {
            ClipSynthesiser.Run(scene, temp.File("seq"), new SynthesisOptions { Seed = 4 }, "s.json");
            Ffmpeg.Run($"-framerate 400 -i {temp.File("seq")}/frame_%06d.png -c:v {codec} -crf 18 -g 100 -pix_fmt yuv420p {temp.File(file)}");
        }
        var path = temp.File(file);
        const int index = 37;
        using var expected = InOrder(path, index);
        using var source = FrameSources.Open(path, 400);
        var skipped = source.TrySkipTo(index);
        Assert.True(skipped, $"{file}: the source could not skip");
        Assert.True(source.Read(out var frame, out _));
        using var difference = new Mat();
        Cv2.Absdiff(expected, frame, difference);
        difference.Reshape(1).MinMaxLoc(out double _, out double max);
        Assert.True(max == 0, $"{file}: skipped frame differs from frame {index} by up to {max} DN");
    }
}
