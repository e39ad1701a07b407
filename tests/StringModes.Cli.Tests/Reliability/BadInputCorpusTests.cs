using System.Security.Cryptography;
using System.Text;
using System.Text.RegularExpressions;

namespace StringModes.Cli.Tests.Reliability;

/// <summary>
/// Runs the real <c>stringmodes</c> process on every case of <see cref="BadInputCorpus"/> and checks, per case: the
/// documented exit code; for a failure, exactly one stderr line (native libraries included) that names the offending
/// file or option and says what to do after a "; ", with no stack trace; no new or partial file in the output's
/// folder (beyond the marks picture a marks-not-found failure writes on purpose into a new folder); and, run again
/// over an existing output folder with --force, that folder byte for byte untouched. An input that must still be
/// analysed (exit 0) must give its warning and outputs free of NaN and Infinity. The inputs themselves must never
/// change. The table of what was seen is docs/reliability.md; the test fails when the committed file differs.
/// </summary>
[Collection("small clip")]
public partial class BadInputCorpusTests(SmallClipFixture clip)
{
    /// <summary>Environment variable that makes the test rewrite docs/reliability.md instead of comparing it.</summary>
    public const string UpdateVariable = "STRINGMODES_UPDATE_DOCS";

    /// <summary>Environment variable naming a folder to build the corpus in and keep, to inspect or rerun its inputs by hand.</summary>
    public const string KeepVariable = "STRINGMODES_CORPUS_DIR";

    private static readonly int[] Documented = [ExitCodes.Success, ExitCodes.Usage, ExitCodes.BadInput, ExitCodes.AnalysisImpossible, ExitCodes.OutputNotWritable, ExitCodes.Interrupted];

    // A hang is a failure too: the slowest case takes a few seconds.
    private static readonly TimeSpan Limit = TimeSpan.FromSeconds(30);

    [Fact]
    public void EveryBadInput_GetsItsDocumentedExitCodeAndOneLineMessage_AndNothingIsHalfWritten()
    {
        using var temp = new TempFolder();
        var keep = Environment.GetEnvironmentVariable(KeepVariable);
        if (keep is { Length: > 0 } && Directory.Exists(keep)) Directory.Delete(keep, true);
        var inputs = new CorpusInputs(keep is { Length: > 0 } ? Directory.CreateDirectory(keep).FullName : temp.Path, clip);
        List<CaseOutcome> outcomes;
        Dictionary<string, string> before, after;
        try
        {
            var cases = BadInputCorpus.Build(inputs);
            Assert.Equal(cases.Count, cases.Select(k => k.Name).Distinct().Count());
            before = HashInputs(inputs.Root);
            outcomes = cases.Select(k => Run(inputs, k)).ToList();
            after = HashInputs(inputs.Root);
        }
        finally
        {
            inputs.UnlockAll();
        }

        var doc = ReliabilityDoc.Render(outcomes);
        var path = Path.Combine(Cli.RepoRoot, "docs", "reliability.md");
        var update = Environment.GetEnvironmentVariable(UpdateVariable) == "1";
        if (update) File.WriteAllText(path, doc);

        var failures = outcomes.Where(o => o.Problems.Count > 0).Select(o => $"{o.Case.Name}: {string.Join("; ", o.Problems)}\n{o.Result}").ToList();
        var changed = before.Where(e => !after.TryGetValue(e.Key, out var h) || h != e.Value).Select(e => e.Key).ToList();
        Assert.True(changed.Count == 0, $"inputs were modified: {string.Join(", ", changed)}");
        Assert.True(failures.Count == 0, $"{failures.Count} of {outcomes.Count} cases failed:\n\n{string.Join("\n\n", failures)}");
        Assert.Equal(0, outcomes.Sum(o => o.Crashes));
        Assert.Equal(0, outcomes.Sum(o => o.PartialFiles));

        var committed = File.Exists(path) ? File.ReadAllText(path).ReplaceLineEndings("\n") : "";
        Assert.True(committed == doc,
            $"docs/reliability.md does not match what the corpus gives now. Regenerate it with\n  {UpdateVariable}=1 dotnet test tests/StringModes.Cli.Tests -c Release --filter {nameof(BadInputCorpusTests)}\n" +
            $"and commit it.\n--- generated ---\n{doc}");
    }

