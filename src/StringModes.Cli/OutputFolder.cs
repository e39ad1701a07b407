namespace StringModes.Cli;

/// <summary>
/// An output folder written as a whole: files go into a hidden temporary folder beside the target, and
/// <see cref="Commit"/> swaps it into place. A failure or interrupt before that leaves the target untouched and
/// nothing partial behind.
/// </summary>
internal sealed class OutputFolder : IDisposable
{
    private readonly string _target;
    private bool _committed;

    public OutputFolder(string target, bool force)
    {
        _target = Path.GetFullPath(target.TrimEnd('/', '\\'));
        if (System.IO.File.Exists(_target))
            throw new CliException(ExitCodes.OutputNotWritable, $"{target}: is a file, not a folder; choose another --out");
        if (Directory.Exists(_target) && Directory.EnumerateFileSystemEntries(_target).Any() && !force)
            throw new CliException(ExitCodes.OutputNotWritable, $"{target}: already holds results; choose another --out or add --force to replace them");
        var parent = Path.GetDirectoryName(_target)!;
        try
        {
            Directory.CreateDirectory(parent);
            Staging = Path.Combine(parent, $".{Path.GetFileName(_target)}.partial-{Environment.ProcessId}");
            PartialOutputs.Process.Register(Staging);
            if (Directory.Exists(Staging)) Directory.Delete(Staging, true);
            Directory.CreateDirectory(Staging);
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            throw new CliException(ExitCodes.OutputNotWritable, $"{target}: cannot be written ({e.Message}); choose a writable --out");
        }
    }

    /// <summary>The temporary folder to write into.</summary>
    public string Staging { get; } = "";

    public string File(string name) => Path.Combine(Staging, name);

    /// <summary>True when the target folder exists and holds something (results of an earlier run).</summary>
    public bool TargetHoldsFiles => Directory.Exists(_target) && Directory.EnumerateFileSystemEntries(_target).Any();

    public void Commit()
    {
        lock (PartialOutputs.Process.Gate)
        {
            // A signal that came while the last outputs were being written still wins: nothing is put in place.
            if (PartialOutputs.Process.Interrupted) throw new OperationCanceledException("interrupted before the outputs were moved into place");
            string? old = null;
            try
            {
                if (Directory.Exists(_target))
                {
                    old = Path.Combine(Path.GetDirectoryName(_target)!, $".{Path.GetFileName(_target)}.old-{Environment.ProcessId}");
                    Directory.Move(_target, old);
                }
                Directory.Move(Staging, _target);
                _committed = true;
                PartialOutputs.Process.Unregister(Staging);
            }
            catch (Exception e) when (e is IOException or UnauthorizedAccessException)
            {
                // Put the earlier results back if they were moved aside.
                if (old is not null && !Directory.Exists(_target)) TryMove(old, _target);
                throw new CliException(ExitCodes.OutputNotWritable, $"{_target}: results could not be moved into place ({e.Message}); check the folder's permissions and free space");
            }
            if (old is not null)
            {
                try { Directory.Delete(old, true); }
                catch (Exception e) when (e is IOException or UnauthorizedAccessException) { }
            }
        }
    }

    private static void TryMove(string from, string to)
    {
        try { Directory.Move(from, to); }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException) { }
    }

    public void Dispose()
    {
        if (_committed) return;
        try { if (Directory.Exists(Staging)) Directory.Delete(Staging, true); }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException) { }
        PartialOutputs.Process.Unregister(Staging);
    }
}
