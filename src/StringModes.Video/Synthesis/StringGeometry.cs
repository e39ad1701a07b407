namespace StringModes.Video.Synthesis;

/// <summary>
/// Where the string sits in the image. The axis runs from end 0 to end 1; the positive transverse direction is
/// the axis turned 90° counter-clockwise as seen on screen (for a string drawn left to right: up).
/// </summary>
internal sealed class StringGeometry
{
    public StringGeometry(Scene scene)
    {
        Origin = scene.End0;
        var dx = scene.End1.X - scene.End0.X;
        var dy = scene.End1.Y - scene.End0.Y;
        SpanPx = Math.Sqrt(dx * dx + dy * dy);
        AxisX = dx / SpanPx;
        AxisY = dy / SpanPx;
        // Image y points down, so counter-clockwise on screen is (ay, −ax).
        NormalX = AxisY;
        NormalY = -AxisX;
        LengthM = scene.Motion.LengthM;
        PixelsPerMetre = SpanPx / LengthM;
    }

    public PixelPoint Origin { get; }
    public double SpanPx { get; }
    public double AxisX { get; }
    public double AxisY { get; }
    public double NormalX { get; }
    public double NormalY { get; }
    public double LengthM { get; }
    public double PixelsPerMetre { get; }

    /// <summary>Rest position of a point at fraction <paramref name="fraction"/> of the length.</summary>
    public PixelPoint RestPosition(double fraction)
        => new(Origin.X + fraction * SpanPx * AxisX, Origin.Y + fraction * SpanPx * AxisY);

    /// <summary>Image position of the string point at fraction <paramref name="fraction"/> displaced by <paramref name="displacementM"/>.</summary>
    public PixelPoint Position(double fraction, double displacementM)
    {
        var r = RestPosition(fraction);
        var v = displacementM * PixelsPerMetre;
        return new PixelPoint(r.X + v * NormalX, r.Y + v * NormalY);
    }
}
