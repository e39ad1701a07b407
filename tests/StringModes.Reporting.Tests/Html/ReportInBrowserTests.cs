using System.Security.Cryptography;
using System.Text;
using System.Text.RegularExpressions;
using SkiaSharp;
using StringModes.Reporting.Html;
using StringModes.Reporting.Model;
using StringModes.Reporting.Tests.Support;

namespace StringModes.Reporting.Tests.Html;

/// <summary>Loads report.html in a real headless browser, offline, from a file:// URL.</summary>
public sealed class ReportInBrowserTests : IDisposable
{
    private readonly string _dir = Directory.CreateTempSubdirectory("stringmodes-browser-").FullName;

    private string WriteReport()
    {
        using var bitmap = new SKBitmap(480, 270);
        bitmap.Erase(new SKColor(90, 96, 104));
        using var png = bitmap.Encode(SKEncodedImageFormat.Png, 100);
        var model = DemoReport.Model() with
        {
            Figures = DemoReport.Model().Figures with
            {
                ReferenceFrame = new ReferenceFrame
                {
                    EncodedImage = png.ToArray(),
                    FirstEndPx = new ImagePoint(20, 135),
                    SecondEndPx = new ImagePoint(460, 135),
                    Marks = [new TrackedMark(1, new ImagePoint(240, 135), new ImagePoint(236, 110), new ImagePoint(244, 160))],
                },
            },
        };
        return ReportWriter.Write(model, _dir).ReportPath;
    }

    [Fact]
    public void Report_LoadsWithoutConsoleMessagesAndScreenshotIsAPng()
    {
        var report = WriteReport();
        var shot = Path.Combine(_dir, "screenshot.png");
        var result = Chromium.Run(report, "--screenshot=" + shot, "--window-size=1280,1600");
        Assert.True(result.ExitCode == 0, $"Chromium exited with {result.ExitCode}: {result.Stderr}");
        Assert.True(result.ConsoleLines.Length == 0, "console messages:\n" + string.Join("\n", result.ConsoleLines));
        if (Environment.GetEnvironmentVariable("STRINGMODES_FIGURE_DUMP") is { Length: > 0 } dump)
        {
            Directory.CreateDirectory(dump);
            File.Copy(shot, Path.Combine(dump, "report-screenshot.png"), overwrite: true);
            File.Copy(report, Path.Combine(dump, "report.html"), overwrite: true);
        }

        using var image = SKBitmap.Decode(shot);
        Assert.NotNull(image);
        Assert.Equal((1280, 1600), (image.Width, image.Height));
        // The page is rendered (not a blank screenshot): more than a handful of colours.
        var colours = new HashSet<SKColor>();
        for (var y = 0; y < image.Height; y += 7)
        {
            for (var x = 0; x < image.Width; x += 7)
            {
                colours.Add(image.GetPixel(x, y));
            }
        }

        Assert.True(colours.Count > 20, $"screenshot looks blank ({colours.Count} colours)");
    }

    [Fact]
    public void Report_EveryImageDecodesInTheBrowser()
    {
        var report = WriteReport();
        var html = File.ReadAllText(report);
        var imageCount = Regex.Matches(html, "<img ").Count;
        Assert.Equal(6, imageCount);

        // Instrumented copy: one inline script, admitted by its hash, reports each image's naturalWidth on load.
        const string script = "window.addEventListener('load',function(){var r=[];document.querySelectorAll('img').forEach(function(i){r.push(i.complete&&i.naturalWidth>0?i.naturalWidth:0)});var p=document.createElement('pre');p.id='image-check';p.textContent=JSON.stringify(r);document.body.appendChild(p);});";
        var hash = Convert.ToBase64String(SHA256.HashData(Encoding.UTF8.GetBytes(script)));
        var instrumented = html
            .Replace("img-src data:;", $"img-src data:; script-src 'sha256-{hash}';", StringComparison.Ordinal)
            .Replace("</head>", "<script>" + script + "</script>\n</head>", StringComparison.Ordinal);
        Assert.NotEqual(html, instrumented);
        var probe = Path.Combine(_dir, "report-probe.html");
        File.WriteAllText(probe, instrumented);

        var result = Chromium.Run(probe, "--dump-dom", "--virtual-time-budget=10000");
        Assert.True(result.ConsoleLines.Length == 0, "console messages:\n" + string.Join("\n", result.ConsoleLines));
        var match = Regex.Match(result.Stdout, "<pre id=\"image-check\">\\[([0-9,]*)\\]</pre>");
        Assert.True(match.Success, "the probe script did not report (page did not load?)");
        var widths = match.Groups[1].Value.Split(',', StringSplitOptions.RemoveEmptyEntries).Select(int.Parse).ToArray();
        Assert.Equal(imageCount, widths.Length);
        Assert.All(widths, w => Assert.Equal(1200, w));
    }

    [Fact]
    public void ConsoleCheck_CatchesABlockedScript()
    {
        // Control for the check above: a page whose inline script the policy blocks must produce a console line.
        var page = Path.Combine(_dir, "blocked.html");
        File.WriteAllText(page, "<!DOCTYPE html><html><head><meta http-equiv=\"Content-Security-Policy\" content=\"default-src 'none'\"></head><body><p>x</p><script>document.title='ran'</script></body></html>");
        var result = Chromium.Run(page, "--dump-dom");
        Assert.NotEmpty(result.ConsoleLines);
        Assert.DoesNotContain("<title>ran</title>", result.Stdout);
    }

    public void Dispose()
    {
        try
        {
            Directory.Delete(_dir, recursive: true);
        }
        catch (IOException)
        {
        }
    }
}
