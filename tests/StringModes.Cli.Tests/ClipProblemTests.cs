using OpenCvSharp;

namespace StringModes.Cli.Tests;

/// <summary>
/// <c>analyze</c> on unusable clips: exit 3 with one line naming the file and no output folder; a clip without marks:
/// exit 4 with only the diagnostic picture written. results.json is never written.
/// </summary>
[Collection("small clip")]
public class ClipProblemTests(SmallClipFixture clip)
{
    private static string[] Args(string input, string outDir) =>
        ["analyze", input, "--capture-fps", "400", "--length", "0.5m", "--out", outDir];

    private static void AssertBadInput(string input, string outDir, string namedFile)
    {
        var r = Cli.RunExpecting(ExitCodes.BadInput, Args(input, outDir));
        Cli.AssertOneLineError(r, namedFile);
        Assert.Contains(";", r.ErrorLines[0], StringComparison.Ordinal);
        Assert.False(Directory.Exists(outDir), "no output folder after bad input");
        Assert.DoesNotContain(Directory.GetFileSystemEntries(Path.GetDirectoryName(outDir)!), e => e.Contains(".partial", StringComparison.Ordinal));
    }

    [Fact]
    public void RandomBytesWithMp4Extension_ExitsThreeNamingTheFile()
    {
        using var temp = new TempFolder();
        var bytes = new byte[64 * 1024];
        new Random(20240601).NextBytes(bytes);
        File.WriteAllBytes(temp.File("noise.mp4"), bytes);
        AssertBadInput(temp.File("noise.mp4"), temp.File("results"), "noise.mp4");
    }

    [Fact]
    public void EmptyFile_ExitsThreeNamingTheFile()
    {
        using var temp = new TempFolder();
        File.WriteAllBytes(temp.File("empty.mp4"), []);
        AssertBadInput(temp.File("empty.mp4"), temp.File("results"), "empty.mp4");
    }

    [Fact]
    public void MissingFile_ExitsThreeNamingTheFile()
    {
        using var temp = new TempFolder();
        AssertBadInput(temp.File("absent.mp4"), temp.File("results"), "absent.mp4");
    }

    [Fact]
    public void ImageFolderWithMixedSizes_ExitsThreeNamingTheOddFrame()
    {
        using var temp = new TempFolder();
        var frames = Directory.CreateDirectory(temp.File("frames")).FullName;
        foreach (var f in Directory.GetFiles(clip.Clip).Order(StringComparer.Ordinal).Take(40))
            File.Copy(f, Path.Combine(frames, Path.GetFileName(f)));
        using (var odd = new Mat(64, 64, MatType.CV_8UC3, Scalar.All(150)))
            Cv2.ImWrite(Path.Combine(frames, "frame_000040.png"), odd);
        AssertBadInput(frames, temp.File("results"), "frame_000040.png");
    }

    [Fact]
    public void FolderWithoutImages_ExitsThreeNamingTheFolder()
    {
        using var temp = new TempFolder();
        var frames = Directory.CreateDirectory(temp.File("no-images")).FullName;
        File.WriteAllText(Path.Combine(frames, "readme.txt"), "frames go here");
        AssertBadInput(frames, temp.File("results"), "no-images");
    }

    [Fact]
    public void ClipWithoutMarks_ExitsFourAndWritesOnlyTheDiagnosticPicture()
    {
        using var temp = new TempFolder();
        var frames = Directory.CreateDirectory(temp.File("plain")).FullName;
        using (var plain = new Mat(120, 320, MatType.CV_8UC3, Scalar.All(150)))
            for (var k = 0; k < 20; k++)
                Cv2.ImWrite(Path.Combine(frames, $"frame_{k:D6}.png"), plain);
        var outDir = temp.File("results");

        var r = Cli.RunExpecting(ExitCodes.AnalysisImpossible, Args(frames, outDir));

        Cli.AssertOneLineError(r, "plain");
        Assert.False(File.Exists(Path.Combine(outDir, "results.json")));
        Assert.Equal(["marks-found.png"], Directory.GetFileSystemEntries(outDir).Select(Path.GetFileName));
    }
}
