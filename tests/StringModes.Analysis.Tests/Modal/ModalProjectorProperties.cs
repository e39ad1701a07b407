using CsCheck;
using StringModes.Analysis.Geometry;
using StringModes.Analysis.Modal;
using StringModes.Analysis.Tests.TestData;

namespace StringModes.Analysis.Tests.Modal;

/// <summary>Properties of the modal projection over random mark layouts, weights and mode sums.</summary>
public class ModalProjectorProperties
{
    /// <summary>A random problem: marks on a jittered grid, M ≤ N modes with random amplitudes, random weights.</summary>
    private sealed record Case(double LengthM, double[] PositionsM, double[][] AmplitudesM, double[,] Weight)
    {
        public int Modes => AmplitudesM[0].Length;

        public override string ToString() => FormattableString.Invariant(
            $"L = {LengthM:R} m, marks at [{string.Join(", ", PositionsM.Select(p => p.ToString("R", System.Globalization.CultureInfo.InvariantCulture)))}], {Modes} modes, {AmplitudesM.Length} frames");
    }

    // Marks at s_i = (i + ½ + j_i)·L/N with |j_i| ≤ 0.3: neighbours stay ≥ 0.4 L/N apart, so every M ≤ N keeps the
    // design well conditioned (the projector's automatic limit of 30 is not reached; asserted below).
    private static readonly Gen<Case> Cases =
        from marks in Gen.Int[3, 12]
        from modes in Gen.Int[1, marks]
        from frames in Gen.Int[1, 6]
        from length in Gen.Double[0.2, 2.0]
        from jitter in Gen.Double[-0.3, 0.3].Array[marks]
        from amplitudes in Gen.Double[-5e-3, 5e-3].Array[modes].Array[frames]
        from weights in Gen.Double[0.2, 1.0].Array[frames * marks]
        select new Case(length,
            Enumerable.Range(0, marks).Select(i => (i + 0.5 + jitter[i]) * length / marks).ToArray(),
            amplitudes,
            To2D(weights, frames, marks));

    private static double[,] To2D(double[] values, int rows, int columns)
    {
        var a = new double[rows, columns];
        for (var r = 0; r < rows; r++)
            for (var c = 0; c < columns; c++) a[r, c] = values[r * columns + c];
        return a;
    }

    // Check value: the generating amplitudes. Tolerance from backward-stable Householder QR on a consistent system
    // (Higham, Accuracy and Stability of Numerical Algorithms, 2nd ed., §20.2 [memory]): ‖x̂ − x‖ ≤ c·m·n·u·κ(A)·‖x‖ with
    // u = 2⁻⁵³, κ the weighted design's condition number (reported by the projector) and c = 10 for the rounding
    // of the data themselves (a sum of M terms) and of the square-root weights.
    [Fact]
    public void RandomModeSums_AreRecoveredToRoundingTimesTheConditionNumber()
    {
        Property.ForAll(Cases, 300, 20_251_201, c =>
        {
            var frames = c.AmplitudesM.Length;
            var marks = c.PositionsM.Length;
            var u = new double[frames, marks];
            for (var f = 0; f < frames; f++)
                for (var i = 0; i < marks; i++)
                    for (var j = 0; j < c.Modes; j++)
                        u[f, i] += c.AmplitudesM[f][j] * ModalProjector.ModeShape(j + 1, c.PositionsM[i], c.LengthM);
            var times = Enumerable.Range(0, frames).Select(k => k * 1e-3).ToArray();

            var modal = ModalProjector.Project(new StringCoordinates(c.LengthM, c.PositionsM, times, u, c.Weight), new ModalProjectionOptions { MaxModes = c.Modes });

            Assert.Equal(c.Modes, modal.ModeCount);
            Assert.Equal(frames, modal.ValidFrameCount);
            Assert.InRange(modal.ConditionNumber, 1, 30);
            var tolerance = 10.0 * marks * c.Modes * Math.Pow(2, -53) * modal.ConditionNumber;
            for (var f = 0; f < frames; f++)
            {
                var norm = Math.Sqrt(c.AmplitudesM[f].Sum(a => a * a));
                double error = 0;
                for (var j = 0; j < c.Modes; j++) error += Math.Pow(modal.AmplitudeM[f, j] - c.AmplitudesM[f][j], 2);
                Assert.True(Math.Sqrt(error) <= tolerance * norm + 1e-300,
                    FormattableString.Invariant($"frame {f}: error {Math.Sqrt(error):E3} m > {tolerance:E2} × ‖a‖ = {tolerance * norm:E3} m (κ = {modal.ConditionNumber:F2})"));
            }
        });
    }
}
