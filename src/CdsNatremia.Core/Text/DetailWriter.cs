using System.Text;

namespace CdsNatremia.Core.Text;

/// <summary>Writes a card detail in a fixed shape: bold section headings, bullet lists and numbered steps.</summary>
public sealed class DetailWriter
{
    private readonly StringBuilder _text = new();

    /// <summary>Writes a paragraph.</summary>
    public DetailWriter Paragraph(string text)
    {
        Separate();
        _text.Append(text).Append('\n');
        return this;
    }

    /// <summary>Writes a section heading and a bullet list; nothing when the list is empty.</summary>
    public DetailWriter Bullets(string heading, IEnumerable<string> items)
    {
        var list = items.ToList();
        if (list.Count == 0)
        {
            return this;
        }

        Separate();
        _text.Append("**").Append(heading).Append("**\n\n");
        foreach (var item in list)
        {
            _text.Append("- ").Append(item).Append('\n');
        }

        return this;
    }

    /// <summary>Writes a section heading and numbered steps; nothing when the list is empty.</summary>
    public DetailWriter Numbered(string heading, IEnumerable<string> items)
    {
        var list = items.ToList();
        if (list.Count == 0)
        {
            return this;
        }

        Separate();
        _text.Append("**").Append(heading).Append("**\n\n");
        for (var i = 0; i < list.Count; i++)
        {
            _text.Append(i + 1).Append(". ").Append(list[i]).Append('\n');
        }

        return this;
    }

    /// <inheritdoc />
    public override string ToString() => _text.ToString().TrimEnd() + "\n";

    private void Separate()
    {
        if (_text.Length > 0)
        {
            _text.Append('\n');
        }
    }
}
