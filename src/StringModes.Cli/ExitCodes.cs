namespace StringModes.Cli;

/// <summary>Process exit codes, documented in --help (<see cref="HelpText.ExitCodeTable"/>) and used in docs/reliability.md.</summary>
public static class ExitCodes
{
    /// <summary>Success.</summary>
    public const int Success = 0;
    /// <summary>Internal fault (a bug): the message says so.</summary>
    public const int InternalError = 1;
    /// <summary>Bad usage or options.</summary>
    public const int Usage = 2;
    /// <summary>Unreadable or unsupported input (clip, rig or scene file).</summary>
    public const int BadInput = 3;
    /// <summary>Analysis not possible (marks not found, no vibration, ...).</summary>
    public const int AnalysisImpossible = 4;
    /// <summary>Output not writable.</summary>
    public const int OutputNotWritable = 5;
    /// <summary>Interrupted by SIGINT, SIGTERM or SIGHUP.</summary>
    public const int Interrupted = 130;
}

/// <summary>An error a user can fix; carries its exit code and a one-line message.</summary>
public sealed class CliException(int exitCode, string message) : Exception(Video.Files.InputFileException.OneLine(message))
{
    /// <summary>The process exit code.</summary>
    public int ExitCode { get; } = exitCode;
}
