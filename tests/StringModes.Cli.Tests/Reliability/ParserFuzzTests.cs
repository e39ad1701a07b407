using System.Collections;
using System.Globalization;
using System.Reflection;
using System.Text;
using StringModes.Analysis.Units;
using StringModes.Video.Files;
using StringModes.Video.Synthesis;

namespace StringModes.Cli.Tests.Reliability;

/// <summary>
/// Bounded, seeded fuzzing of the three parsers that read what users type: the rig file, the scene file and the
/// quantity-with-unit text. Valid inputs are mutated (characters deleted, doubled or replaced, tokens such as NaN,
/// 1e400, huge digit strings, lone surrogates and other types spliced in, numbers turned into text and back) and
/// each result must either parse to valid values — finite, in range — or be refused with the product's input
/// exception and a one-line message naming the file. Any other exception fails the test with the input that caused it.
/// </summary>
public class ParserFuzzTests
{
    private const string RigText = """
        {
          "description": "bench B-2, nylon",
          "length": "80.00 cm", "length_uncertainty": "0.5 mm",
          "linear_density": "0.987 g/m", "linear_density_uncertainty": 5e-6,
          "unstretched_length": 0.5, "capture_fps": 240, "readout": "3.5 ms",
          "marks_px": [[20, 60], [67, 60], [113.5, 59.7], [160, 59], [300, 58.7]]
        }
        """;

    private const string RigTextByMass = """
        { "length": 0.65, "sample_mass": "1.234 g", "sample_length": "1.000 m", "sample_mass_uncertainty": "1 mg",
          "material_density": "1.14 g/cm3", "diameter": "0.8 mm" }
        """;

    private static readonly string[] Tokens =
    [
        "NaN", "-NaN", "Infinity", "-Infinity", "1e400", "-1e400", "1e-400", "1e308", "-0", "0", "-1", "4294967296",
        "2147483648", "99999999999999999999999999999999999999", "0.000000000000000000000000001", "null", "true", "false",
        "[]", "{}", "\"\"", "\"x\"", "[[]]", "[1]", "[1, 2, 3]", "{\"a\": 1}", "\"\\uD800\"", "\"\\uDFFF\"", "\"\\u0000\"",
        "µ", "é", "\u00A0", "\u2212", "\uFEFF", "😀", "/*", "*/", "//", ",", ":", "\"", "\\", "e", "E+", ".", "mm", "g/m", "Hz",
        "\"80 furlong\"", "\"NaN m\"", "\"1e400 m\"", "\"-0 mm\"", "\"5 MM\"", "\"  \"", "\"1,5 cm\"",
    ];

    private const string Alphabet = "0123456789.eE+-,:;[]{}\" \t\nabcxyzmgsHzµ/\\_'";

    /// <summary>One to three random mutations of <paramref name="text"/>.</summary>
    private static string Mutate(string text, Random r)
    {
        var s = new StringBuilder(text);
        var count = r.Next(1, 4);
        for (var m = 0; m < count; m++)
        {
            var at = s.Length == 0 ? 0 : r.Next(s.Length);
            switch (r.Next(9))
            {
                case 0 when s.Length > 0: s.Remove(at, 1); break;
                case 1 when s.Length > 0: s.Insert(at, s[at]); break;
                case 2 when s.Length > 0: s[at] = Alphabet[r.Next(Alphabet.Length)]; break;
                case 3: s.Insert(at, Tokens[r.Next(Tokens.Length)]); break;
                case 4: ReplaceValue(s, r, Tokens[r.Next(Tokens.Length)]); break;
                case 5: ReplaceValue(s, r, Quote(s, r)); break;
                case 6 when s.Length > 0: s.Remove(at, Math.Min(s.Length - at, r.Next(1, 40))); break;
                case 7:
                    var from = r.Next(text.Length);
                    s.Insert(at, text.Substring(from, Math.Min(20, text.Length - from)));
                    break;
                default: s.Insert(at, (char)r.Next(0x20, 0x3000)); break;
            }
        }
        return s.ToString();
    }

