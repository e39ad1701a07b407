using System.Globalization;
using System.Text;

namespace StringModes.Video.Files;

/// <summary>An input file (scene, rig, clip) that cannot be used. The message is one line naming the file, the field and the fix.</summary>
public sealed class InputFileException(string message) : Exception(OneLine(message))
{
    /// <summary>
    /// <paramref name="message"/> with line breaks and other control characters shown as escapes (\n, \u0007):
    /// messages quote what users wrote — file names, field names, values — and those may hold a newline.
    /// </summary>
    public static string OneLine(string message)
    {
        if (!message.Any(Breaks)) return message;
        var s = new StringBuilder(message.Length + 16);
        foreach (var c in message)
        {
            s.Append(c switch
            {
                '\n' => "\\n",
                '\r' => "\\r",
                '\t' => "\\t",
                _ when Breaks(c) => "\\u" + ((int)c).ToString("X4", CultureInfo.InvariantCulture),
                _ => c.ToString(),
            });
        }
        return s.ToString();
    }

    private static bool Breaks(char c) => char.IsControl(c)
        || char.GetUnicodeCategory(c) is UnicodeCategory.LineSeparator or UnicodeCategory.ParagraphSeparator;
}
