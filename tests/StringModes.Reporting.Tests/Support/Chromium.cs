using System.Diagnostics;

namespace StringModes.Reporting.Tests.Support;

/// <summary>
/// Runs headless Chromium on a local file with a fresh profile, no network services, no GPU. The browser
/// must be installed: a missing browser fails the test with install instructions rather than skipping it.
/// </summary>
internal static class Chromium
{
    public const string InstallHint =
        "Chromium is required for the report browser tests but was not found. Install it with `sudo apt-get install -y chromium` " +
        "(Debian/Ubuntu; the CI set-up and `bash build.sh test` install it), or set STRINGMODES_CHROMIUM to the browser executable.";

    public static string Require()
    {
        var fromEnvironment = Environment.GetEnvironmentVariable("STRINGMODES_CHROMIUM");
        if (!string.IsNullOrWhiteSpace(fromEnvironment))
        {
            Assert.True(File.Exists(fromEnvironment), $"STRINGMODES_CHROMIUM points to a missing file: {fromEnvironment}. {InstallHint}");
            return fromEnvironment;
        }

        foreach (var folder in (Environment.GetEnvironmentVariable("PATH") ?? "").Split(Path.PathSeparator, StringSplitOptions.RemoveEmptyEntries))
        {
            foreach (var name in new[] { "chromium", "chromium-browser" })
            {
                var candidate = Path.Combine(folder, name);
                if (File.Exists(candidate))
                {
                    return candidate;
                }
            }
        }

        Assert.Fail(InstallHint);
        return "";
    }

    public sealed record Result(int ExitCode, string Stdout, string Stderr)
    {
        /// <summary>Console messages the page produced (Chromium logs them as "…:CONSOLE…" lines).</summary>
        public string[] ConsoleLines => Stderr.Split('\n').Where(l => l.Contains(":CONSOLE", StringComparison.Ordinal)).ToArray();
    }

    public static Result Run(string htmlPath, params string[] extraArguments)
    {
        var executable = Require();
        var profile = Directory.CreateTempSubdirectory("stringmodes-chromium-profile-").FullName;
        try
        {
            var start = new ProcessStartInfo(executable)
            {
                RedirectStandardOutput = true,
                RedirectStandardError = true,
                UseShellExecute = false,
            };
            foreach (var a in new[]
            {
                "--headless", "--no-sandbox", "--disable-gpu", "--disable-quic", "--no-first-run",
                "--disable-background-networking", "--disable-component-update", "--disable-sync",
                "--user-data-dir=" + profile, "--enable-logging=stderr", "--v=0", "--hide-scrollbars",
            }.Concat(extraArguments))
            {
                start.ArgumentList.Add(a);
            }

            start.ArgumentList.Add(new Uri(htmlPath).AbsoluteUri);
            using var process = Process.Start(start) ?? throw new InvalidOperationException("Chromium did not start.");
            var stdout = process.StandardOutput.ReadToEndAsync();
            var stderr = process.StandardError.ReadToEndAsync();
            if (!process.WaitForExit(TimeSpan.FromSeconds(90)))
            {
                process.Kill(entireProcessTree: true);
                Assert.Fail("Chromium did not finish within 90 s.");
            }

            return new Result(process.ExitCode, stdout.Result, stderr.Result);
        }
        finally
        {
            try
            {
                Directory.Delete(profile, recursive: true);
            }
            catch (IOException)
            {
                // A browser helper may still hold the profile for a moment; the temp folder is cleaned by the OS.
            }
        }
    }
}
