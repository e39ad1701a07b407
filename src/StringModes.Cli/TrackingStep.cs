using StringModes.Video.Files;
using StringModes.Video.Marks;
using StringModes.Video.Tracking;

namespace StringModes.Cli;

/// <summary>The tracking stage shared by <c>track</c> and <c>analyze</c>: one code path, one set of error mappings.</summary>
internal static class TrackingStep
{
    public static TrackingResult Run(App app, string clip, RigSettings rig, OutputFolder output, CancellationToken cancel)
    {
        try
        {
            return ClipTracker.Track(clip, new TrackingOptions { CaptureFps = rig.CaptureFps, MarkPositions = rig.Rig.MarksPx },
                new ProgressBar(app, "tracking", "%", 100), cancel);
        }
        catch (InputFileException e)
        {
            throw new CliException(ExitCodes.BadInput, e.Message);
        }
        catch (MarksNotFoundException e)
        {
            // The picture of what was found is the useful output of this failure: it is the only file written.
            File.WriteAllBytes(output.File("marks-found.png"), e.DiagnosticPng);
            output.Commit();
            throw new CliException(ExitCodes.AnalysisImpossible, $"{e.Message} (see {Path.Combine(app.OutDir ?? "", "marks-found.png")})");
        }
    }
}
