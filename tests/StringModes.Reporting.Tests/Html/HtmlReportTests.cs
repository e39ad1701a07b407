using System.Text.RegularExpressions;
using System.Xml.Linq;
using SkiaSharp;
using StringModes.Reporting.Html;
using StringModes.Reporting.Tests.Support;

namespace StringModes.Reporting.Tests.Html;

public class HtmlReportTests
{
    private static readonly Lazy<(Model.ReportModel Model, string Html)> Built = new(() =>
    {
        var model = DemoReport.Model("clip <b>\"1\"</b> & more.mkv");
        return (model, HtmlReport.Build(model, ReportFigures.RenderAll(model)));
    });

    [Fact]
    public void Report_ParsesAsXmlWithOneRowPerMode()
    {
        var (model, html) = Built.Value;
        var doc = XDocument.Parse(html);
        var rows = doc.Descendants("tr").Where(e => ((string?)e.Attribute("id"))?.StartsWith("mode-") == true).ToArray();
        Assert.Equal(model.Modes.Count, rows.Length);
        foreach (var mode in model.Modes)
        {
            var row = rows.Single(r => (string?)r.Attribute("id") == $"mode-{mode.ModeNumber}");
            var cells = row.Elements("td").Select(c => c.Value).ToArray();
            Assert.Equal(7, cells.Length);
            Assert.Equal(StringModes.Reporting.Formatting.UncertaintyFormat.Format(mode.FrequencyHz.Value, mode.FrequencyHz.StandardUncertainty), cells[1]);
            Assert.Equal(mode.ModeNumber.ToString(System.Globalization.CultureInfo.InvariantCulture), cells[0]);
        }

        // Mode 2 frequency 200.0016 ± 0.0062 Hz (hand-worked: u = 0.0062 → 4 decimals); damping ratio
        // 1.1/(2π·200) = 8.7535e-4 ± 2e-5 shown in units of 10⁻³ as 0.875 ± 0.020 [computed].
        Assert.Contains("200.0016 ± 0.0062", html);
        Assert.Contains("<td class=\"num\">0.875 ± 0.020</td>", html);
    }

    [Fact]
    public void Report_HasEverySectionAndTheSafetyText()
    {
        var (model, html) = Built.Value;
        foreach (var id in new[] { "summary", "modes", "string", "checks", "warnings", "settings", "figures", "safety" })
        {
            Assert.Contains($"id=\"{id}\"", html);
        }

        foreach (var paragraph in HtmlReport.SafetyText)
        {
            Assert.Contains(HtmlText.Escape(paragraph), html);
        }

        Assert.Contains("eye protection", html);
        Assert.Contains("licensed engineer", html);
        Assert.Contains("PASS", html);
        Assert.Contains("FLAG", html);
        Assert.Contains("What to do: Fit both polarisations", html);
        Assert.Contains("16.90 ± 0.18 N", html);
        Assert.Equal(model.Warnings.Count, Regex.Matches(html, "What to do:").Count);
    }

    [Fact]
    public void Budget_SharesFollowFromSensitivityTimesUncertainty()
    {
        // REFERENCES.md §8 [computed]: contributions |c|·u = 0.169 (μ), 0.052 (L), 0.0338 (f) N →
        // shares of u² 88.1 %, 8.3 %, 3.5 %; combined 0.18002 N. Shown to 0.1 %.
        var html = Built.Value.Html;
        Assert.Matches("Linear density μ.*?88\\.1 %", html);
        Assert.Matches("Length L.*?8\\.3 %", html);
        Assert.Matches("Fundamental f₀.*?3\\.5 %", html);
        Assert.True(html.IndexOf("Linear density μ</td>", StringComparison.Ordinal) < html.IndexOf("Length L</td>", StringComparison.Ordinal), "largest share first");
    }

    [Fact]
    public void Report_IsSelfContainedAndEscapesUserText()
    {
        var html = Built.Value.Html;
        Assert.DoesNotContain("<script", html, StringComparison.OrdinalIgnoreCase);
        Assert.DoesNotContain("<link", html, StringComparison.OrdinalIgnoreCase);
        Assert.DoesNotContain("url(", html, StringComparison.OrdinalIgnoreCase);
        Assert.DoesNotContain("<b>", html);
        Assert.Contains("clip &lt;b&gt;&quot;1&quot;&lt;/b&gt; &amp; more.mkv", html);
        Assert.Contains("Text with &lt;markup&gt; &amp; &quot;quotes&quot;", html);
        Assert.Contains("default-src 'none'; img-src data:", html);
        Assert.Contains("@media print", html);
        var sources = Regex.Matches(html, "src=\"([^\"]*)\"").Select(m => m.Groups[1].Value).ToArray();
        Assert.Equal(5, sources.Length); // five figures: no reference frame in the demo model
        Assert.All(sources, s => Assert.StartsWith("data:image/png;base64,", s));
        foreach (var s in sources)
        {
            using var bitmap = SKBitmap.Decode(Convert.FromBase64String(s["data:image/png;base64,".Length..]));
            Assert.NotNull(bitmap);
            Assert.Equal(1200, bitmap.Width);
        }
    }

    [Fact]
    public void Summary_SaysWhatWasMeasured()
    {
        var summary = HtmlReport.Summary(Built.Value.Model);
        Assert.StartsWith("6 vibration modes of a nylon monofilament (invented demo data) (vibrating length 0.6500 ± 0.0010 m) measured from", summary);
        Assert.Contains("1200 frames at 240 frames/s", summary);
        Assert.Contains("fundamental 100.00 ± 0.10 Hz", summary);
        Assert.Contains("tension 16.90 ± 0.18 N", summary);
        Assert.EndsWith("2 warnings below.", summary);
    }
}
