using MathNet.Numerics.Distributions;
using StringModes.Analysis.Modal;

namespace StringModes.Analysis.Fitting;

/// <summary>A periodic frame class whose residual error is markedly smaller than the rest: the key frames of a video codec.</summary>
/// <param name="Period">Period in frames.</param>
/// <param name="Phase">Frame index (in the modal coordinates) modulo <see cref="Period"/> of the quiet class.</param>
/// <param name="Score">Standardised difference of the class's mean normalised residual energy from the overall mean (negative).</param>
/// <param name="VarianceRatio">Residual variance in the quiet class divided by that in the other frames.</param>
/// <param name="IsKey">Per modal-coordinate frame: true for a valid frame of the quiet class.</param>
/// <param name="Count">Number of key frames.</param>
internal sealed record KeyFrames(int Period, int Phase, double Score, double VarianceRatio, bool[] IsKey, int Count);

/// <summary>
/// Detects the group-of-pictures structure of a predictive video codec in the fit residuals. Codecs such as MPEG-4
/// Part 2 and H.264 (ISO/IEC 14496-2 and -10) code a key frame on its own (intra) every G frames and predict the
/// frames between from their neighbours (inter); the prediction and its coarsely quantised correction lose small
/// motions, so on the inter frames a mark's measured displacement falls short by an amount that grows as the
/// vibration decays. That error is smooth in time and nearly proportional to a change of decay rate, so a fit to all
/// frames absorbs it into σ (and its phase lag into f) and no residual-based uncertainty can see it; the key frames
/// do not carry it. Its signature in the residuals is a variance that is periodic in the frame index, with one phase
/// markedly quieter.
/// <para>
/// Test: e_k = mean over the fitted modes of r²_jk / s²_j (each mode's residual normalised by its own mean square)
/// is averaged over every class k ≡ φ (mod P), P = 2 … P_max, and compared with its overall mean, standardised by the
/// sample variance of e_k: z = (ē_φ − ē)/√(var(e)/c·(1 − c/n)) for a class of c frames. The most negative z is
/// accepted when it passes a Bonferroni bound (Bonferroni 1936; e.g. Miller, Simultaneous Statistical Inference,
/// 1981, §1.2) for a family-wise false-alarm probability of 10⁻³ over all Σ P classes tried, so residuals of constant
/// variance (white or coloured) almost never trigger it. Harmonics of the true period (2G, 3G) split the key class and
/// sub-multiples mix it with inter frames, so the most negative z falls on G itself.
/// </para>
/// <para>
/// Tracking error that depends on the motion (blur grows with speed, centroid bias with position) repeats with the
/// vibration, whose square has period 1/(2f). When P frames span a whole number of those periods, a frame class
/// samples the same motion phase all through the record and its error differs for that reason alone (e.g. 40 Hz
/// filmed at 400 frames/s and P = 5). Periods for which, for any fitted mode, the class's motion phase
/// 2·f·P·Δt drifts by less than one cycle over the record (|2fPΔt − round(2fPΔt)|·n/P &lt; 1) are therefore not tried.
/// </para>
/// </summary>
internal static class KeyFrameStructure
{
    /// <summary>Family-wise false-alarm probability of the detection over all periods and phases tried.</summary>
    public const double FalseAlarmProbability = 1e-3;

    /// <summary>Each class must hold at least this many frames for its mean to be tested.</summary>
    public const int MinimumClassSize = 30;

    /// <summary>Longest period tried, frames.</summary>
    public const int MaximumPeriod = 120;

    public static KeyFrames? Detect(ModalCoordinates modal, IReadOnlyList<(int ModeIndex, SinusoidFit Fit)> fits)
    {
        if (fits.Count == 0) return null;
        var frames = Enumerable.Range(0, modal.FrameCount).Where(k => modal.ValidFrame[k]).ToArray();
        var n = frames.Length;
        var maxPeriod = Math.Min(MaximumPeriod, n / MinimumClassSize);
        if (maxPeriod < 2) return null;

        var energy = new double[n];
        var squares = new double[n];
        foreach (var (j, fit) in fits)
        {
            double sum = 0;
            for (var i = 0; i < n; i++)
            {
                var t = modal.TimesS[frames[i]];
                var r = modal.AmplitudeM[frames[i], j] - fit.ValueAt(t);
                squares[i] = r * r;
                sum += r * r;
            }
            if (!(sum > 0) || !double.IsFinite(sum)) return null;
            var meanSquare = sum / n;
            for (var i = 0; i < n; i++) energy[i] += squares[i] / meanSquare / fits.Count;
        }
        var mean = energy.Average();
        var variance = energy.Sum(v => (v - mean) * (v - mean)) / (n - 1);
        if (!(variance > 0)) return null;

        var span = modal.TimesS[frames[^1]] - modal.TimesS[frames[0]];
        var dt = span / Math.Max(frames[^1] - frames[0], 1);
        bool PhaseLocked(int p) => fits.Any(f =>
        {
            var cycles = 2 * f.Fit.FrequencyHz * p * dt;
            return Math.Abs(cycles - Math.Round(cycles)) * n / p < 1;
        });
        var periods = Enumerable.Range(2, maxPeriod - 1).Where(p => !PhaseLocked(p)).ToArray();
        var classes = periods.Sum();
        if (classes == 0) return null;
        var critical = Normal.InvCDF(0, 1, FalseAlarmProbability / classes);

        (int Period, int Phase, double Z) best = (0, 0, 0);
        foreach (var p in periods)
        {
            var sums = new double[p];
            var counts = new int[p];
            for (var i = 0; i < n; i++) { sums[frames[i] % p] += energy[i]; counts[frames[i] % p]++; }
            for (var phase = 0; phase < p; phase++)
            {
                var c = counts[phase];
                if (c < MinimumClassSize || c >= n) continue;
                var z = (sums[phase] / c - mean) / Math.Sqrt(variance / c * (1 - (double)c / n));
                if (z < best.Z) best = (p, phase, z);
            }
        }
        if (best.Period == 0 || !(best.Z < critical)) return null;

        var isKey = new bool[modal.FrameCount];
        double keyEnergy = 0, otherEnergy = 0;
        int keys = 0;
        for (var i = 0; i < n; i++)
        {
            if (frames[i] % best.Period == best.Phase) { isKey[frames[i]] = true; keyEnergy += energy[i]; keys++; }
            else otherEnergy += energy[i];
        }
        var ratio = keyEnergy / keys / (otherEnergy / (n - keys));
        return new KeyFrames(best.Period, best.Phase, best.Z, ratio, isKey, keys);
    }
}