    private static CaseOutcome Run(CorpusInputs inputs, CorpusCase k)
    {
        var outcome = new CaseOutcome(k);
        string[]? prefix = null;
        if (k.Unprivileged)
        {
            prefix = CliProcess.WithoutPermissionOverride;
            if (prefix is null)
            {
                outcome.NotTestable = "not testable as root: setpriv could not drop the permission override";
                outcome.Problems.Add(outcome.NotTestable);
                return outcome;
            }
        }
        var synth = k.Command == "synth";
        var fresh = synth ? $"out/{k.Name}.mkv" : $"out/{k.Name}";
        var r = CliProcess.Run(inputs.Root, k.Args.Select(a => a.Replace("{out}", fresh, StringComparison.Ordinal)), Limit, prefix);
        outcome.Result = r;
        outcome.ExitCode = r.ExitCode;
        outcome.Crashes += IsCrash(r) ? 1 : 0;
        if (r.TimedOut) outcome.Problems.Add($"no exit within {Limit.TotalSeconds:F0} s (hang)");
        if (r.ExitCode != k.Expected) outcome.Problems.Add($"exit {r.ExitCode}, expected {k.Expected}");

        var outFolder = inputs.Full("out");
        var created = Directory.GetFileSystemEntries(outFolder).Select(Path.GetFileName).Order(StringComparer.Ordinal).ToList();
        if (k.Expected != ExitCodes.Success)
        {
            outcome.Message = Normalise(inputs, r.ErrorLines.Length > 0 ? string.Join(" ⏎ ", r.ErrorLines) : "(nothing on stderr)");
            CheckMessage(r, k, outcome.Problems);
            var allowed = k.Diagnostic is null ? [] : new[] { k.Name };
            foreach (var e in created.Where(e => !allowed.Contains(e)))
            {
                outcome.PartialFiles++;
                outcome.Problems.Add($"left '{e}' in the output's folder");
            }
            if (k.Diagnostic is not null && r.ExitCode == k.Expected)
            {
                var inside = Directory.Exists(Path.Combine(outFolder, k.Name)) ? Directory.GetFileSystemEntries(Path.Combine(outFolder, k.Name)).Select(Path.GetFileName).ToArray() : [];
                if (!inside.SequenceEqual([k.Diagnostic]))
                {
                    outcome.PartialFiles += inside.Count(n => n != k.Diagnostic);
                    outcome.Problems.Add($"the new output folder holds [{string.Join(", ", inside)}], expected only {k.Diagnostic}");
                }
            }
        }
        else
        {
            if (k.Warning is not null)
            {
                var warning = r.ErrorLines.FirstOrDefault(l => l.Contains(k.Warning, StringComparison.Ordinal) && l.Contains(k.Names, StringComparison.Ordinal));
                outcome.Message = Normalise(inputs, warning ?? "(no such warning)");
                if (warning is null) outcome.Problems.Add($"no warning containing '{k.Warning}' and '{k.Names}'");
            }
            else outcome.Message = "(analysed; no warning due)";
            foreach (var line in r.ErrorLines.Where(l => !l.StartsWith("warning: ", StringComparison.Ordinal)))
                outcome.Problems.Add($"stderr line that is not a warning: '{line}'");
            CheckCompleteOutputs(Path.Combine(inputs.Root, fresh), k, outcome.Problems);
            foreach (var e in created.Where(e => e != Path.GetFileName(fresh)))
            {
                outcome.PartialFiles++;
                outcome.Problems.Add($"left '{e}' beside the output");
            }
        }
        foreach (var e in Directory.GetFileSystemEntries(outFolder)) Delete(e);
        if (k.Expected == ExitCodes.Success) return outcome;

        // Again over an existing output, with --force: a failure must leave it exactly as it was.
        var existing = synth ? $"existing/{k.Name}.mkv" : $"existing/{k.Name}";
        var existingFolder = inputs.Full("existing");
        if (synth)
        {
            File.WriteAllText(inputs.Full(existing), "an earlier clip");
            File.WriteAllText(inputs.Full($"existing/{k.Name}.truth.json"), "{ \"earlier\": true }");
        }
        else
        {
            Directory.CreateDirectory(inputs.Full(existing));
            File.WriteAllText(inputs.Full($"{existing}/results.json"), "{ \"earlier\": true }");
            File.WriteAllText(inputs.Full($"{existing}/notes.txt"), "notes of an earlier run");
        }
        var snapshot = Snapshot(existingFolder);
        var again = CliProcess.Run(inputs.Root, [.. k.Args.Select(a => a.Replace("{out}", existing, StringComparison.Ordinal)), "--force"], Limit, prefix);
        outcome.Crashes += IsCrash(again) ? 1 : 0;
        if (again.ExitCode != r.ExitCode) outcome.Problems.Add($"over an existing output with --force: exit {again.ExitCode}, first run {r.ExitCode}");
        var now = Snapshot(existingFolder);
        foreach (var name in now.Keys.Except(snapshot.Keys))
        {
            outcome.PartialFiles++;
            outcome.Problems.Add($"over an existing output: left '{name}'");
        }
        foreach (var (name, bytes) in snapshot)
            if (!now.TryGetValue(name, out var b) || b != bytes) outcome.Problems.Add($"over an existing output: '{name}' was changed or removed");
        foreach (var e in Directory.GetFileSystemEntries(existingFolder)) Delete(e);
        return outcome;
    }

