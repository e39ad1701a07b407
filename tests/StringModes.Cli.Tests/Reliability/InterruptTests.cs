using System.Diagnostics;

namespace StringModes.Cli.Tests.Reliability;

/// <summary>
/// A long clip for interrupt tests: a 320×120 scene whose modes do not decay and whose 0.5 s hold whole periods of
/// both (40 Hz × 0.5 s = 20, 80 Hz × 0.5 s = 40), so its 200 frames repeat without a seam; a folder of 1600 links
/// to them is a 4 s clip at 400 frames/s that takes several seconds to analyse.
/// </summary>
public sealed class LongClipFixture : IDisposable
{
    private readonly TempFolder _temp = new();

    public LongClipFixture()
    {
        var scene = Scenes.Small.Replace("\"decay_rate_per_s\": 1.5", "\"decay_rate_per_s\": 0", StringComparison.Ordinal)
            .Replace("\"decay_rate_per_s\": 3.0", "\"decay_rate_per_s\": 0", StringComparison.Ordinal);
        File.WriteAllText(_temp.File("loop.json"), scene);
        var synth = Cli.Run("synth", _temp.File("loop.json"), "--out", _temp.File("loop"), "--seed", "9");
        if (synth.ExitCode != 0)
        {
            _temp.Dispose();
            throw new InvalidOperationException("synth failed: " + synth);
        }
        var frames = Directory.GetFiles(_temp.File("loop"), "*.png").Order(StringComparer.Ordinal).ToArray();
        Directory.CreateDirectory(_temp.File("long"));
        for (var k = 0; k < FrameCount; k++)
            File.CreateSymbolicLink(_temp.File($"long/frame_{k:D6}.png"), frames[k % frames.Length]);
    }

    public const int FrameCount = 1600;

    /// <summary>The folder the commands run in; it holds the clip folder "long".</summary>
    public string Root => _temp.Path;

    public void Dispose() => _temp.Dispose();
}

/// <summary>
/// SIGINT, SIGTERM and SIGHUP during a long analysis, sent to the real process: it exits promptly with 130, says so in one
/// line, leaves no output, no staging folder and an existing output untouched; the same command then succeeds.
/// </summary>
public class InterruptTests(LongClipFixture clip) : IClassFixture<LongClipFixture>
{
    private const int SigHup = 1, SigInt = 2, SigTerm = 15;

    // The command stops at its next frame; a stage that does not check is cut short by the 1.5 s watchdog
    // (Interruption.Grace). 2 s leaves 0.5 s for the runtime to shut down on a loaded machine.
    private static readonly TimeSpan Prompt = TimeSpan.FromSeconds(2);

    private static string[] Analyze(string outDir, params string[] extra) =>
        ["analyze", "long", "--capture-fps", "400", "--length", "0.5m", "--out", outDir, .. extra];

    /// <summary>Starts the command, waits until its staging folder exists and a little longer, signals it; returns the run and the time from signal to exit.</summary>
    private (ProcessResult Run, TimeSpan SignalToExit) Interrupt(string outDir, int[] signals, params string[] extra)
    {
        var signalToExit = TimeSpan.MaxValue;
        var staging = $".{outDir}.partial-";
        var r = CliProcess.Start([CliProcess.Executable, .. Analyze(outDir, extra)], clip.Root, TimeSpan.FromSeconds(60), p =>
        {
            var wait = Stopwatch.StartNew();
            while (!Directory.GetDirectories(clip.Root).Any(d => Path.GetFileName(d).StartsWith(staging, StringComparison.Ordinal)))
            {
                if (p.HasExited || wait.Elapsed > TimeSpan.FromSeconds(30)) return;
                Thread.Sleep(10);
            }
            Thread.Sleep(400); // into the tracking of the 1600 frames (seconds in all)
            var clock = Stopwatch.StartNew();
            foreach (var s in signals) CliProcess.Signal(p, s);
            p.WaitForExit(TimeSpan.FromSeconds(30));
            signalToExit = clock.Elapsed;
        });
        return (r, signalToExit);
    }

    /// <summary>Prompt exit 130 with its one line, and no hidden staging or temporary entry left beside the output.</summary>
    private void AssertInterruptedCleanly(ProcessResult r, TimeSpan signalToExit)
    {
        Assert.True(signalToExit < Prompt, $"exit {signalToExit.TotalSeconds:F2} s after the signal (limit {Prompt.TotalSeconds} s); {r}");
        Assert.True(r.ExitCode == ExitCodes.Interrupted, $"expected exit 130, got {r}");
        Assert.Equal(["stringmodes: interrupted; no partial outputs were kept"], r.ErrorLines);
        var hidden = Directory.GetFileSystemEntries(clip.Root).Select(Path.GetFileName).Where(n => n!.StartsWith('.')).ToArray();
        Assert.True(hidden.Length == 0, $"left behind: {string.Join(", ", hidden)}");
    }

