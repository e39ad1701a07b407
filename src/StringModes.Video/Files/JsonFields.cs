using System.Text.Json;
using StringModes.Video.Synthesis;

namespace StringModes.Video.Files;

/// <summary>
/// Reads typed fields from a JSON object with messages that name the file, the dotted field path and the fix.
/// Unknown fields are refused so that a misspelt option never passes silently.
/// </summary>
public sealed class JsonFields
{
    private readonly string _file;
    private readonly string _path;
    private readonly JsonElement _element;
    private readonly HashSet<string> _read = new(StringComparer.Ordinal);

    public JsonFields(string file, string path, JsonElement element)
    {
        _file = file;
        _path = path;
        _element = element;
        if (element.ValueKind != JsonValueKind.Object)
            throw Error(path.Length == 0 ? "(top level)" : path, $"must be an object, got {Kind(element)}", "write it as { ... }");
    }

    public InputFileException Error(string field, string problem, string fix)
        => new($"{_file}: {field} {problem}; {fix}");

    private string Field(string name) => _path.Length == 0 ? name : _path + "." + name;

    private static string Kind(JsonElement e) => e.ValueKind switch
    {
        JsonValueKind.Number => "a number",
        JsonValueKind.String => "a string",
        JsonValueKind.Array => "an array",
        JsonValueKind.Object => "an object",
        JsonValueKind.True or JsonValueKind.False => "a boolean",
        _ => "null",
    };

    public bool Has(string name) => _element.TryGetProperty(name, out var v) && v.ValueKind != JsonValueKind.Null;

    private JsonElement? Get(string name)
    {
        _read.Add(name);
        return _element.TryGetProperty(name, out var v) && v.ValueKind != JsonValueKind.Null ? v : null;
    }

    public JsonFields Object(string name)
        => Get(name) is { } v ? new JsonFields(_file, Field(name), v) : throw Error(Field(name), "is missing", "add the section (see the file format in docs/)");

    public JsonFields? OptionalObject(string name)
        => Get(name) is { } v ? new JsonFields(_file, Field(name), v) : null;

    public double Number(string name, double? fallback, double min, double max, bool minExclusive, string fix)
    {
        var v = Get(name);
        if (v is null)
            return fallback ?? throw Error(Field(name), "is missing", fix);
        return CheckNumber(Field(name), v.Value, min, max, minExclusive, fix);
    }

    private double CheckNumber(string field, JsonElement v, double min, double max, bool minExclusive, string fix)
    {
        if (v.ValueKind != JsonValueKind.Number || !v.TryGetDouble(out var x))
            throw Error(field, $"must be a number, got {Kind(v)}", fix);
        if (double.IsNaN(x) || double.IsInfinity(x))
            throw Error(field, "must be finite", fix);
        var low = minExclusive ? x <= min : x < min;
        if (low || x > max)
        {
            var range = minExclusive ? $"> {min.ToString("G", System.Globalization.CultureInfo.InvariantCulture)}" : $"≥ {min.ToString("G", System.Globalization.CultureInfo.InvariantCulture)}";
            var upper = double.IsPositiveInfinity(max) ? "" : $" and ≤ {max.ToString("G", System.Globalization.CultureInfo.InvariantCulture)}";
            throw Error(field, $"must be {range}{upper}, got {x.ToString("G", System.Globalization.CultureInfo.InvariantCulture)}", fix);
        }
        return x;
    }

    /// <summary>
    /// A quantity written as an SI number or as text with a unit ("65 cm"); returns the SI value, which must be
    /// finite, above <paramref name="min"/> and at most <paramref name="max"/> (SI units).
    /// </summary>
    public double? OptionalQuantity(string name, StringModes.Analysis.Units.Dimension dimension, double min, bool minExclusive, string fix, double max = double.PositiveInfinity)
    {
        var v = Get(name);
        if (v is null) return null;
        double x;
        if (v.Value.ValueKind == JsonValueKind.String)
        {
            if (!StringModes.Analysis.Units.Quantity.TryParse(Text(Field(name), v.Value), dimension, out x, out var error))
                throw Error(Field(name), error, fix);
        }
        else if (v.Value.ValueKind == JsonValueKind.Number && v.Value.TryGetDouble(out x)) { }
        else throw Error(Field(name), $"must be a number in SI units or text with a unit, got {Kind(v.Value)}", fix);
        if (!double.IsFinite(x) || (minExclusive ? x <= min : x < min) || x > max)
        {
            var ic = System.Globalization.CultureInfo.InvariantCulture;
            var unit = StringModes.Analysis.Units.Quantity.SiUnit(dimension);
            var upper = double.IsPositiveInfinity(max) ? "" : $" and ≤ {max.ToString("G", ic)} {unit}";
            var got = double.IsFinite(x) ? $", got {x.ToString("G", ic)} {unit}" : "";
            throw Error(Field(name), $"must be {(minExclusive ? ">" : "≥")} {min.ToString("G", ic)}{upper} and finite{got}", fix);
        }
        return x;
    }

