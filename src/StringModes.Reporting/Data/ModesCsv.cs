using System.Globalization;
using System.Text;
using StringModes.Analysis.Modal;

namespace StringModes.Reporting.Data;

/// <summary>Writes modes.csv: <c>time_s,a1_m,a2_m,…</c>, one row per valid frame of the modal coordinates.</summary>
public static class ModesCsv
{
    /// <summary>The CSV text.</summary>
    public static string Format(ModalCoordinates modal)
    {
        var sb = new StringBuilder("time_s");
        foreach (var n in modal.ModeNumbers) sb.Append(CultureInfo.InvariantCulture, $",a{n}_m");
        sb.Append('\n');
        for (var k = 0; k < modal.FrameCount; k++)
        {
            if (!modal.ValidFrame[k]) continue;
            sb.Append(modal.TimesS[k].ToString("R", CultureInfo.InvariantCulture));
            for (var j = 0; j < modal.ModeCount; j++)
                sb.Append(',').Append(modal.AmplitudeM[k, j].ToString("R", CultureInfo.InvariantCulture));
            sb.Append('\n');
        }
        return sb.ToString();
    }
}