    [Fact]
    public void SigIntDuringTracking_ExitsPromptlyWith130AndLeavesNothing_ThenTheRerunSucceeds()
    {
        var (r, signalToExit) = Interrupt("results-int", [SigInt]);
        AssertInterruptedCleanly(r, signalToExit);
        Assert.False(Directory.Exists(Path.Combine(clip.Root, "results-int")));

        var again = CliProcess.Run(clip.Root, Analyze("results-int"), TimeSpan.FromSeconds(120));
        Assert.True(again.ExitCode == ExitCodes.Success, again.ToString());
        foreach (var name in new[] { "results.json", "modes.csv", "tracks.csv", "report.html" })
            Assert.True(File.Exists(Path.Combine(clip.Root, "results-int", name)), $"{name} missing after the rerun");
        Assert.Equal(LongClipFixture.FrameCount, FrameCountOf(Path.Combine(clip.Root, "results-int", "tracks.csv")));
        Directory.Delete(Path.Combine(clip.Root, "results-int"), true);
    }

    [Fact]
    public void SigTermOverAnExistingOutput_ExitsPromptlyWith130AndLeavesItUntouched()
    {
        var existing = Directory.CreateDirectory(Path.Combine(clip.Root, "results-term")).FullName;
        File.WriteAllText(Path.Combine(existing, "earlier.txt"), "results of an earlier run");

        var (r, signalToExit) = Interrupt("results-term", [SigTerm], "--force");

        AssertInterruptedCleanly(r, signalToExit);
        Assert.Equal(["earlier.txt"], Directory.GetFileSystemEntries(existing).Select(Path.GetFileName));
        Assert.Equal("results of an earlier run", File.ReadAllText(Path.Combine(existing, "earlier.txt")));
        Directory.Delete(existing, true);
    }

    // SIGHUP (the terminal that started the run closed) is an interruption like the others, not an abrupt death
    // that would leave the staging folder behind.
    [Fact]
    public void SigHupDuringTracking_ExitsPromptlyWith130AndLeavesNothing()
    {
        var (r, signalToExit) = Interrupt("results-hup", [SigHup]);
        AssertInterruptedCleanly(r, signalToExit);
        Assert.False(Directory.Exists(Path.Combine(clip.Root, "results-hup")));
    }

    // A second signal does not wait for the command: the process removes its staging folder and exits at once.
    [Fact]
    public void TwoSignalsInARow_ExitPromptlyWith130AndLeaveNothing()
    {
        var (r, signalToExit) = Interrupt("results-twice", [SigInt, SigTerm]);
        AssertInterruptedCleanly(r, signalToExit);
        Assert.False(Directory.Exists(Path.Combine(clip.Root, "results-twice")));
    }

    // The fitting and the report do not check for cancellation between their steps: a signal there is honoured when
    // the stage ends or, if that takes longer than the grace, by the watchdog. The stage is found from outside: the
    // process reads the frames (its read count in /proc/PID/io climbs by ~1 MB per 50 ms), then nearly stops reading
    // (the runtime's own reads are a few kB) while it fits 1600 frames, which takes seconds; the signal goes 300 ms
    // into that spell.
    [Fact]
    public void SigIntAfterTheTracking_ExitsWithin2sWith130AndLeavesNothing()
    {
        var signalToExit = TimeSpan.MaxValue;
        var signalled = false;
        var r = CliProcess.Start([CliProcess.Executable, .. Analyze("results-fit")], clip.Root, TimeSpan.FromSeconds(60), p =>
        {
            long last = ReadBytes(p.Id), start = last;
            var quiet = Stopwatch.StartNew();
            var wait = Stopwatch.StartNew();
            while (!p.HasExited && wait.Elapsed < TimeSpan.FromSeconds(50))
            {
                Thread.Sleep(50);
                var read = ReadBytes(p.Id);
                if (read - last > 50_000) quiet.Restart(); // still reading frames (about 20 kB each)
                last = read;
                // Tracking has run (over 100 frames' worth read) and then 300 ms with no frame read.
                if (read - start > 100 * 20_000 && quiet.Elapsed > TimeSpan.FromMilliseconds(300)) break;
            }
            if (p.HasExited) return;
            var clock = Stopwatch.StartNew();
            CliProcess.Signal(p, SigInt);
            signalled = true;
            p.WaitForExit(TimeSpan.FromSeconds(30));
            signalToExit = clock.Elapsed;
        });
        Assert.True(signalled, $"the run ended before its fitting was seen: {r}");
        AssertInterruptedCleanly(r, signalToExit);
        Assert.False(Directory.Exists(Path.Combine(clip.Root, "results-fit")));
    }

    private static long ReadBytes(int pid)
    {
        try
        {
            var line = File.ReadLines($"/proc/{pid}/io").FirstOrDefault(l => l.StartsWith("rchar:", StringComparison.Ordinal));
            return line is null ? 0 : long.Parse(line[6..].Trim(), System.Globalization.CultureInfo.InvariantCulture);
        }
        catch (IOException)
        {
            return 0;
        }
    }

    private static int FrameCountOf(string tracksCsv) =>
        File.ReadLines(tracksCsv).Skip(1).Select(l => l[..l.IndexOf(',')]).Distinct().Count();
}
