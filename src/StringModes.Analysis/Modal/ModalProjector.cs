using MathNet.Numerics.LinearAlgebra;
using StringModes.Analysis.Geometry;

namespace StringModes.Analysis.Modal;

/// <summary>
/// Projects string profiles onto the pinned-string mode shapes sin(nπs/L), n = 1..M, frame by frame, by weighted
/// linear least squares solved with a QR factorisation of the weighted design matrix √w·Φ (Golub &amp; Van Loan,
/// Matrix Computations, §5.3). For N marks at s_i = iL/(N+1) and M = N the design is the type-I discrete sine
/// transform, orthogonal up to scale. Marks missing in a frame (NaN or weight 0) are left out of that frame's
/// fit; a frame keeps valid status only while the remaining marks still determine all M modes with a condition
/// number below the limit.
/// </summary>
public static class ModalProjector
{
    /// <summary>
    /// Modal coordinates of <paramref name="coordinates"/>. Never throws for bad data: inconsistent shapes, no marks or
    /// no usable frame give a result with no modes (or no valid frames) and a warning saying why.
    /// </summary>
    public static ModalCoordinates Project(StringCoordinates coordinates, ModalProjectionOptions? options = null)
    {
        options ??= new ModalProjectionOptions();
        var warnings = new List<string>();
        var times = coordinates.TimesS ?? [];
        var frames = times.Length;
        var marks = coordinates.PositionsM?.Length ?? 0;

        ModalCoordinates Empty(string why)
        {
            warnings.Add(why);
            return new ModalCoordinates((double[])times.Clone(), new double[frames, 0], new bool[frames], [], 0, 0, warnings);
        }

        if (!(coordinates.LengthM > 0) || !double.IsFinite(coordinates.LengthM))
            return Empty("string length must be a positive finite number; no modal projection was made");
        if (marks == 0) return Empty("no moving marks: modal projection needs at least one mark between the ends");
        if (coordinates.DisplacementM.GetLength(0) != frames || coordinates.DisplacementM.GetLength(1) != marks
            || coordinates.Weight.GetLength(0) != frames || coordinates.Weight.GetLength(1) != marks)
            return Empty("displacement and weight arrays do not match the number of frames and marks; no modal projection was made");
        var positions = coordinates.PositionsM!;
        if (positions.Any(s => !(s > 0 && s < coordinates.LengthM)))
            return Empty("every mark must lie strictly between the ends (0 < s < L); no modal projection was made");

        var usable = new bool[frames, marks];
        var markSeen = new bool[marks];
        for (var f = 0; f < frames; f++)
            for (var i = 0; i < marks; i++)
            {
                var w = coordinates.Weight[f, i];
                var ok = double.IsFinite(coordinates.DisplacementM[f, i]) && double.IsFinite(w) && w > 0;
                usable[f, i] = ok;
                markSeen[i] |= ok;
            }
        var seenPositions = positions.Where((_, i) => markSeen[i]).ToArray();
        if (seenPositions.Length == 0) return Empty("no mark was measured in any frame; no modal projection was made");

        var modeCount = ChooseModeCount(seenPositions, coordinates.LengthM, options, warnings);
        var modeNumbers = Enumerable.Range(1, modeCount).ToArray();
        var amplitude = new double[frames, modeCount];
        var valid = new bool[frames];
        double worstCondition = 0, residualSquares = 0;
        long residualCount = 0;
        int tooFewMarks = 0, illConditioned = 0;

        var shape = new double[marks, modeCount];
        for (var i = 0; i < marks; i++)
            for (var j = 0; j < modeCount; j++) shape[i, j] = ModeShape(modeNumbers[j], positions[i], coordinates.LengthM);
        var solver = new SmallLeastSquares(marks, modeCount);
        var rows = new int[marks];
        var x = new double[modeCount];
        for (var f = 0; f < frames; f++)
        {
            var count = 0;
            for (var i = 0; i < marks; i++) if (usable[f, i]) rows[count++] = i;
            if (count < modeCount) { tooFewMarks++; continue; }

            for (var r = 0; r < count; r++)
            {
                var i = rows[r];
                var sw = Math.Sqrt(coordinates.Weight[f, i]);
                var row = solver.Row(r);
                for (var j = 0; j < modeCount; j++) row[j] = sw * shape[i, j];
                solver.Rhs[r] = sw * coordinates.DisplacementM[f, i];
            }
            var cond = solver.Solve(count, x);
            if (!(cond < options.ConditionLimit)) { illConditioned++; continue; }
            valid[f] = true;
            worstCondition = Math.Max(worstCondition, cond);
            for (var j = 0; j < modeCount; j++) amplitude[f, j] = x[j];
            for (var r = 0; r < count; r++)
            {
                var i = rows[r];
                double model = 0;
                for (var j = 0; j < modeCount; j++) model += x[j] * shape[i, j];
                var residual = coordinates.DisplacementM[f, i] - model;
                residualSquares += residual * residual;
                residualCount++;
            }
        }

        if (tooFewMarks > 0)
            warnings.Add($"{tooFewMarks} of {frames} frames had fewer usable marks than the {modeCount} modes and were left out");
        if (illConditioned > 0)
            warnings.Add($"{illConditioned} of {frames} frames had marks missing in places that leave the modes poorly determined (condition number at or above {options.ConditionLimit:G3}) and were left out");
        var validCount = valid.Count(v => v);
        if (validCount == 0) warnings.Add("no frame had enough usable marks for the modal projection");
        else AddAliasingWarning(amplitude, valid, modeCount, options, warnings);

        var rms = residualCount > 0 ? Math.Sqrt(residualSquares / residualCount) : 0;
        return new ModalCoordinates((double[])times.Clone(), amplitude, valid, modeNumbers, worstCondition, rms, warnings);
    }

