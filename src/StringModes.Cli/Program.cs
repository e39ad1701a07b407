using System.Runtime.InteropServices;

namespace StringModes.Cli;

internal static class Program
{
    private static int Main(string[] args)
    {
        if (!args.Contains("--debug")) QuietNativeLogging();
        using var cancel = new CancellationTokenSource();
        var app = new App(Console.Out, Console.Error, Environment.GetEnvironmentVariable("NO_COLOR") is { Length: > 0 },
            !Console.IsErrorRedirected);
        using var interruption = new Interruption(cancel, PartialOutputs.Process, Console.Error, Environment.Exit);
        var code = app.Run(args, cancel.Token);
        interruption.Finished();
        return code;
    }

    /// <summary>
    /// OpenCV and its FFmpeg backend write their own diagnostics straight to stderr ("moov atom not found",
    /// "[ WARN:0@0.01] global cap.cpp ..."), which would break the one-line error a user sees; every problem they
    /// report also reaches the program as a failed open or read and gets a message of its own. The native libraries
    /// read these variables from the process environment when they first log, so they are set natively, before
    /// anything loads OpenCV, and only when the user has not set them. --debug leaves them alone.
    /// </summary>
    private static void QuietNativeLogging()
    {
        if (OperatingSystem.IsWindows()) return;
        SetIfUnset("OPENCV_LOG_LEVEL", "SILENT");
        SetIfUnset("OPENCV_FFMPEG_LOGLEVEL", "-8"); // AV_LOG_QUIET
    }

    private static void SetIfUnset(string name, string value)
    {
        if (Environment.GetEnvironmentVariable(name) is not null) return;
        _ = SetEnv(name, value, 0);
        Environment.SetEnvironmentVariable(name, value);
    }

    [DllImport("libc", EntryPoint = "setenv", SetLastError = true)]
    private static extern int SetEnv(string name, string value, int overwrite);
}
