using System.Text;

namespace StringModes.Reporting.Html;

/// <summary>HTML escaping for text and attribute values (the five characters with meaning in markup).</summary>
public static class HtmlText
{
    /// <summary>Escapes &amp;, &lt;, &gt;, " and ' so any text is safe inside elements and quoted attributes.</summary>
    public static string Escape(string? text)
    {
        if (string.IsNullOrEmpty(text))
        {
            return "";
        }

        var sb = new StringBuilder(text.Length + 16);
        foreach (var c in text)
        {
            sb.Append(c switch
            {
                '&' => "&amp;",
                '<' => "&lt;",
                '>' => "&gt;",
                '"' => "&quot;",
                '\'' => "&#39;",
                _ => c.ToString(),
            });
        }

        return sb.ToString();
    }
}
