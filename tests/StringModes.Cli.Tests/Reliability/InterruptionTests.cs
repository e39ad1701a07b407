using System.Diagnostics;

namespace StringModes.Cli.Tests.Reliability;

/// <summary>
/// The interrupt logic in-process, with its exit replaced: a command that stops in time is not forced; one that does
/// not stop is forced out after the grace time with its staging folder deleted; a second signal forces at once.
/// </summary>
public class InterruptionTests
{
    private sealed class Harness : IDisposable
    {
        private readonly TempFolder _temp = new();
        public readonly CancellationTokenSource Cancel = new();
        public readonly PartialOutputs Partial = new();
        public readonly StringWriter Error = new();
        public readonly ManualResetEventSlim Exited = new();
        public int Code = -1;
        public readonly Interruption Interruption;
        public readonly string Staging;

        public Harness(TimeSpan grace)
        {
            Staging = Directory.CreateDirectory(_temp.File(".results.partial-1")).FullName;
            File.WriteAllText(Path.Combine(Staging, "results.json"), "{");
            Partial.Register(Staging);
            Interruption = new Interruption(Cancel, Partial, Error, code => { Code = code; Exited.Set(); }, grace, listen: false);
        }

        public void Dispose()
        {
            Interruption.Dispose();
            Cancel.Dispose();
            Exited.Dispose();
            _temp.Dispose();
        }
    }

    [Fact]
    public void CommandThatStopsWithinTheGrace_IsNotForcedOut()
    {
        using var h = new Harness(TimeSpan.FromMilliseconds(200));
        h.Interruption.Signal();
        Assert.True(h.Cancel.IsCancellationRequested);
        h.Interruption.Finished();
        // Four times the grace: a forced exit would have come by now.
        Assert.False(h.Exited.Wait(TimeSpan.FromMilliseconds(800)), "forced exit although the command had finished");
        Assert.True(Directory.Exists(h.Staging), "the command's own clean-up is left to the command");
    }

    [Fact]
    public void CommandThatDoesNotStop_IsForcedOutAfterTheGraceWithItsStagingFolderDeleted()
    {
        using var h = new Harness(TimeSpan.FromMilliseconds(200));
        var clock = Stopwatch.StartNew();
        h.Interruption.Signal();
        Assert.True(h.Exited.Wait(TimeSpan.FromSeconds(5)), "no forced exit");
        Assert.True(clock.Elapsed >= TimeSpan.FromMilliseconds(190), $"forced after {clock.ElapsedMilliseconds} ms, before the grace");
        Assert.Equal(ExitCodes.Interrupted, h.Code);
        Assert.False(Directory.Exists(h.Staging), "staging folder left behind");
        Assert.Equal("stringmodes: interrupted; no partial outputs were kept", h.Error.ToString().Trim());
    }

    [Fact]
    public void SecondSignal_ForcesTheExitAtOnce()
    {
        using var h = new Harness(TimeSpan.FromSeconds(30));
        h.Interruption.Signal();
        h.Interruption.Signal();
        Assert.True(h.Exited.IsSet, "a second signal must not wait for the grace");
        Assert.Equal(ExitCodes.Interrupted, h.Code);
        Assert.False(Directory.Exists(h.Staging));
    }
}
