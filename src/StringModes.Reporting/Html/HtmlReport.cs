using System.Globalization;
using System.Security.Cryptography;
using System.Text;
using StringModes.Reporting.Figures;
using StringModes.Reporting.Formatting;
using StringModes.Reporting.Model;

namespace StringModes.Reporting.Html;

/// <summary>
/// Builds report.html: one self-contained HTML5 file (figures as data: URIs, CSS inline, no scripts, no
/// external resources, enforced by a Content-Security-Policy that admits only data: images and the one inline
/// style sheet by its hash) that prints cleanly. Void elements are self-closed so the file also parses as XML. All text is HTML-escaped; all numbers are invariant-culture.
/// </summary>
public static class HtmlReport
{
    /// <summary>Safety paragraphs printed in every report.</summary>
    public static readonly IReadOnlyList<string> SafetyText =
    [
        "A string or cable under tension stores energy. If it breaks, or slips from a clamp or tuning peg, it can whip back fast enough to cut skin or injure an eye.",
        "Wear eye protection whenever a string is under tension, keep your face and body out of the line of the string and its anchors, and never load a string, clamp or fixture beyond its rated load.",
        "Release the tension before changing marks, clamps or the camera set-up.",
        "Tension estimates for structural cables (stays, guys, hangers, post-tensioning) from this tool are indicative only: decisions about such structures defer to the applicable local codes and to a licensed engineer.",
    ];

    private const string Css = """
        :root { --ink: #22262e; --muted: #5a606b; --line: #d9dde3; --pass: #1d6b3a; --flag: #9a3b12; --soft: #f4f6f8; }
        * { box-sizing: border-box; }
        body { margin: 0 auto; max-width: 1240px; padding: 24px 28px 48px; color: var(--ink); background: #fff;
               font: 16px/1.5 "DejaVu Sans", "Segoe UI", Helvetica, Arial, sans-serif; }
        h1 { font-size: 1.7rem; margin: 0 0 0.3rem; }
        h2 { font-size: 1.25rem; margin: 2rem 0 0.6rem; padding-bottom: 0.2rem; border-bottom: 2px solid var(--line); }
        p.summary { font-size: 1.08rem; margin: 0.4rem 0 1rem; }
        nav ol { display: flex; flex-wrap: wrap; gap: 0.3rem 1.2rem; padding: 0; margin: 0.6rem 0; list-style: none; font-size: 0.95rem; }
        nav a { color: var(--ink); }
        table { border-collapse: collapse; margin: 0.4rem 0 0.8rem; font-variant-numeric: tabular-nums; }
        th, td { padding: 0.3rem 0.75rem; border-bottom: 1px solid var(--line); text-align: left; vertical-align: top; }
        th { background: var(--soft); font-weight: 600; }
        td.num { text-align: right; white-space: nowrap; }
        .outcome { font-weight: 700; letter-spacing: 0.04em; }
        .pass { color: var(--pass); }
        .flag { color: var(--flag); }
        ul.warnings { padding-left: 1.2rem; }
        ul.warnings li { margin-bottom: 0.5rem; }
        .todo { color: var(--muted); }
        meter { width: 8rem; }
        figure { margin: 1.2rem 0; }
        figure img { max-width: 100%; height: auto; border: 1px solid var(--line); }
        figcaption { color: var(--muted); font-size: 0.95rem; margin-top: 0.3rem; }
        section.safety { border: 2px solid var(--flag); border-radius: 6px; padding: 0.2rem 1rem 0.6rem; margin-top: 2rem; }
        section.safety h2 { border-bottom: none; color: var(--flag); }
        footer { margin-top: 2.5rem; color: var(--muted); font-size: 0.9rem; }
        .note { color: var(--muted); font-size: 0.92rem; }
        @media print {
          body { max-width: none; padding: 0; font-size: 10.5pt; }
          nav { display: none; }
          h2 { break-after: avoid; }
          table, figure, section.safety { break-inside: avoid; }
          figure img { border: none; max-height: 16cm; width: auto; }
          a { color: inherit; text-decoration: none; }
        }
        """;

