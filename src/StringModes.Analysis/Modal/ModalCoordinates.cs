namespace StringModes.Analysis.Modal;

/// <summary>
/// Modal coordinates a_n(t) of a string: the amplitudes of sin(nπs/L) that best explain each frame's profile.
/// Arrays are indexed [frame, mode]; mode index j holds mode number <see cref="ModeNumbers"/>[j].
/// </summary>
/// <param name="TimesS">Time of each frame in seconds, as in the input string coordinates.</param>
/// <param name="AmplitudeM">Modal amplitude a_n(t) in metres; 0 in invalid frames (never NaN).</param>
/// <param name="ValidFrame">True where the frame had enough usable marks to determine every mode.</param>
/// <param name="ModeNumbers">Mode numbers n, ascending from 1.</param>
/// <param name="ConditionNumber">Largest 2-norm condition number of the weighted design matrix over the valid frames (1 = orthogonal; 0 when no frame is valid).</param>
/// <param name="ResidualRmsM">Root-mean-square spatial residual u − Σ a_n·sin(nπs/L) over the used samples, metres (0 when as many modes as marks).</param>
/// <param name="Warnings">Plain-language warnings (aliasing, frames dropped, modes limited).</param>
public sealed record ModalCoordinates(
    double[] TimesS,
    double[,] AmplitudeM,
    bool[] ValidFrame,
    int[] ModeNumbers,
    double ConditionNumber,
    double ResidualRmsM,
    IReadOnlyList<string> Warnings)
{
    /// <summary>Number of frames.</summary>
    public int FrameCount => TimesS.Length;

    /// <summary>Number of modes.</summary>
    public int ModeCount => ModeNumbers.Length;

    /// <summary>Number of valid frames.</summary>
    public int ValidFrameCount => ValidFrame.Count(v => v);

    /// <summary>Times and amplitudes of one mode (index into <see cref="ModeNumbers"/>) over the valid frames only.</summary>
    public (double[] TimesS, double[] AmplitudeM) ValidSeries(int modeIndex)
    {
        var times = new List<double>(FrameCount);
        var values = new List<double>(FrameCount);
        for (var f = 0; f < FrameCount; f++)
        {
            if (!ValidFrame[f]) continue;
            times.Add(TimesS[f]);
            values.Add(AmplitudeM[f, modeIndex]);
        }
        return (times.ToArray(), values.ToArray());
    }
}