    private static bool IsCrash(ProcessResult r) =>
        r.TimedOut || r.ExitCode == ExitCodes.InternalError || !Documented.Contains(r.ExitCode)
        || r.Error.Contains("Unhandled exception", StringComparison.Ordinal) || StackFrame().IsMatch(r.Error);

    private static void CheckMessage(ProcessResult r, CorpusCase k, List<string> problems)
    {
        if (r.ErrorLines.Length != 1) problems.Add($"stderr holds {r.ErrorLines.Length} lines, expected one");
        if (r.ErrorLines.Length == 0) return;
        var line = r.ErrorLines[0];
        if (!line.Contains(k.Names, StringComparison.Ordinal)) problems.Add($"the message does not name '{k.Names}'");
        var fix = line.IndexOf("; ", StringComparison.Ordinal);
        if (fix <= 0 || line.Length - fix < 10) problems.Add("the message has no '; what to do' part");
        if (StackFrame().IsMatch(r.Error) || line.Contains("Exception", StringComparison.Ordinal)) problems.Add("stack trace or exception type shown");
        if (line.Contains("internal error", StringComparison.Ordinal)) problems.Add("reported as an internal error");
        if (r.Out.Length > 0) problems.Add("wrote to stdout");
    }

    private static void CheckCompleteOutputs(string folder, CorpusCase k, List<string> problems)
    {
        string[] expected = k.Command == "track" ? ["marks-found.png", "tracks.csv"] : ["modes.csv", "reference-frame.png", "report.html", "results.json", "tracks.csv"];
        if (!Directory.Exists(folder))
        {
            problems.Add("no output folder");
            return;
        }
        foreach (var name in expected)
            if (!File.Exists(Path.Combine(folder, name))) problems.Add($"{name} missing from the outputs");
        foreach (var file in Directory.GetFiles(folder, "*", SearchOption.AllDirectories).Where(f => f.EndsWith(".json", StringComparison.Ordinal) || f.EndsWith(".csv", StringComparison.Ordinal)))
        {
            var text = File.ReadAllText(file);
            if (text.Contains("NaN", StringComparison.Ordinal) || text.Contains("Infinity", StringComparison.Ordinal) || text.Contains('∞'))
                problems.Add($"{Path.GetFileName(file)} holds NaN or Infinity");
        }
    }

    private static string Normalise(CorpusInputs inputs, string text)
        => text.Replace(inputs.Root + "/", "", StringComparison.Ordinal).Replace(inputs.Root, ".", StringComparison.Ordinal);

    private static Dictionary<string, string> Snapshot(string folder)
        => Directory.GetFileSystemEntries(folder, "*", SearchOption.AllDirectories).Order(StringComparer.Ordinal)
            .ToDictionary(e => Path.GetRelativePath(folder, e), e => File.Exists(e) ? Convert.ToHexString(SHA256.HashData(File.ReadAllBytes(e))) : "folder");

    // Every regular file of the inputs (pipes and mode-000 files are compared by name only).
    private static Dictionary<string, string> HashInputs(string root)
    {
        var result = new Dictionary<string, string>(StringComparer.Ordinal);
        foreach (var e in Directory.GetFileSystemEntries(root, "*", new EnumerationOptions { RecurseSubdirectories = true, IgnoreInaccessible = true }))
        {
            var rel = Path.GetRelativePath(root, e);
            if (rel.StartsWith("out", StringComparison.Ordinal) || rel.StartsWith("existing", StringComparison.Ordinal)) continue;
            var info = new FileInfo(e);
            result[rel] = info.Exists && info.Length > 0 ? Convert.ToHexString(SHA256.HashData(File.ReadAllBytes(e))) : "entry";
        }
        return result;
    }