    // Replaces the value after a random ':' (up to the next ',' or '}') by another: swaps types and values.
    private static void ReplaceValue(StringBuilder s, Random r, string value)
    {
        var text = s.ToString();
        var colons = Enumerable.Range(0, text.Length).Where(i => text[i] == ':').ToArray();
        if (colons.Length == 0) return;
        var start = colons[r.Next(colons.Length)] + 1;
        var depth = 0;
        var end = start;
        while (end < text.Length && !(depth == 0 && (text[end] == ',' || text[end] == '}')))
        {
            if (text[end] is '[' or '{') depth++;
            else if (text[end] is ']') depth--;
            end++;
        }
        s.Remove(start, end - start).Insert(start, " " + value);
    }

    // The value after a random ':' turned into text ("0.5" → "\"0.5\""), or text into a bare value.
    private static string Quote(StringBuilder s, Random r)
    {
        var text = s.ToString();
        var i = text.IndexOf(':', r.Next(Math.Max(1, text.Length)));
        if (i < 0) return "\"0.5\"";
        var end = text.IndexOfAny([',', '}'], i + 1);
        var value = (end < 0 ? text[(i + 1)..] : text[(i + 1)..end]).Trim();
        return value.StartsWith('"') ? value.Trim('"') : "\"" + value + "\"";
    }

    /// <summary>Runs <paramref name="parse"/> on mutations of every seed text; returns (parsed, refused) counts.</summary>
    private static (int Parsed, int Refused) Fuzz(string[] seeds, int iterations, int seed, string fileName, Action<string> parse)
    {
        var r = new Random(seed);
        int parsed = 0, refused = 0;
        for (var i = 0; i < iterations; i++)
        {
            var text = Mutate(seeds[i % seeds.Length], r);
            try
            {
                parse(text);
                parsed++;
            }
            catch (InputFileException e)
            {
                refused++;
                Assert.True(e.Message.Length > 0 && !e.Message.Contains('\n') && e.Message.StartsWith(fileName + ":", StringComparison.Ordinal) && e.Message.Contains("; ", StringComparison.Ordinal),
                    $"iteration {i}: message not one line naming the file and the fix: '{e.Message}'\ninput:\n{text}");
            }
            catch (Exception e) when (e is not Xunit.Sdk.XunitException)
            {
                Assert.Fail($"iteration {i}: {e.GetType().Name}: {e.Message}\ninput:\n{text}");
            }
        }
        return (parsed, refused);
    }

    // 5000 mutations of two valid rig files (one giving μ directly, one from a sample and from ρ and d).
    [Fact]
    public void RigParser_OnMutatedFiles_ParsesValidValuesOrRefusesWithOneLine()
    {
        var (parsed, refused) = Fuzz([RigText, RigTextByMass], 5000, 20_251_202, "rig.json", text => AssertValid(Rig.Parse(text, "rig.json")));
        // Both outcomes must occur, or the mutations are not exercising the parser.
        Assert.True(parsed > 100 && refused > 1000, $"parsed {parsed}, refused {refused}");
    }

    [Fact]
    public void SceneParser_OnMutatedFiles_ParsesValidScenesOrRefusesWithOneLine()
    {
        var (parsed, refused) = Fuzz([Scenes.Small], 5000, 20_251_203, "scene.json", text => AssertValid(SceneFile.Parse(text, "scene.json")));
        Assert.True(parsed > 100 && refused > 1000, $"parsed {parsed}, refused {refused}");
    }

