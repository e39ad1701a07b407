namespace StringModes.Cli.Tests;

/// <summary>Each warning the analysis can give is matched to the action a user can take (report's "what to do").</summary>
public class WarningActionTests
{
    // Warning texts as the analysis writes them (Fitting/ModeFitter.cs, StringModel/StringEstimator.cs, ModalAnalysis.cs).
    [Theory]
    [InlineData("mode 1: every 12th frame has 0.35 times the residual variance of the others (9.1 standard errors): the key frames of a compressed video, between which the codec loses small motions; the modes were fitted on the 40 key frames only", "keyframe interval")]
    [InlineData("mode 5 (501.2 Hz) was left out of the string model: the other modes, which agree with the stiff-string law, put it near 498 Hz, 12.0 combined standard uncertainties away", "distortion product")]
    [InlineData("mode 7 is expected near 700 Hz, above half the frame rate (500 Hz): its measured 300 Hz is an alias and it was left out of the string model", "higher frame rate")]
    [InlineData("mode 2: fit residuals are not white near the mode frequency; uncertainties were widened by a factor 1.40", "No action needed")]
    public void Warning_gets_its_action(string warning, string expected)
        => Assert.Contains(expected, ReportMapping.ActionFor(warning));
}
