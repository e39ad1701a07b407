namespace StringModes.Reporting.Colour;

/// <summary>How a colour map spreads data fractions along its path of anchor colours.</summary>
public enum ColourMapKind
{
    /// <summary>
    /// For magnitudes: the path is re-parametrised by Oklab arc length, so equal data steps give equal
    /// perceptual steps (Oklab distance stands in for perceived difference; Ottosson 2020).
    /// </summary>
    Sequential,

    /// <summary>
    /// For signed values: the middle anchor sits at fraction 0.5 and each half is parametrised so that
    /// lightness changes linearly with |fraction − 0.5|, giving the same lightness at ±x.
    /// </summary>
    Diverging,
}

/// <summary>
/// A continuous colour map: a path through Oklab anchor colours, linearly interpolated in Oklab.
/// Anchors should lie inside the sRGB gamut; the rendered colours are clamped to it.
/// </summary>
public sealed class ColourMap
{
    // Odd so that the diverging centre (fraction 0.5) is an exact table entry.
    private const int TableSize = 1025;
    private const int SamplesPerSegment = 256;
    private readonly OklabColour[] _table;
    private readonly SrgbColour[] _srgb;
    private readonly OklabColour[] _renderedLab;

    /// <summary>
    /// Builds a map through <paramref name="anchors"/> from data fraction 0 to 1. A sequential map needs at
    /// least two anchors; a diverging map an odd number ≥ 3 whose lightness rises strictly to the middle
    /// anchor and falls strictly after it.
    /// </summary>
    public ColourMap(string name, IReadOnlyList<OklabColour> anchors, ColourMapKind kind)
    {
        if (anchors.Count < 2)
        {
            throw new ArgumentException("A colour map needs at least two anchor colours.", nameof(anchors));
        }

        Name = name;
        Kind = kind;
        Anchors = anchors.ToArray();
        _table = new OklabColour[TableSize];
        if (kind == ColourMapKind.Sequential)
        {
            FillByArcLength(Densify(Anchors), 0, TableSize - 1);
        }
        else
        {
            if (anchors.Count % 2 == 0 || anchors.Count < 3)
            {
                throw new ArgumentException("A diverging map needs an odd number (≥ 3) of anchors.", nameof(anchors));
            }

            var mid = anchors.Count / 2;
            for (var i = 0; i < anchors.Count - 1; i++)
            {
                var rising = i < mid;
                if (rising ? anchors[i + 1].L <= anchors[i].L : anchors[i + 1].L >= anchors[i].L)
                {
                    throw new ArgumentException("Diverging anchors must brighten strictly to the middle and darken after it.", nameof(anchors));
                }
            }

            var centre = TableSize / 2;
            FillByLightness(Densify(Anchors.Take(mid + 1).ToArray()), 0, centre);
            FillByLightness(Densify(Anchors.Skip(mid).ToArray()), centre, TableSize - 1);
        }

        _srgb = _table.Select(c => Oklab.ToSrgb(c).Clamped()).ToArray();
        _renderedLab = _srgb.Select(Oklab.FromSrgb).ToArray();
    }

    /// <summary>Name shown in legends and documentation.</summary>
    public string Name { get; }

    /// <summary>Sequential or diverging.</summary>
    public ColourMapKind Kind { get; }

    /// <summary>The anchor colours the map passes through.</summary>
    public IReadOnlyList<OklabColour> Anchors { get; }

    /// <summary>Oklab colour (before gamut clamping) at data fraction <paramref name="fraction"/>, clamped to 0..1; NaN maps to 0.</summary>
    public OklabColour SampleOklab(double fraction) => _table[Index(fraction)];

    /// <summary>sRGB colour at data fraction <paramref name="fraction"/>, clamped to 0..1; NaN maps to 0.</summary>
    public SrgbColour Sample(double fraction) => _srgb[Index(fraction)];

    /// <summary>
    /// Inverse lookup: the data fraction whose rendered colour is nearest in Oklab to <paramref name="colour"/>,
    /// and that distance. Used to read values back from rendered figures.
    /// </summary>
    public (double Fraction, double Distance) Invert(SrgbColour colour)
    {
        var lab = Oklab.FromSrgb(colour);
        var best = 0;
        var bestDistance = double.MaxValue;
        for (var k = 0; k < TableSize; k++)
        {
            var d = _renderedLab[k].DistanceTo(lab);
            if (d < bestDistance)
            {
                bestDistance = d;
                best = k;
            }
        }

        return (best / (double)(TableSize - 1), bestDistance);
    }

    private static int Index(double fraction) =>
        double.IsNaN(fraction) ? 0 : (int)Math.Round(Math.Clamp(fraction, 0, 1) * (TableSize - 1));

    private static OklabColour Lerp(OklabColour p, OklabColour q, double f) =>
        new(p.L + (q.L - p.L) * f, p.A + (q.A - p.A) * f, p.B + (q.B - p.B) * f);

    private static OklabColour[] Densify(IReadOnlyList<OklabColour> anchors)
    {
        var dense = new List<OklabColour>();
        for (var i = 0; i < anchors.Count - 1; i++)
        {
            for (var k = 0; k < SamplesPerSegment; k++)
            {
                dense.Add(Lerp(anchors[i], anchors[i + 1], k / (double)SamplesPerSegment));
            }
        }

        dense.Add(anchors[^1]);
        return dense.ToArray();
    }

    private void FillByArcLength(OklabColour[] dense, int first, int last)
    {
        var position = new double[dense.Length];
        for (var i = 1; i < dense.Length; i++)
        {
            position[i] = position[i - 1] + dense[i].DistanceTo(dense[i - 1]);
        }

        FillByMonotonePosition(dense, position, first, last);
    }

    private void FillByLightness(OklabColour[] dense, int first, int last)
    {
        // Lightness is strictly monotone along each half, so its distance from the start is a valid position.
        var position = dense.Select(c => Math.Abs(c.L - dense[0].L)).ToArray();
        FillByMonotonePosition(dense, position, first, last);
    }

    private void FillByMonotonePosition(OklabColour[] dense, double[] position, int first, int last)
    {
        var total = position[^1];
        var j = 0;
        for (var k = first; k <= last; k++)
        {
            var target = total * (k - first) / (last - first);
            while (j < dense.Length - 2 && position[j + 1] < target)
            {
                j++;
            }

            var span = position[j + 1] - position[j];
            var f = span > 0 ? Math.Clamp((target - position[j]) / span, 0, 1) : 0;
            _table[k] = Lerp(dense[j], dense[j + 1], f);
        }
    }
}
