using System.Collections;
using System.Reflection;

namespace StringModes.Analysis.Tests.TestData;

/// <summary>Walks a result object graph and lists every double that is NaN or infinite, with its path.</summary>
internal static class FiniteScan
{
    public static IReadOnlyList<string> NonFinite(object? root)
    {
        var found = new List<string>();
        Visit(root, "result", found, 0);
        return found;
    }

    private static void Visit(object? value, string path, List<string> found, int depth)
    {
        if (value is null || depth > 8) return;
        switch (value)
        {
            case double d:
                if (!double.IsFinite(d)) found.Add($"{path} = {d}");
                return;
            case string or bool or int or Enum:
                return;
            case double[,] grid:
                foreach (var d in grid) if (!double.IsFinite(d)) { found.Add($"{path}[..] = {d}"); return; }
                return;
            case IEnumerable items:
                var i = 0;
                foreach (var item in items) Visit(item, $"{path}[{i++}]", found, depth + 1);
                return;
        }
        var type = value.GetType();
        if (type.Namespace is null || !type.Namespace.StartsWith("StringModes", StringComparison.Ordinal)) return;
        foreach (var p in type.GetProperties(BindingFlags.Public | BindingFlags.Instance))
        {
            if (p.GetIndexParameters().Length > 0) continue;
            Visit(p.GetValue(value), $"{path}.{p.Name}", found, depth + 1);
        }
    }
}
