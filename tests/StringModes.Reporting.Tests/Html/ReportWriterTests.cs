using SkiaSharp;
using StringModes.Reporting.Html;
using StringModes.Reporting.Tests.Support;

namespace StringModes.Reporting.Tests.Html;

public sealed class ReportWriterTests : IDisposable
{
    private readonly string _dir = Directory.CreateTempSubdirectory("stringmodes-report-").FullName;

    [Fact]
    public void Write_ProducesReportAndDecodablePngAndParsableSvgFigures()
    {
        var files = ReportWriter.Write(DemoReport.Model(), Path.Combine(_dir, "out"));
        Assert.True(File.Exists(files.ReportPath));
        Assert.Equal(10, files.FigurePaths.Count);
        foreach (var path in files.FigurePaths)
        {
            if (path.EndsWith(".png", StringComparison.Ordinal))
            {
                using var bitmap = SKBitmap.Decode(path);
                Assert.Equal((1200, 700), (bitmap.Width, bitmap.Height));
            }
            else
            {
                Assert.Equal("svg", System.Xml.Linq.XDocument.Load(path).Root!.Name.LocalName);
            }
        }

        Assert.Contains("mode-amplitude.png", files.FigurePaths.Select(Path.GetFileName));
        Assert.Empty(Directory.GetFiles(_dir, "*.tmp", SearchOption.AllDirectories));
    }

    public void Dispose() => Directory.Delete(_dir, recursive: true);
}
