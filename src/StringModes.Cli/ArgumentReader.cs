using System.Globalization;

namespace StringModes.Cli;

/// <summary>
/// Reads one command's arguments: positionals plus <c>--name value</c>, <c>--name=value</c> and <c>--flag</c>.
/// Options are declared before use; anything undeclared is a usage error naming the option.
/// </summary>
internal sealed class ArgumentReader
{
    private readonly string _command;
    private readonly List<string> _positionals = [];
    private readonly Dictionary<string, string?> _options = new(StringComparer.Ordinal);
    private readonly HashSet<string> _known = new(StringComparer.Ordinal);

    public ArgumentReader(string command, IEnumerable<string> args, IEnumerable<string> valueOptions, IEnumerable<string> flags)
    {
        _command = command;
        var values = valueOptions.ToHashSet(StringComparer.Ordinal);
        var flagSet = flags.ToHashSet(StringComparer.Ordinal);
        _known.UnionWith(values);
        _known.UnionWith(flagSet);
        var list = args.ToList();
        for (var i = 0; i < list.Count; i++)
        {
            var a = list[i];
            if (a == "--")
            {
                _positionals.AddRange(list.Skip(i + 1));
                break;
            }
            if (!a.StartsWith("--", StringComparison.Ordinal) || a.Length == 2)
            {
                _positionals.Add(a);
                continue;
            }
            var eq = a.IndexOf('=');
            var name = eq > 0 ? a[2..eq] : a[2..];
            if (flagSet.Contains(name))
            {
                if (eq > 0) throw Usage($"--{name} takes no value");
                _options[name] = null;
            }
            else if (values.Contains(name))
            {
                string value;
                if (eq > 0) value = a[(eq + 1)..];
                else if (i + 1 < list.Count) value = list[++i];
                else throw Usage($"--{name} needs a value");
                if (_options.ContainsKey(name)) throw Usage($"--{name} is given twice");
                _options[name] = value;
            }
            else
            {
                throw Usage($"unknown option --{name}; see 'stringmodes {_command} --help'");
            }
        }
    }

    public IReadOnlyList<string> Positionals => _positionals;

    public bool Flag(string name) => _options.ContainsKey(name);

    public string? Value(string name) => _options.TryGetValue(name, out var v) ? v : null;

    public double? Number(string name, double min, double max)
    {
        var text = Value(name);
        if (text is null) return null;
        if (!double.TryParse(text, NumberStyles.Float, CultureInfo.InvariantCulture, out var x) || !double.IsFinite(x))
            throw Usage($"--{name} must be a finite number, got '{text}'{SeeHelp}");
        if (x < min || x > max)
            throw Usage($"--{name} must be between {min.ToString(CultureInfo.InvariantCulture)} and {max.ToString(CultureInfo.InvariantCulture)}, got {text}{SeeHelp}");
        return x;
    }

    public long? Integer(string name, long min, long max)
    {
        var text = Value(name);
        if (text is null) return null;
        if (!long.TryParse(text, NumberStyles.Integer, CultureInfo.InvariantCulture, out var x))
            throw Usage($"--{name} must be a whole number, got '{text}'{SeeHelp}");
        if (x < min || x > max) throw Usage($"--{name} must be between {min} and {max}, got {text}{SeeHelp}");
        return x;
    }

    private string SeeHelp => $"; see 'stringmodes {_command} --help'";

    public CliException Usage(string message) => new(ExitCodes.Usage, $"stringmodes {_command}: {message}");
}