    private static void Delete(string entry)
    {
        if (Directory.Exists(entry)) Directory.Delete(entry, true);
        else File.Delete(entry);
    }

    [GeneratedRegex(@"\bat [A-Za-z_][\w.`<>]*\.[\w<>]+\(")]
    private static partial Regex StackFrame();
}

/// <summary>What one corpus case gave.</summary>
internal sealed class CaseOutcome(CorpusCase c)
{
    public CorpusCase Case { get; } = c;
    public int ExitCode { get; set; } = -1;
    public string Message { get; set; } = "";
    public ProcessResult? Result { get; set; }
    public int Crashes { get; set; }
    public int PartialFiles { get; set; }
    public string? NotTestable { get; set; }
    public List<string> Problems { get; } = [];
}

/// <summary>docs/reliability.md: the corpus table and its totals.</summary>
internal static class ReliabilityDoc
{
    public static string Render(IReadOnlyList<CaseOutcome> outcomes)
    {
        var s = new StringBuilder();
        s.Append("""
            # Reliability: bad input and faults

            Generated by `BadInputCorpusTests` (tests/StringModes.Cli.Tests/Reliability) from inputs it derives from one
            small synthetic clip; do not edit by hand. The test fails when this file differs from what the corpus gives;
            regenerate it with `STRINGMODES_UPDATE_DOCS=1 dotnet test tests/StringModes.Cli.Tests -c Release --filter BadInputCorpusTests`.

            Each case runs the real `stringmodes` process in the folder holding the inputs (so the paths below are relative)
            twice: into a new output folder, and over an existing output folder with `--force`. A failure must give the
            documented exit code (2 usage or options, 3 unreadable or unsupported input, 4 analysis not possible; see
            `stringmodes --help`), exactly one line on stderr naming the file or option and saying what to do, no stack
            trace, no new or partial file (a marks-not-found failure writes only `marks-found.png`, and only into a new
            folder), and must leave the existing folder byte for byte as it was. Inputs that can still be analysed exit 0
            with the warning shown, and their outputs hold no NaN or Infinity. Permission cases run without root's
            permission override (`setpriv`) when the tests run as root.

            Beside this table: `InterruptTests` (SIGINT, SIGTERM or SIGHUP during an analysis: exit 130 within 2 s, nothing left,
            the rerun succeeds), `ParserFuzzTests` (seeded mutations of rig, scene and quantity texts: valid values or a
            one-line refusal, no other exception), `DeterminismTests` (two processes, byte-identical results) and the
            CsCheck property tests of tests/StringModes.Analysis.Tests.

            | # | class | case | what was fed | command | exit | message seen |
            |---|---|---|---|---|---|---|

            """.ReplaceLineEndings("\n"));
        var i = 0;
        foreach (var o in outcomes)
        {
            var command = "stringmodes " + string.Join(' ', o.Case.Args.Select(a => a.Replace("{out}", "OUT", StringComparison.Ordinal)));
            var exit = o.NotTestable is not null ? "—" : o.ExitCode.ToString(System.Globalization.CultureInfo.InvariantCulture);
            var message = o.NotTestable ?? o.Message;
            s.Append(FormattableString.Invariant($"| {++i} | {Cell(o.Case.Class)} | {Cell(o.Case.Name)} | {Cell(o.Case.Fed)} | `{Cell(command)}` | {exit} | {Cell(message)} |\n"));
        }
        var runs = outcomes.Sum(o => o.Result is null ? 0 : o.Case.Expected == ExitCodes.Success ? 1 : 2);
        s.Append('\n');
        s.Append(string.Create(System.Globalization.CultureInfo.InvariantCulture,
            $"Totals: {outcomes.Count} cases tried ({runs} runs), {outcomes.Sum(o => o.Crashes)} crashes (exit 1, unhandled exception, death by signal or hang), {outcomes.Sum(o => o.PartialFiles)} partial files left, {outcomes.Count(o => o.NotTestable is not null)} not testable here, {outcomes.Count(o => o.Problems.Count > 0)} cases failing.\n"));
        return s.ToString();
    }

    private static string Cell(string text) => text.Replace("|", "\\|", StringComparison.Ordinal).Replace("\n", " ", StringComparison.Ordinal);
}
