using System.Reflection;

namespace StringModes.Cli;

/// <summary>
/// The <c>stringmodes</c> command: dispatches to sub-commands and turns every failure into a one-line message and
/// a documented exit code. Output goes to injected writers so tests see what a user would see.
/// </summary>
public sealed class App(TextWriter stdout, TextWriter stderr, bool noColour = true, bool interactive = false)
{
    /// <summary>Standard output.</summary>
    public TextWriter Out { get; } = stdout;

    /// <summary>Standard error: messages, warnings, progress.</summary>
    public TextWriter Error { get; } = stderr;

    /// <summary>True when colour escapes must not be written (NO_COLOR set or output not a terminal).</summary>
    public bool NoColour { get; } = noColour || !interactive;

    /// <summary>True when stderr is a terminal: progress bars are drawn.</summary>
    public bool Interactive { get; } = interactive;

    /// <summary>The tool's version.</summary>
    public static string Version => typeof(App).Assembly.GetCustomAttribute<AssemblyInformationalVersionAttribute>()?.InformationalVersion.Split('+')[0] ?? "0";

    /// <summary>Runs the command line and returns the exit code.</summary>
    public int Run(string[] args, CancellationToken cancel = default)
    {
        var debug = args.Contains("--debug");
        Debug = debug;
        var rest = args.Where(a => a != "--debug").ToArray();
        try
        {
            if (rest.Length == 0 || rest[0] is "--help" or "-h" or "help")
            {
                Out.Write(HelpText.Main);
                return rest.Length == 0 ? ExitCodes.Usage : ExitCodes.Success;
            }
            if (rest[0] == "--version")
            {
                Out.WriteLine($"stringmodes {Version}");
                return ExitCodes.Success;
            }
            var tail = rest.Skip(1).ToArray();
            if (tail.Contains("--help") || tail.Contains("-h"))
            {
                Out.Write(HelpText.For(rest[0]) ?? throw new CliException(ExitCodes.Usage, $"stringmodes: unknown command '{rest[0]}'; see 'stringmodes --help'"));
                return ExitCodes.Success;
            }
            return rest[0] switch
            {
                "synth" => new SynthCommand(this).Run(tail, cancel),
                "analyze" => new AnalyzeCommand(this).Run(tail, cancel),
                "track" => new TrackCommand(this).Run(tail, cancel),
                _ => throw new CliException(ExitCodes.Usage, $"stringmodes: unknown command '{rest[0]}'; commands are analyze, track and synth (see 'stringmodes --help')"),
            };
        }
        catch (CliException e)
        {
            Error.WriteLine(e.Message);
            if (debug) Error.WriteLine(e.StackTrace);
            return e.ExitCode;
        }
        catch (OperationCanceledException)
        {
            Error.WriteLine("stringmodes: interrupted; no partial outputs were kept");
            return ExitCodes.Interrupted;
        }
        catch (Exception e) when (!debug)
        {
            Error.WriteLine($"stringmodes: internal error ({e.GetType().Name}: {e.Message.Split('\n')[0]}); rerun with --debug and report it");
            return ExitCodes.InternalError;
        }
    }

    /// <summary>True under <c>--debug</c>: stack traces and stage timings are written to stderr.</summary>
    public bool Debug { get; private set; }

    /// <summary>Writes a stage's wall time to stderr under <c>--debug</c>.</summary>
    public void Timing(string stage, TimeSpan elapsed)
    {
        if (Debug) Error.WriteLine(string.Create(System.Globalization.CultureInfo.InvariantCulture, $"timing: {stage} {elapsed.TotalSeconds:F3} s"));
    }

    /// <summary>The output folder of the running command, for messages.</summary>
    public string? OutDir { get; set; }

    /// <summary>Writes a warning line to stderr.</summary>
    public void Warn(string message) => Error.WriteLine(NoColour ? $"warning: {message}" : $"\u001b[33mwarning:\u001b[0m {message}");
}
