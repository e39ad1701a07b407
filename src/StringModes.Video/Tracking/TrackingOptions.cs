using StringModes.Video.Frames;
using StringModes.Video.Marks;

namespace StringModes.Video.Tracking;

/// <summary>Everything <see cref="ClipTracker"/> needs besides the clip.</summary>
public sealed record TrackingOptions
{
    /// <summary>Frame source settings (capture rate, sequence rate, region of interest); default: container timestamps, whole frame.</summary>
    public FrameSourceOptions Source { get; init; } = new();

    /// <summary>Automatic mark finding settings.</summary>
    public MarkFinderOptions Marks { get; init; } = new();

    /// <summary>Tracker settings.</summary>
    public TrackerOptions Tracker { get; init; } = new();

    /// <summary>
    /// All mark positions on the reference frame in full-frame pixels, ordered along the string, ends first and last
    /// (for example from a rig file); default null (find them automatically).
    /// </summary>
    public IReadOnlyList<(double XPx, double YPx)>? MarkPositionsPx { get; init; }

    /// <summary>The two end positions in full-frame pixels; default null (the outermost found marks are the ends).</summary>
    public ((double XPx, double YPx) End0, (double XPx, double YPx) End1)? EndsPx { get; init; }

    /// <summary>Frame on which marks are found; ≥ 0; default 0.</summary>
    public int ReferenceFrame { get; init; }

    /// <summary>Stop after this many frames; ≥ 1; default null (whole clip).</summary>
    public int? MaxFrames { get; init; }
}
