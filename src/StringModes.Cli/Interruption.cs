using System.Runtime.InteropServices;

namespace StringModes.Cli;

/// <summary>
/// Hidden work-in-progress paths of this process (output staging folders, a clip being written) that must not
/// outlive it. Commands register them while they exist; a forced exit deletes whatever is still registered.
/// </summary>
internal sealed class PartialOutputs
{
    private readonly HashSet<string> _paths = new(StringComparer.Ordinal);

    /// <summary>The process's registry.</summary>
    public static PartialOutputs Process { get; } = new();

    /// <summary>Held while outputs are moved into place, so that a forced exit never lands between two renames.</summary>
    public object Gate { get; } = new();

    private volatile bool _interrupted;

    /// <summary>True once a signal has arrived: from then on nothing more is moved into place.</summary>
    public bool Interrupted => _interrupted;

    /// <summary>Records the interrupt (under <see cref="Gate"/>, so that a commit in progress completes first).</summary>
    public void Interrupt()
    {
        lock (Gate) _interrupted = true;
    }

    public void Register(string path)
    {
        lock (Gate) _paths.Add(path);
    }

    public void Unregister(string path)
    {
        lock (Gate) _paths.Remove(path);
    }

    /// <summary>Deletes every registered path (best effort). The caller holds <see cref="Gate"/>.</summary>
    public void DeleteAll()
    {
        foreach (var p in _paths)
        {
            try
            {
                if (Directory.Exists(p)) Directory.Delete(p, true);
                else if (File.Exists(p)) File.Delete(p);
            }
            catch (Exception e) when (e is IOException or UnauthorizedAccessException)
            {
            }
        }
        _paths.Clear();
    }
}

/// <summary>
/// Turns SIGINT (Ctrl-C), SIGTERM and SIGHUP into cancellation of the running command, which stops at its next check, removes
/// its staging folder and returns exit code 130. A command that has not returned within <see cref="Grace"/> of the
/// first signal (blocked in a read, or inside a step that does not check), or a second signal, makes the process
/// delete what <see cref="PartialOutputs"/> holds and exit with 130 itself: an interrupt is always prompt and never
/// leaves partial files.
/// </summary>
internal sealed class Interruption : IDisposable
{
    /// <summary>How long the command gets to stop by itself after the first signal.</summary>
    public static readonly TimeSpan Grace = TimeSpan.FromSeconds(1.5);

    private readonly CancellationTokenSource _cancel;
    private readonly PartialOutputs _partial;
    private readonly TextWriter _error;
    private readonly Action<int> _exit;
    private readonly TimeSpan _grace;
    private readonly List<PosixSignalRegistration> _registrations = [];
    private readonly ManualResetEventSlim _stopped = new();
    private int _signals;
    private bool _finished;

    /// <param name="cancel">Cancelled at the first signal.</param>
    /// <param name="partial">What a forced exit deletes (<see cref="PartialOutputs.Process"/>).</param>
    /// <param name="error">Where the forced exit writes its one line.</param>
    /// <param name="exit">Ends the process (Environment.Exit; replaceable for tests).</param>
    /// <param name="grace">Default <see cref="Grace"/>.</param>
    /// <param name="listen">Register for SIGINT, SIGTERM and SIGHUP (false in tests, which call <see cref="Signal"/>).</param>
    public Interruption(CancellationTokenSource cancel, PartialOutputs partial, TextWriter error, Action<int> exit, TimeSpan? grace = null, bool listen = true)
    {
        _cancel = cancel;
        _partial = partial;
        _error = error;
        _exit = exit;
        _grace = grace ?? Grace;
        if (!listen) return;
        // SIGHUP: the terminal or remote session that started the run went away.
        foreach (var s in new[] { PosixSignal.SIGINT, PosixSignal.SIGTERM, PosixSignal.SIGHUP })
            _registrations.Add(PosixSignalRegistration.Create(s, c =>
            {
                c.Cancel = true;
                Signal();
            }));
    }

    /// <summary>A signal arrived.</summary>
    public void Signal()
    {
        _partial.Interrupt();
        if (Interlocked.Increment(ref _signals) == 1)
        {
            // A dedicated thread, not a thread-pool timer: when the pool is saturated (parallel fits, blocked
            // workers) a timer callback can be delayed for seconds, and the forced exit must come on time.
            var watchdog = new Thread(() =>
            {
                if (!_stopped.Wait(_grace)) ForceExit();
            }) { IsBackground = true, Name = "interrupt watchdog" };
            watchdog.Start();
            try { _cancel.Cancel(); }
            catch (AggregateException) { }
        }
        else ForceExit();
    }

    /// <summary>The command returned: no forced exit any more.</summary>
    public void Finished()
    {
        lock (_partial.Gate) _finished = true;
        _stopped.Set();
    }

    private void ForceExit()
    {
        lock (_partial.Gate)
        {
            if (_finished) return;
            _finished = true;
            _partial.DeleteAll();
            _error.WriteLine("stringmodes: interrupted; no partial outputs were kept");
            _error.Flush();
            _exit(ExitCodes.Interrupted);
        }
    }

    public void Dispose()
    {
        _stopped.Set();
        foreach (var r in _registrations) r.Dispose();
    }
}
