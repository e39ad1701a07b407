using System.Runtime.InteropServices;
using OpenCvSharp;

namespace StringModes.Video.Marks;

/// <summary>Copies single-channel Mats into managed arrays (row-major) for per-pixel work without per-pixel interop.</summary>
internal static class Floats
{
    public static float[] Of(Mat m)
    {
        int rows = m.Rows, cols = m.Cols;
        var data = new float[rows * cols];
        for (int y = 0; y < rows; y++)
        {
            Marshal.Copy(m.Ptr(y), data, y * cols, cols);
        }

        return data;
    }

    public static int[] Ints(Mat m)
    {
        int rows = m.Rows, cols = m.Cols;
        var data = new int[rows * cols];
        for (int y = 0; y < rows; y++)
        {
            Marshal.Copy(m.Ptr(y), data, y * cols, cols);
        }

        return data;
    }
}