    /// <summary>Builds the complete HTML document for <paramref name="model"/> with the given rendered figures.</summary>
    public static string Build(ReportModel model, IReadOnlyList<RenderedFigure> figures)
    {
        ArgumentNullException.ThrowIfNull(model);
        ArgumentNullException.ThrowIfNull(figures);
        var h = new StringBuilder(1 << 16);
        var styleHash = Convert.ToBase64String(SHA256.HashData(Encoding.UTF8.GetBytes(Css)));
        h.Append("<!DOCTYPE html>\n<html lang=\"en\">\n<head>\n<meta charset=\"utf-8\" />\n");
        h.Append("<meta http-equiv=\"Content-Security-Policy\" content=\"default-src 'none'; img-src data:; style-src 'sha256-")
            .Append(styleHash).Append("'\" />\n");
        h.Append("<meta name=\"viewport\" content=\"width=device-width, initial-scale=1\" />\n");
        h.Append("<title>").Append(E(model.Title)).Append(" — ").Append(E(model.Measurement.ClipName)).Append("</title>\n");
        h.Append("<style>").Append(Css).Append("</style>\n</head>\n<body>\n");

        h.Append("<header>\n<h1>").Append(E(model.Title)).Append("</h1>\n");
        h.Append("<p class=\"summary\" id=\"summary\">").Append(E(Summary(model))).Append("</p>\n");
        h.Append("<nav aria-label=\"Sections\"><ol>");
        foreach (var (id, label) in new[] { ("modes", "Modes"), ("string", "String properties"), ("checks", "Checks"), ("warnings", "Warnings"), ("settings", "Settings"), ("figures", "Figures"), ("safety", "Safety") })
        {
            h.Append("<li><a href=\"#").Append(id).Append("\">").Append(label).Append("</a></li>");
        }

        h.Append("</ol></nav>\n</header>\n<main>\n");
        Modes(h, model);
        StringSection(h, model);
        Checks(h, model);
        Warnings(h, model);
        Settings(h, model);
        Figures(h, figures);
        Safety(h);
        h.Append("</main>\n<footer>");
        var footer = new List<string> { "Standard uncertainties (k = 1) are shown as value ± u with u to two significant digits (JCGM 100:2008, §7.2)." };
        if (!string.IsNullOrWhiteSpace(model.Generator))
        {
            footer.Add("Generated by " + model.Generator + ".");
        }

        if (model.GeneratedAt is { } at)
        {
            footer.Add("Generated " + at.ToUniversalTime().ToString("yyyy-MM-dd HH:mm:ss", CultureInfo.InvariantCulture) + " UTC.");
        }

        h.Append(E(string.Join(" ", footer))).Append("</footer>\n</body>\n</html>\n");
        return h.ToString();
    }

    /// <summary>The one-sentence summary of what was measured (plain text, not escaped).</summary>
    public static string Summary(ReportModel model)
    {
        var m = model.Measurement;
        var sb = new StringBuilder();
        var specimen = string.IsNullOrWhiteSpace(m.SpecimenDescription) ? "a string" : m.SpecimenDescription!.Trim();
        sb.Append(Inv($"{model.Modes.Count} vibration mode{(model.Modes.Count == 1 ? "" : "s")} of {specimen}"));
        if (model.StringProperties is { } sp)
        {
            sb.Append(" (vibrating length ").Append(Measured(sp.LengthM, "m")).Append(')');
        }

        sb.Append(" measured from ").Append(m.ClipName)
            .Append(Inv($" ({m.Frames} frames at {UncertaintyFormat.FormatValue(m.CaptureFps, 4)} frames/s, {UncertaintyFormat.FormatValue(m.DurationS, 3)} s; analysis window {UncertaintyFormat.FormatValue(m.AnalysisWindowStartS, 3)}–{UncertaintyFormat.FormatValue(m.AnalysisWindowEndS, 3)} s, {m.MarkCount} marks)"));
        if (model.StringProperties is { } s)
        {
            sb.Append(": fundamental ").Append(Measured(s.FundamentalHz, "Hz"))
                .Append(", wave speed ").Append(Measured(s.WaveSpeedMPerS, "m/s"))
                .Append(", tension ").Append(Measured(s.TensionN, "N"));
        }
        else if (model.Modes.Count > 0)
        {
            sb.Append(": lowest mode at ").Append(Measured(model.Modes[0].FrequencyHz, "Hz"));
        }

        sb.Append('.');
        if (model.Warnings.Count > 0)
        {
            sb.Append(Inv($" {model.Warnings.Count} warning{(model.Warnings.Count == 1 ? "" : "s")} below."));
        }

        return sb.ToString();
    }

