using OpenCvSharp;

namespace StringModes.Video.Frames;

/// <summary>Reads pixels of an 8- or 16-bit, 1- or 3-channel Mat as B, G, R in 8-bit digital numbers (16-bit values / 257).</summary>
internal readonly unsafe struct PixelAccess
{
    private readonly byte* _data;
    private readonly long _step;
    private readonly int _channels;
    private readonly bool _sixteen;

    public PixelAccess(Mat m)
    {
        _data = (byte*)m.DataPointer;
        _step = m.Step();
        _channels = m.Channels();
        _sixteen = m.Depth() == MatType.CV_16U;
        if (m.Depth() != MatType.CV_8U && !_sixteen)
            throw new ArgumentException("frames must be 8- or 16-bit");
        if (_channels is not (1 or 3 or 4))
            throw new ArgumentException("frames must have 1, 3 or 4 channels");
        Width = m.Cols;
        Height = m.Rows;
    }

    public int Width { get; }
    public int Height { get; }

    /// <summary>Weighted sum w·(B, G, R) of the pixel at (x, y); for one-channel frames the grey value times (w0 + w1 + w2).</summary>
    public double Project(int x, int y, double wb, double wg, double wr)
    {
        if (_sixteen)
        {
            var p = (ushort*)(_data + y * _step) + x * _channels;
            const double s = 1.0 / 257.0;
            return _channels == 1 ? p[0] * s * (wb + wg + wr) : (wb * p[0] + wg * p[1] + wr * p[2]) * s;
        }
        var q = _data + y * _step + x * _channels;
        return _channels == 1 ? q[0] * (wb + wg + wr) : wb * q[0] + wg * q[1] + wr * q[2];
    }

    /// <summary>B, G, R of the pixel at (x, y) in 8-bit digital numbers.</summary>
    public (double B, double G, double R) Colour(int x, int y)
    {
        if (_sixteen)
        {
            var p = (ushort*)(_data + y * _step) + x * _channels;
            return _channels == 1 ? (p[0] / 257.0, p[0] / 257.0, p[0] / 257.0) : (p[0] / 257.0, p[1] / 257.0, p[2] / 257.0);
        }
        var q = _data + y * _step + x * _channels;
        return _channels == 1 ? (q[0], q[0], q[0]) : (q[0], q[1], q[2]);
    }
}
