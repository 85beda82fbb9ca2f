using System.Text;

namespace CdsNatremia.Core.Text;

/// <summary>
/// Markdown helpers for card details. Anything that came from a client (ids, free text) goes through
/// <see cref="Escape"/> so it cannot inject emphasis, links, images, tables or HTML into what a prescriber reads
/// (brackets and angle brackets are escaped, so no link or tag can form).
/// </summary>
public static class Markdown
{
    private const string Special = "\\`*_[]<>|~";

    /// <summary>Escapes Markdown and HTML control characters and folds line breaks into spaces.</summary>
    public static string Escape(string? text)
    {
        if (string.IsNullOrEmpty(text))
        {
            return string.Empty;
        }

        if (!NeedsEscape(text))
        {
            return text; // the common case: names, codes and references with nothing to escape
        }

        var builder = new StringBuilder(text.Length + 8);
        foreach (var ch in text)
        {
            if (ch is '\r' or '\n' or '\t')
            {
                builder.Append(' ');
            }
            else if (char.IsControl(ch))
            {
                continue;
            }
            else if (Special.Contains(ch, StringComparison.Ordinal))
            {
                builder.Append('\\').Append(ch);
            }
            else
            {
                builder.Append(ch);
            }
        }

        return builder.ToString();
    }

    private static bool NeedsEscape(string text)
    {
        foreach (var ch in text)
        {
            if (char.IsControl(ch) || Special.Contains(ch, StringComparison.Ordinal))
            {
                return true;
            }
        }

        return false;
    }
}
