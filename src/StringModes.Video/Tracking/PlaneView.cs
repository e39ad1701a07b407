using OpenCvSharp;

namespace StringModes.Video.Tracking;

/// <summary>Read-only view of a grey plane (8- or 16-bit) by raw pointer; a struct so per-frame use allocates nothing.</summary>
internal readonly unsafe struct PlaneView
{
    private readonly byte* data;
    private readonly long stride;
    private readonly bool sixteen;

    public PlaneView(Mat grey)
    {
        data = (byte*)grey.Data;
        stride = grey.Step();
        sixteen = grey.Depth() == MatType.CV_16U;
        Width = grey.Cols;
        Height = grey.Rows;
        // Samples are handled on the 8-bit scale so thresholds and contrasts mean the same for both depths.
        Scale = sixteen ? 1 / 256f : 1f;
    }

    public int Width { get; }
    public int Height { get; }
    public float Scale { get; }

    public float this[int x, int y] => sixteen
        ? ((ushort*)(data + y * stride))[x] * Scale
        : data[y * stride + x];
}
