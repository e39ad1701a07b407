using OpenCvSharp;

namespace StringModes.Video.Frames;

/// <summary>Converts a decoded frame of any channel count into a preallocated grey plane.</summary>
internal static class GreyConverter
{
    public static void ToGrey(Mat decoded, Mat greyFull)
    {
        switch (decoded.Channels())
        {
            case 1:
                decoded.CopyTo(greyFull);
                break;
            case 3:
                Cv2.CvtColor(decoded, greyFull, ColorConversionCodes.BGR2GRAY);
                break;
            case 4:
                Cv2.CvtColor(decoded, greyFull, ColorConversionCodes.BGRA2GRAY);
                break;
            default:
                throw new InvalidOperationException($"unsupported channel count {decoded.Channels()}");
        }
    }

    public static RegionOfInterest Resolve(RegionOfInterest? asked, int width, int height, string path)
    {
        if (asked is null)
        {
            return new RegionOfInterest(0, 0, width, height);
        }

        if (asked.X < 0 || asked.Y < 0 || asked.Width < 1 || asked.Height < 1
            || asked.X + asked.Width > width || asked.Y + asked.Height > height)
        {
            throw new InputException(path,
                $"{path}: region {asked.X},{asked.Y},{asked.Width}x{asked.Height} is outside the {width}x{height} frame; give a region inside the frame");
        }

        return asked;
    }
}