    /// <summary>Mode shape sin(nπs/L) of a pinned string.</summary>
    public static double ModeShape(int n, double positionM, double lengthM) => Math.Sin(n * Math.PI * positionM / lengthM);

    /// <summary>2-norm condition number of the unweighted design for the given marks and modes 1..M (+∞ if rank deficient).</summary>
    public static double DesignConditionNumber(IReadOnlyList<double> positionsM, double lengthM, int modeCount)
    {
        var a = Matrix<double>.Build.Dense(positionsM.Count, modeCount, (i, j) => ModeShape(j + 1, positionsM[i], lengthM));
        return Condition(a);
    }

    private static int ChooseModeCount(double[] positions, double lengthM, ModalProjectionOptions options, List<string> warnings)
    {
        var limit = positions.Length;
        if (options.MaxModes > 0)
        {
            if (options.MaxModes > positions.Length)
                warnings.Add($"{options.MaxModes} modes were asked for but only {positions.Length} marks were measured; at most {positions.Length} modes can be resolved");
            limit = Math.Min(limit, options.MaxModes);
        }
        var m = 0;
        while (m < limit && DesignConditionNumber(positions, lengthM, m + 1) < options.ConditionLimit) m++;
        if (m == 0)
        {
            warnings.Add("the marks do not determine even the fundamental mode (a mark sits at an end or the layout is degenerate); using it regardless");
            return 1;
        }
        if (m < limit)
            warnings.Add($"modes were limited to {m}: with mode {m + 1} the mark layout's condition number reaches {options.ConditionLimit:G3} or more");
        return m;
    }

    private static void AddAliasingWarning(double[,] amplitude, bool[] valid, int modeCount, ModalProjectionOptions options, List<string> warnings)
    {
        var energy = new double[modeCount];
        for (var f = 0; f < valid.Length; f++)
        {
            if (!valid[f]) continue;
            for (var j = 0; j < modeCount; j++) energy[j] += amplitude[f, j] * amplitude[f, j];
        }
        var total = energy.Sum();
        if (total <= 0 || modeCount < 2) return;
        var topShare = energy[^1] / total;
        if (topShare > options.AliasingEnergyFraction)
            warnings.Add($"mode {modeCount}, the highest that the marks resolve, holds {100 * topShare:F1} % of the modal energy: higher modes may be folding into the projected ones (aliasing); more marks would resolve them");
    }

    private static double Condition(Matrix<double> a)
    {
        var s = a.Svd(computeVectors: false).S;
        var min = s.Minimum();
        return min > 0 ? s.Maximum() / min : double.PositiveInfinity;
    }
}