    private static void Modes(StringBuilder h, ReportModel model)
    {
        h.Append("<section id=\"modes\">\n<h2>Modes</h2>\n");
        if (model.Modes.Count == 0)
        {
            h.Append("<p>No modes could be fitted.</p>\n</section>\n");
            return;
        }

        h.Append("<table class=\"modes\">\n<thead><tr><th>n</th><th>Frequency (Hz)</th><th>Decay rate σ (1/s)</th><th>Damping ratio ζ (10<sup>−3</sup>)</th><th>Q</th><th>Amplitude (mm)</th><th>f<sub>n</sub> / (n·f<sub>1</sub>)</th></tr></thead>\n<tbody>\n");
        foreach (var r in model.Modes)
        {
            h.Append("<tr id=\"mode-").Append(r.ModeNumber.ToString(CultureInfo.InvariantCulture)).Append("\"><td class=\"num\">")
                .Append(r.ModeNumber.ToString(CultureInfo.InvariantCulture)).Append("</td>");
            foreach (var v in new[] { r.FrequencyHz, r.DecayRatePerS, Scale(r.DampingRatio, 1e3), r.QFactor, Scale(r.AmplitudeM, 1e3), r.HarmonicRatio })
            {
                h.Append("<td class=\"num\">").Append(E(UncertaintyFormat.Format(v.Value, v.StandardUncertainty, null, allowExponent: false))).Append("</td>");
            }

            h.Append("</tr>\n");
        }

        h.Append("</tbody>\n</table>\n<p class=\"note\">σ: amplitude decay rate of e<sup>−σt</sup>; ζ = σ/ω<sub>n</sub>; Q = 1/(2ζ). Values ± standard uncertainty.</p>\n</section>\n");
    }

    private static void StringSection(StringBuilder h, ReportModel model)
    {
        h.Append("<section id=\"string\">\n<h2>String properties</h2>\n");
        if (model.StringProperties is not { } s)
        {
            h.Append("<p>String properties could not be estimated from these modes.</p>\n");
        }
        else
        {
            h.Append("<table class=\"properties\">\n<thead><tr><th>Quantity</th><th>Value</th></tr></thead>\n<tbody>\n");
            var rows = new List<(string, string)>
            {
                ("Vibrating length L", Measured(s.LengthM, "m")),
                ("Linear density μ", Measured(Scale(s.LinearDensityKgPerM, 1e3), "g/m")),
                ("Ideal-string fundamental f₀", Measured(s.FundamentalHz, "Hz")),
                ("Inharmonicity B", Measured(s.Inharmonicity, null)),
                ("Wave speed c", Measured(s.WaveSpeedMPerS, "m/s")),
                ("Tension T", Measured(s.TensionN, "N")),
            };
            if (s.BendingStiffnessNM2 is { } ei)
            {
                rows.Add(("Bending stiffness EI", Measured(ei, "N·m²")));
            }

            foreach (var (name, value) in rows)
            {
                h.Append("<tr><td>").Append(E(name)).Append("</td><td class=\"num\">").Append(E(value)).Append("</td></tr>\n");
            }

            h.Append("</tbody>\n</table>\n");
        }

        if (model.Budget is { } b)
        {
            Budget(h, b);
        }

        h.Append("</section>\n");
    }

    private static void Budget(StringBuilder h, UncertaintyBudget b)
    {
        var sumSquares = b.Rows.Sum(r => r.Contribution * r.Contribution);
        h.Append("<h3>Uncertainty budget: ").Append(E(b.Quantity)).Append("</h3>\n");
        h.Append("<table class=\"budget\">\n<thead><tr><th>Input</th><th>Estimate ± u</th><th>Sensitivity c</th><th>|c|·u (")
            .Append(E(b.Unit)).Append(")</th><th>Share of u²</th></tr></thead>\n<tbody>\n");
        foreach (var r in b.Rows.OrderByDescending(r => r.Contribution))
        {
            var share = sumSquares > 0 ? 100 * r.Contribution * r.Contribution / sumSquares : 0;
            var cUnit = b.Unit + "/" + (r.Unit.Contains('/') ? "(" + r.Unit + ")" : r.Unit);
            h.Append("<tr><td>").Append(E(r.Input)).Append("</td><td class=\"num\">").Append(E(Measured(r.Estimate, r.Unit)))
                .Append("</td><td class=\"num\">").Append(E(UncertaintyFormat.FormatValue(r.SensitivityCoefficient, 4) + " " + cUnit))
                .Append("</td><td class=\"num\">").Append(E(UncertaintyFormat.FormatValue(r.Contribution, 2)))
                .Append("</td><td class=\"num\"><meter min=\"0\" max=\"100\" value=\"").Append(share.ToString("F1", CultureInfo.InvariantCulture))
                .Append("\"></meter> ").Append(share.ToString("F1", CultureInfo.InvariantCulture)).Append(" %</td></tr>\n");
        }

        h.Append("<tr><th>Combined (root sum of squares)</th><td class=\"num\">").Append(E(Measured(b.Result, b.Unit)))
            .Append("</td><td></td><td class=\"num\">").Append(E(UncertaintyFormat.FormatValue(Math.Sqrt(sumSquares), 2)))
            .Append("</td><td class=\"num\">100.0 %</td></tr>\n</tbody>\n</table>\n");
        h.Append("<p class=\"note\">Inputs treated as uncorrelated (JCGM 100:2008 §5.1.2, eq. 10): u²(y) = Σ (c<sub>i</sub>·u(x<sub>i</sub>))². The largest share shows which input to measure better first.</p>\n");
    }

