using OpenCvSharp;

namespace StringModes.Cli.Tests.Reliability;

/// <summary>
/// Byte-identical outputs across processes. AnalyzeEndToEndTests repeats an analysis inside one process on an image
/// folder; this runs the real executable twice on a video file, so that anything that differs between processes
/// (string hashing, thread scheduling, native decoder state) would show.
/// </summary>
[Collection("small clip")]
public class DeterminismTests(SmallClipFixture clip)
{
    [Fact]
    public void TwoProcessesOnTheSameVideo_GiveByteIdenticalResultsModesAndTracks()
    {
        using var temp = new TempFolder();
        var frames = Directory.GetFiles(clip.Clip, "*.png").Order(StringComparer.Ordinal).Take(120).ToArray();
        using (var first = Cv2.ImRead(frames[0], ImreadModes.Color))
        using (var writer = new VideoWriter(temp.File("clip.mkv"), VideoCaptureAPIs.FFMPEG, VideoWriter.FourCC("FFV1"), 400, first.Size(), true))
        {
            Assert.True(writer.IsOpened());
            foreach (var f in frames)
            {
                using var m = Cv2.ImRead(f, ImreadModes.Color);
                writer.Write(m);
            }
        }

        foreach (var run in new[] { "first", "second" })
        {
            var r = CliProcess.Run(temp.Path, ["analyze", "clip.mkv", "--length", "0.5m", "--linear-density", "1g/m", "--out", run], TimeSpan.FromSeconds(60));
            Assert.True(r.ExitCode == ExitCodes.Success, r.ToString());
        }

        foreach (var name in new[] { "results.json", "modes.csv", "tracks.csv" })
            Assert.True(File.ReadAllBytes(temp.File($"first/{name}")).AsSpan().SequenceEqual(File.ReadAllBytes(temp.File($"second/{name}"))), $"{name} differs between two processes");
    }
}
