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
        catch (InputFileException e) when (rig.RigPath is { } rigPath && rig.Rig.MarksPx is not null && !e.Message.StartsWith(clip, StringComparison.Ordinal))
        {
            // The tracker's messages about the clip begin with its path; the others concern the mark positions,
            // which came from the rig file: name it.
            throw new CliException(ExitCodes.BadInput, $"{rigPath}: {e.Message}");
        }
        catch (InputFileException e)
        {
            throw new CliException(ExitCodes.BadInput, e.Message);
        }
        catch (MarksNotFoundException e)
        {
            // The picture of what was found is the useful output of this failure: it is the only file written, and
            // only into a new or empty folder — results of an earlier run are never replaced by a failure.
            if (output.TargetHoldsFiles)
                throw new CliException(ExitCodes.AnalysisImpossible, $"{e.Message} (give a new --out to get marks-found.png, the picture of what was found; {app.OutDir} was left as it was)");
            File.WriteAllBytes(output.File("marks-found.png"), e.DiagnosticPng);
            output.Commit();
            throw new CliException(ExitCodes.AnalysisImpossible, $"{e.Message} (see {Path.Combine(app.OutDir ?? "", "marks-found.png")})");
        }
    }
}