    private static void Checks(StringBuilder h, ReportModel model)
    {
        h.Append("<section id=\"checks\">\n<h2>Checks</h2>\n");
        if (model.Checks.Count == 0)
        {
            h.Append("<p>No checks were run.</p>\n</section>\n");
            return;
        }

        h.Append("<table class=\"checks\">\n<thead><tr><th>Outcome</th><th>Check</th><th>Detail</th></tr></thead>\n<tbody>\n");
        foreach (var c in model.Checks)
        {
            h.Append("<tr><td class=\"outcome ").Append(c.Passed ? "pass\">PASS" : "flag\">FLAG").Append("</td><td>")
                .Append(E(c.Name)).Append("</td><td>").Append(E(c.Detail)).Append("</td></tr>\n");
        }

        h.Append("</tbody>\n</table>\n</section>\n");
    }

    private static void Warnings(StringBuilder h, ReportModel model)
    {
        h.Append("<section id=\"warnings\">\n<h2>Warnings</h2>\n");
        if (model.Warnings.Count == 0)
        {
            h.Append("<p>No warnings.</p>\n</section>\n");
            return;
        }

        h.Append("<ul class=\"warnings\">\n");
        foreach (var w in model.Warnings)
        {
            h.Append("<li><strong>").Append(E(w.Message)).Append("</strong><br /><span class=\"todo\">What to do: ")
                .Append(E(w.Action)).Append("</span></li>\n");
        }

        h.Append("</ul>\n</section>\n");
    }

    private static void Settings(StringBuilder h, ReportModel model)
    {
        h.Append("<section id=\"settings\">\n<h2>Analysis settings</h2>\n");
        if (model.Settings.Count == 0)
        {
            h.Append("<p>Defaults were used throughout.</p>\n</section>\n");
            return;
        }

        h.Append("<table class=\"settings\">\n<tbody>\n");
        foreach (var s in model.Settings)
        {
            h.Append("<tr><th scope=\"row\">").Append(E(s.Name)).Append("</th><td>").Append(E(s.Value)).Append("</td></tr>\n");
        }

        h.Append("</tbody>\n</table>\n</section>\n");
    }

    private static void Figures(StringBuilder h, IReadOnlyList<RenderedFigure> figures)
    {
        h.Append("<section id=\"figures\">\n<h2>Figures</h2>\n");
        if (figures.Count == 0)
        {
            h.Append("<p>No figures were produced.</p>\n");
        }

        foreach (var f in figures)
        {
            h.Append("<figure id=\"figure-").Append(E(f.Name)).Append("\">\n<img src=\"data:image/png;base64,")
                .Append(Convert.ToBase64String(f.Png)).Append("\" width=\"").Append(((int)Math.Round(f.WidthPx / f.Scale)).ToString(CultureInfo.InvariantCulture))
                .Append("\" height=\"").Append(((int)Math.Round(f.HeightPx / f.Scale)).ToString(CultureInfo.InvariantCulture)).Append("\" alt=\"").Append(E(f.Caption)).Append("\" />\n<figcaption>")
                .Append(E(f.Caption)).Append("</figcaption>\n</figure>\n");
        }

        h.Append("</section>\n");
    }

    private static void Safety(StringBuilder h)
    {
        h.Append("<section id=\"safety\" class=\"safety\">\n<h2>Safety</h2>\n");
        foreach (var p in SafetyText)
        {
            h.Append("<p>").Append(E(p)).Append("</p>\n");
        }

        h.Append("</section>\n");
    }

    private static string Measured(MeasuredValue v, string? unit) => UncertaintyFormat.Format(v.Value, v.StandardUncertainty, unit);

    private static MeasuredValue Scale(MeasuredValue v, double factor) => new(v.Value * factor, v.StandardUncertainty * factor);

    private static string E(string? text) => HtmlText.Escape(text);

    private static string Inv(FormattableString s) => s.ToString(CultureInfo.InvariantCulture);
}
