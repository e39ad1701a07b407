using System.Diagnostics;
using System.Runtime.InteropServices;

// The command-line tests run where the product runs: Linux (OpenCV's runtime package is linux-x64).
[assembly: System.Runtime.Versioning.SupportedOSPlatform("linux")]

namespace StringModes.Cli.Tests.Reliability;

/// <summary>What one run of the real <c>stringmodes</c> process did.</summary>
internal sealed record ProcessResult(int ExitCode, string Out, string Error, bool TimedOut, TimeSpan Elapsed)
{
    /// <summary>Non-empty lines written to stderr (by the program or by any native library it loaded).</summary>
    public string[] ErrorLines => Error.Split('\n', StringSplitOptions.RemoveEmptyEntries | StringSplitOptions.TrimEntries);

    public override string ToString() => $"exit {ExitCode}{(TimedOut ? " (killed after the time limit)" : "")} in {Elapsed.TotalSeconds:F1} s\nstdout:\n{Out}\nstderr:\n{Error}";
}

/// <summary>
/// Runs the built <c>stringmodes</c> executable as a separate process, as a user's shell would: its real exit code,
/// everything on its stderr (native libraries included) and its real signal handling.
/// </summary>
internal static class CliProcess
{
    /// <summary>The executable beside the test assembly (the Cli project is referenced, so it is copied here).</summary>
    public static string Executable => Path.Combine(AppContext.BaseDirectory, "stringmodes");

    /// <summary>True when the tests run as root, where file permissions do not stop reads.</summary>
    public static bool IsRoot => Environment.IsPrivilegedProcess;

    /// <summary>
    /// The command prefix that runs a program without the capabilities that let root ignore file permissions
    /// (CAP_DAC_OVERRIDE, CAP_DAC_READ_SEARCH), or null when that is impossible here. Not root: no prefix needed.
    /// </summary>
    public static string[]? WithoutPermissionOverride { get; } = FindPermissionDrop();

    private static string[]? FindPermissionDrop()
    {
        if (!IsRoot) return [];
        string[] prefix = ["setpriv", "--bounding-set=-dac_override,-dac_read_search", "--"];
        // Probe: the prefix must really stop root from reading a file with mode 000.
        var probe = Path.Combine(Path.GetTempPath(), $"stringmodes-permission-probe-{Environment.ProcessId}");
        try
        {
            File.WriteAllText(probe, "probe");
            File.SetUnixFileMode(probe, UnixFileMode.None);
            var r = Start([.. prefix, "cat", probe], null, TimeSpan.FromSeconds(10));
            return r.ExitCode != 0 && !r.Out.Contains("probe", StringComparison.Ordinal) && r.Error.Contains("Permission denied", StringComparison.Ordinal) ? prefix : null;
        }
        catch (Exception e) when (e is System.ComponentModel.Win32Exception or IOException)
        {
            return null;
        }
        finally
        {
            File.Delete(probe);
        }
    }

    /// <summary>Runs <c>stringmodes</c> with <paramref name="args"/> in <paramref name="workingDirectory"/>.</summary>
    public static ProcessResult Run(string workingDirectory, IEnumerable<string> args, TimeSpan timeout, string[]? prefix = null)
        => Start([.. prefix ?? [], Executable, .. args], workingDirectory, timeout);

    /// <summary>Starts the command; <paramref name="started"/> sees the process as soon as it runs (to signal it).</summary>
    public static ProcessResult Start(string[] command, string? workingDirectory, TimeSpan timeout, Action<Process>? started = null)
    {
        var info = new ProcessStartInfo(command[0])
        {
            RedirectStandardOutput = true,
            RedirectStandardError = true,
            RedirectStandardInput = true,
            UseShellExecute = false,
            WorkingDirectory = workingDirectory ?? Environment.CurrentDirectory,
        };
        foreach (var a in command.Skip(1)) info.ArgumentList.Add(a);
        // The product's own handling of native library logging is under test: nothing inherited may switch it.
        foreach (var name in new[] { "OPENCV_LOG_LEVEL", "OPENCV_FFMPEG_LOGLEVEL", "OPENCV_FFMPEG_DEBUG", "OPENCV_VIDEOIO_DEBUG" })
            info.Environment.Remove(name);
        info.Environment["NO_COLOR"] = "1";
        var clock = Stopwatch.StartNew();
        using var p = Process.Start(info) ?? throw new InvalidOperationException($"could not start {command[0]}");
        p.StandardInput.Close();
        var stdout = p.StandardOutput.ReadToEndAsync();
        var stderr = p.StandardError.ReadToEndAsync();
        started?.Invoke(p);
        var exited = p.WaitForExit(timeout);
        if (!exited)
        {
            p.Kill(entireProcessTree: true);
            p.WaitForExit();
        }
        p.WaitForExit();
        clock.Stop();
        return new ProcessResult(exited ? p.ExitCode : -1, stdout.Result, stderr.Result, !exited, clock.Elapsed);
    }

    /// <summary>Sends a POSIX signal (SIGHUP = 1, SIGINT = 2, SIGTERM = 15) to a process.</summary>
    public static void Signal(Process p, int signal)
    {
        if (Kill(p.Id, signal) != 0) throw new InvalidOperationException($"kill({p.Id}, {signal}) failed: errno {Marshal.GetLastPInvokeError()}");
    }

    [DllImport("libc", EntryPoint = "kill", SetLastError = true)]
    private static extern int Kill(int pid, int signal);
}
