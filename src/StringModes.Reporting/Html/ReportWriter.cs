using StringModes.Reporting.Figures;
using StringModes.Shared;
using StringModes.Reporting.Model;

namespace StringModes.Reporting.Html;

/// <summary>Paths written by <see cref="ReportWriter.Write"/>.</summary>
/// <param name="ReportPath">Full path of report.html.</param>
/// <param name="FigurePaths">Full paths of the PNG and SVG figure files.</param>
public sealed record ReportFiles(string ReportPath, IReadOnlyList<string> FigurePaths);

/// <summary>
/// Everyday entry point: renders the figures, writes <c>figures/NAME.png</c> and <c>figures/NAME.svg</c> and
/// <c>report.html</c> into an output folder, each file atomically. For full control use
/// <see cref="ReportFigures.RenderAll"/> and <see cref="HtmlReport.Build"/> directly.
/// </summary>
public static class ReportWriter
{
    /// <summary>File name of the report inside the output folder.</summary>
    public const string ReportFileName = "report.html";

    /// <summary>Sub-folder for figure files.</summary>
    public const string FigureFolder = "figures";

    /// <summary>
    /// Writes the report into <paramref name="outputDirectory"/> (created if missing). I/O failures surface as
    /// <see cref="IOException"/> or <see cref="UnauthorizedAccessException"/> for the caller to map to its exit code.
    /// </summary>
    public static ReportFiles Write(ReportModel model, string outputDirectory, FigureOptions? options = null)
    {
        ArgumentNullException.ThrowIfNull(model);
        var root = Path.GetFullPath(outputDirectory);
        var figureDir = Path.Combine(root, FigureFolder);
        Directory.CreateDirectory(figureDir);
        var figures = ReportFigures.RenderAll(model, options);
        var paths = new List<string>();
        foreach (var f in figures)
        {
            var png = Path.Combine(figureDir, f.Name + ".png");
            var svg = Path.Combine(figureDir, f.Name + ".svg");
            AtomicFile.WriteAllBytes(png, f.Png);
            AtomicFile.WriteAllText(svg, f.Svg);
            paths.Add(png);
            paths.Add(svg);
        }

        var report = Path.Combine(root, ReportFileName);
        AtomicFile.WriteAllText(report, HtmlReport.Build(model, figures));
        return new ReportFiles(report, paths);
    }
}
