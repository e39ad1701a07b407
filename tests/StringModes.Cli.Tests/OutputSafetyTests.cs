using System.Text.Json;

namespace StringModes.Cli.Tests;

/// <summary>Existing results are never overwritten by accident; usage errors are one line with exit 2.</summary>
[Collection("small clip")]
public class OutputSafetyTests(SmallClipFixture clip)
{
    private static Dictionary<string, byte[]> Snapshot(string folder)
        => Directory.GetFiles(folder).ToDictionary(f => Path.GetFileName(f), File.ReadAllBytes);

    private static string MakeOldResults(string folder)
    {
        Directory.CreateDirectory(folder);
        File.WriteAllText(Path.Combine(folder, "results.json"), "{ \"old\": true }");
        File.WriteAllText(Path.Combine(folder, "notes.txt"), "bench notes of an earlier run");
        return folder;
    }

    private static string[] Siblings(string folder)
        => Directory.GetFileSystemEntries(Path.GetDirectoryName(folder)!).Select(Path.GetFileName).Where(n => n!.Contains(".partial", StringComparison.Ordinal) || n.Contains(".old-", StringComparison.Ordinal)).ToArray()!;

    [Fact]
    public void NonEmptyOutputFolderWithoutForce_ExitsFiveAndLeavesItsFilesUntouched()
    {
        var outDir = MakeOldResults(clip.NewPath("existing"));
        var before = Snapshot(outDir);

        var r = Cli.RunExpecting(ExitCodes.OutputNotWritable, clip.AnalyzeArgs(outDir));

        Cli.AssertOneLineError(r, "--force");
        var after = Snapshot(outDir);
        Assert.Equal(before.Keys.Order(), after.Keys.Order());
        foreach (var (name, bytes) in before) Assert.Equal(bytes, after[name]);
        Assert.Empty(Siblings(outDir));
    }

    [Fact]
    public void NonEmptyOutputFolderWithForce_IsReplacedByTheNewResults()
    {
        var outDir = MakeOldResults(clip.NewPath("replaced"));

        Cli.RunExpecting(ExitCodes.Success, clip.AnalyzeArgs(outDir, "--force"));

        Assert.False(File.Exists(Path.Combine(outDir, "notes.txt")), "the old folder's files are gone");
        using var doc = JsonDocument.Parse(File.ReadAllText(Path.Combine(outDir, "results.json")));
        Assert.False(doc.RootElement.TryGetProperty("old", out _));
        Assert.Equal(JsonValueKind.Array, doc.RootElement.GetProperty("modes").ValueKind);
        Assert.Empty(Siblings(outDir));
    }

    [Fact]
    public void OutputPathIsAFile_ExitsFive()
    {
        var file = clip.NewPath("a-file.txt");
        File.WriteAllText(file, "not a folder");
        var r = Cli.RunExpecting(ExitCodes.OutputNotWritable, clip.AnalyzeArgs(file));
        Cli.AssertOneLineError(r, "a-file.txt");
        Assert.Equal("not a folder", File.ReadAllText(file));
    }

    [Fact]
    public void UnknownOption_ExitsTwoWithOneLineNamingIt()
    {
        var outDir = clip.NewPath("unknown-option");
        var r = Cli.RunExpecting(ExitCodes.Usage, clip.AnalyzeArgs(outDir, "--tension", "12"));
        Cli.AssertOneLineError(r, "--tension");
        Assert.False(Directory.Exists(outDir));
    }

    [Fact]
    public void MissingLength_ExitsTwoWithOneLineNamingTheOption()
    {
        var outDir = clip.NewPath("no-length");
        var r = Cli.RunExpecting(ExitCodes.Usage, "analyze", clip.Clip, "--capture-fps", "400", "--out", outDir);
        Cli.AssertOneLineError(r, "--length");
        Assert.False(Directory.Exists(outDir));
    }

    /// <summary>Case name, analyze arguments after the clip and --out, text the message must contain.</summary>
    public static TheoryData<string, string[], string> AnalyzeUsageErrors => new()
    {
        { "length without a number", ["--length", "long"], "--length" },
        { "negative length", ["--length", "-3cm"], "--length" },
        { "length in a wrong unit", ["--length", "3 g/m"], "--length" },
        { "option given twice", ["--length", "0.5", "--length", "0.6"], "--length" },
        { "option without its value", ["--length", "0.5", "--max-modes"], "--max-modes" },
        { "max modes out of range", ["--length", "0.5", "--max-modes", "0"], "--max-modes" },
        { "flag with a value", ["--length", "0.5", "--force=yes"], "--force" },
    };

    [Theory]
    [MemberData(nameof(AnalyzeUsageErrors))]
    public void AnalyzeUsageError_ExitsTwoWithOneLine(string name, string[] tail, string fragment)
    {
        var outDir = clip.NewPath("usage-" + name.Replace(' ', '-'));
        var r = Cli.RunExpecting(ExitCodes.Usage, ["analyze", clip.Clip, "--capture-fps", "400", "--out", outDir, .. tail]);
        Cli.AssertOneLineError(r, fragment);
        Assert.False(Directory.Exists(outDir), name);
    }
}