    // The quantity parser reports failure by its return value and never throws.
    [Fact]
    public void QuantityParser_OnMutatedText_GivesAFiniteValueOrAOneLineError()
    {
        string[] seeds = ["65cm", " 650 mm ", "0.987 g/m", "3.5e-2kg/m", "1.14 g/cm3", "240fps", "1.5kHz", "3.5 ms", "73N", "200GPa", "-3cm", "0.65"];
        var dimensions = Enum.GetValues<Dimension>();
        var r = new Random(20_251_204);
        int accepted = 0, refused = 0;
        for (var i = 0; i < 10000; i++)
        {
            var text = Mutate(seeds[i % seeds.Length], r);
            var d = dimensions[r.Next(dimensions.Length)];
            bool ok;
            double si;
            string error;
            try { ok = Quantity.TryParse(text, d, out si, out error); }
            catch (Exception e) { Assert.Fail($"iteration {i}: TryParse('{text}', {d}) threw {e.GetType().Name}: {e.Message}"); return; }
            if (ok)
            {
                accepted++;
                Assert.True(double.IsFinite(si) && error.Length == 0, $"'{text}' as {d}: {si}, '{error}'");
            }
            else
            {
                refused++;
                Assert.True(si == 0 && error.Length > 0 && !error.Contains('\n'), $"'{text}' as {d}: {si}, '{error}'");
            }
        }
        Assert.True(accepted > 500 && refused > 2000, $"accepted {accepted}, refused {refused}");
    }

    private static void AssertValid(Rig rig)
    {
        foreach (var p in typeof(Rig).GetProperties().Where(p => p.PropertyType == typeof(double?)))
            if (p.GetValue(rig) is double v)
                Assert.True(double.IsFinite(v) && v >= 0 && v <= 1e6, $"{p.Name} = {v}");
        if (rig.MarksPx is { } marks)
        {
            Assert.True(marks.Count >= 5, $"{marks.Count} marks");
            foreach (var m in marks) Assert.True(double.IsFinite(m.X) && double.IsFinite(m.Y) && m.X >= 0 && m.Y >= 0, $"mark {m}");
        }
    }

    // Every number reachable from the scene is finite (the two documented "NaN when not given" excepted), and the
    // values the renderer sizes buffers and loops by are in their documented ranges.
    private static void AssertValid(Scene scene)
    {
        Walk(scene, "scene", 0);
        Assert.InRange(scene.WidthPx, 16, 8192);
        Assert.InRange(scene.HeightPx, 16, 8192);
        Assert.True(scene.CaptureFps > 0 && scene.CaptureFps <= 100_000, $"capture_fps {scene.CaptureFps}");
        Assert.True(scene.FrameCount >= 2, $"{scene.FrameCount} frames");
        Assert.InRange(scene.Subframes, 1, 256);
        Assert.NotEmpty(scene.Motion.Modes);
        foreach (var m in scene.Motion.Modes) Assert.True(m.FrequencyHz > 0 && m.FrequencyHz < scene.CaptureFps / 2, $"mode {m.N} at {m.FrequencyHz} Hz");
        Assert.All(scene.MarkFractions, f => Assert.InRange(f, double.Epsilon, 1 - 1e-12));
    }

    private static void Walk(object? o, string path, int depth)
    {
        if (o is null || depth > 6) return;
        switch (o)
        {
            case double d:
                if (!path.EndsWith("LinearDensityKgPerM", StringComparison.Ordinal) && !path.EndsWith("TensionN", StringComparison.Ordinal))
                    Assert.True(double.IsFinite(d), $"{path} = {d.ToString(CultureInfo.InvariantCulture)}");
                return;
            case string or int or bool or Enum:
                return;
            case IEnumerable items:
                var k = 0;
                foreach (var item in items) Walk(item, $"{path}[{k++}]", depth + 1);
                return;
        }
        if (o.GetType().Namespace?.StartsWith("StringModes", StringComparison.Ordinal) != true) return;
        foreach (var p in o.GetType().GetProperties(BindingFlags.Public | BindingFlags.Instance).Where(p => p.GetIndexParameters().Length == 0))
            Walk(p.GetValue(o), $"{path}.{p.Name}", depth + 1);
    }
}
