using StringModes.Analysis.Geometry;
using StringModes.Video.Frames;

namespace StringModes.Video.Tracking;

/// <summary>Outcome of tracking one clip.</summary>
/// <param name="Tracks">Per-frame mark positions in full-frame pixels.</param>
/// <param name="Window">Frames worth analysing.</param>
/// <param name="Timing">What the timestamps say (rate, variable rate, dropped frames).</param>
/// <param name="Warnings">Things the user should know, one line each.</param>
/// <param name="ReferencePng">The reference frame's tracked region as an 8-bit grey PNG, for overlays.</param>
/// <param name="Region">Where <see cref="ReferencePng"/> sits in the full frame.</param>
/// <param name="FrameWidth">Full frame width, px.</param>
/// <param name="FrameHeight">Full frame height, px (the rolling-shutter row count).</param>
public sealed record TrackingResult(
    Tracks Tracks,
    AnalysisWindow Window,
    FrameTimingReport Timing,
    IReadOnlyList<string> Warnings,
    byte[] ReferencePng,
    RegionOfInterest Region,
    int FrameWidth,
    int FrameHeight);
