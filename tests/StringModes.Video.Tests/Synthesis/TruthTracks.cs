using System.Globalization;

namespace StringModes.Video.Tests.Synthesis;

/// <summary>Reads a synthesiser truth-tracks CSV.</summary>
internal sealed record TruthRow(int Frame, double TimeS, int Mark, double RowTimeS, double XMid, double YMid, double XExposure, double YExposure, double UMid, double UExposure, bool Visible)
{
    public static IReadOnlyList<TruthRow> Load(string path)
        => File.ReadLines(path).Skip(1).Select(line =>
        {
            var f = line.Split(',');
            double D(int i) => double.Parse(f[i], CultureInfo.InvariantCulture);
            return new TruthRow(int.Parse(f[0], CultureInfo.InvariantCulture), D(1), int.Parse(f[2], CultureInfo.InvariantCulture), D(3), D(4), D(5), D(6), D(7), D(8), D(9), f[10] == "1");
        }).ToArray();
}
