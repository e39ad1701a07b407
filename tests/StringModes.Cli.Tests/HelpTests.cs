using System.Text.RegularExpressions;

namespace StringModes.Cli.Tests;

/// <summary>--version, --help and each command's --help; the main help is checked against an approved copy.</summary>
public partial class HelpTests
{
    [Fact]
    public void VersionOption_PrintsToolNameAndVersion()
    {
        var r = Cli.RunExpecting(ExitCodes.Success, "--version");
        Assert.Matches(VersionLine(), r.Out);
        Assert.Equal($"stringmodes {App.Version}\n", r.Out.ReplaceLineEndings("\n"));
        Assert.Equal("", r.Error);
    }

    [Theory]
    [InlineData("--help")]
    [InlineData("-h")]
    [InlineData("help")]
    public void HelpOption_ExitsZeroAndPrintsTheMainHelp(string option)
    {
        var r = Cli.RunExpecting(ExitCodes.Success, option);
        Assert.StartsWith($"stringmodes {App.Version} - ", r.Out, StringComparison.Ordinal);
        Assert.Equal("", r.Error);
    }

    [Fact]
    public void NoArguments_PrintsTheMainHelpAndExitsTwo()
    {
        var r = Cli.RunExpecting(ExitCodes.Usage);
        Assert.Contains("Usage:", r.Out, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("analyze")]
    [InlineData("track")]
    [InlineData("synth")]
    public void CommandHelp_ExitsZeroAndStartsWithItsUsageLine(string command)
    {
        var r = Cli.RunExpecting(ExitCodes.Success, command, "--help");
        Assert.StartsWith($"stringmodes {command} ", r.Out, StringComparison.Ordinal);
        Assert.Contains("Examples:", r.Out, StringComparison.Ordinal);
        Assert.Contains("Exit codes:", r.Out, StringComparison.Ordinal);
    }

    [Fact]
    public void UnknownCommand_ExitsTwoWithOneLine()
    {
        var r = Cli.RunExpecting(ExitCodes.Usage, "fit", "clip.mp4");
        Cli.AssertOneLineError(r, "'fit'");
    }

    [Fact]
    public void AnalyzeHelp_DocumentsEveryOptionTheCommandAccepts()
    {
        var help = Cli.RunExpecting(ExitCodes.Success, "analyze", "--help").Out;
        foreach (var option in AnalyzeCommand.ValueOptions.Concat(AnalyzeCommand.Flags))
            Assert.Matches(new Regex($"\\n +--{Regex.Escape(option)}\\b"), help);
    }

    [Fact]
    public void TrackHelp_DocumentsEveryOptionTheCommandAccepts()
    {
        var help = Cli.RunExpecting(ExitCodes.Success, "track", "--help").Out;
        foreach (var option in TrackCommand.ValueOptions.Concat(TrackCommand.Flags))
            Assert.Matches(new Regex($"\\n +--{Regex.Escape(option)}\\b"), help);
    }

    // Snapshot of what users read first. The version is replaced by VERSION so that a release does not break it.
    // To approve a change on purpose, copy the printed text into Approved/help.txt.
    [Fact]
    public void MainHelp_MatchesTheApprovedText()
    {
        var approved = File.ReadAllText(Path.Combine(Cli.RepoRoot, "tests", "StringModes.Cli.Tests", "Approved", "help.txt")).ReplaceLineEndings("\n");
        var actual = Cli.RunExpecting(ExitCodes.Success, "--help").Out.ReplaceLineEndings("\n")
            .Replace($"stringmodes {App.Version} ", "stringmodes VERSION ", StringComparison.Ordinal);
        Assert.Equal(approved, actual);
    }

    [GeneratedRegex(@"^stringmodes [0-9]+\.[0-9]+\.[0-9]+(-[0-9A-Za-z.-]+)?\r?\n$")]
    private static partial Regex VersionLine();
}