    /// <summary>An optional array of [x, y] pixel points, each coordinate in [<paramref name="min"/>, <paramref name="max"/>].</summary>
    public IReadOnlyList<PixelPoint>? OptionalPoints(string name, string fix, double min = double.NegativeInfinity, double max = double.PositiveInfinity)
    {
        var v = Get(name);
        if (v is null) return null;
        if (v.Value.ValueKind != JsonValueKind.Array) throw Error(Field(name), $"must be an array of [x, y] points, got {Kind(v.Value)}", fix);
        var points = new List<PixelPoint>();
        var i = 0;
        foreach (var e in v.Value.EnumerateArray())
        {
            var field = $"{Field(name)}[{i++}]";
            if (e.ValueKind != JsonValueKind.Array || e.GetArrayLength() != 2) throw Error(field, "must be [x, y]", fix);
            var xy = e.EnumerateArray().Select(c => CheckNumber(field, c, min, max, false, fix)).ToArray();
            points.Add(new PixelPoint(xy[0], xy[1]));
        }
        return points;
    }

    public int Integer(string name, int? fallback, int min, int max, string fix)
    {
        var v = Get(name);
        if (v is null)
            return fallback ?? throw Error(Field(name), "is missing", fix);
        if (v.Value.ValueKind != JsonValueKind.Number || !v.Value.TryGetInt32(out var x))
            throw Error(Field(name), $"must be a whole number, got {Kind(v.Value)}", fix);
        if (x < min || x > max)
            throw Error(Field(name), $"must be between {min} and {max}, got {x}", fix);
        return x;
    }

    public string? OptionalString(string name)
    {
        var v = Get(name);
        if (v is null) return null;
        if (v.Value.ValueKind != JsonValueKind.String)
            throw Error(Field(name), $"must be a string, got {Kind(v.Value)}", "put the text in double quotes");
        return Text(Field(name), v.Value);
    }

    // JSON may escape half of a UTF-16 surrogate pair ("\uD800"), which is valid JSON but no text.
    private string Text(string field, JsonElement v)
    {
        try { return v.GetString() ?? ""; }
        catch (InvalidOperationException) { throw Error(field, "holds an invalid character escape (half of a \\uD800-style surrogate pair)", "retype the text"); }
    }

    public double[]? OptionalNumbers(string name, int? exactCount, double min, double max, bool minExclusive, string fix)
    {
        var v = Get(name);
        if (v is null) return null;
        if (v.Value.ValueKind != JsonValueKind.Array)
            throw Error(Field(name), $"must be an array of numbers, got {Kind(v.Value)}", fix);
        var items = v.Value.EnumerateArray().ToArray();
        if (exactCount is { } n && items.Length != n)
            throw Error(Field(name), $"must have {n} numbers, got {items.Length}", fix);
        return items.Select((e, i) => CheckNumber($"{Field(name)}[{i}]", e, min, max, minExclusive, fix)).ToArray();
    }

    public PixelPoint Point(string name, string fix)
    {
        var a = OptionalNumbers(name, 2, double.NegativeInfinity, double.PositiveInfinity, false, fix)
            ?? throw Error(Field(name), "is missing", fix);
        return new PixelPoint(a[0], a[1]);
    }

    public Rgb Colour(string name, Rgb fallback)
    {
        var a = OptionalNumbers(name, 3, 0, 255, false, "give [red, green, blue] with each 0–255");
        return a is null ? fallback : new Rgb(a[0], a[1], a[2]);
    }

    public IReadOnlyList<JsonFields> Objects(string name)
    {
        var v = Get(name);
        if (v is null) return [];
        if (v.Value.ValueKind != JsonValueKind.Array)
            throw Error(Field(name), $"must be an array of objects, got {Kind(v.Value)}", "write it as [ {...}, ... ]");
        return v.Value.EnumerateArray().Select((e, i) => new JsonFields(_file, $"{Field(name)}[{i}]", e)).ToArray();
    }

    /// <summary>Refuses fields that were never read (misspelt or unknown).</summary>
    public void RefuseUnknown()
    {
        foreach (var p in _element.EnumerateObject())
            if (!_read.Contains(p.Name))
                throw Error(Field(p.Name), "is not a known field", "check its spelling against the format in docs/ or remove it");
    }
}
