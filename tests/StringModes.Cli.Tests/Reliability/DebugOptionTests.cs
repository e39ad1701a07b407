namespace StringModes.Cli.Tests.Reliability;

/// <summary>The one-line rule has one exception: --debug adds the stack trace after the same message.</summary>
public class DebugOptionTests
{
    [Fact]
    public void BadInputWithDebug_ShowsTheSameMessageFollowedByAStackTrace()
    {
        using var temp = new TempFolder();
        string[] args = ["analyze", temp.File("absent.mkv"), "--length", "0.5m", "--out", temp.File("results")];

        var plain = Cli.RunExpecting(ExitCodes.BadInput, args);
        var debug = Cli.RunExpecting(ExitCodes.BadInput, ["--debug", .. args]);

        Cli.AssertOneLineError(plain, "absent.mkv");
        Assert.True(debug.ErrorLines.Length > 1, $"expected a stack trace after the message, got {debug}");
        Assert.Equal(plain.ErrorLines[0], debug.ErrorLines[0]);
        Assert.Contains(debug.ErrorLines.Skip(1), l => l.StartsWith("at StringModes.", StringComparison.Ordinal));
        Assert.False(Directory.Exists(temp.File("results")));
    }
}
