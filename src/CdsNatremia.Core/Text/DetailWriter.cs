using System.Text;

namespace CdsNatremia.Core.Text;

/// <summary>Writes a card detail in a fixed shape: bold section headings, bullet lists and numbered steps.</summary>
public sealed class DetailWriter
{
    private StringBuilder? _buffer;
    private string? _done;

    /// <summary>Creates a writer; <paramref name="capacity"/> is a hint of the text's length.</summary>
    public DetailWriter(int capacity = 1024) => _buffer = TextBuffers.Take(capacity);

    private StringBuilder Buffer => _buffer ?? throw new InvalidOperationException("The text is finished: ToString has been called.");

    /// <summary>Writes a paragraph.</summary>
    public DetailWriter Paragraph(string text)
    {
        Separate();
        Buffer.Append(text).Append('\n');
        return this;
    }

    /// <summary>Writes a section heading and a bullet list; nothing when the list is empty.</summary>
    public DetailWriter Bullets(string heading, IEnumerable<string> items)
        => Section(heading, items.ToList(), AppendText, numbered: false);

    /// <summary>Writes a section heading and numbered steps; nothing when the list is empty.</summary>
    public DetailWriter Numbered(string heading, IEnumerable<string> items)
        => Section(heading, items.ToList(), AppendText, numbered: true);

    /// <summary>Writes a section heading and a bullet per item, each written by <paramref name="write"/> straight into the text; nothing when the list is empty.</summary>
    public DetailWriter Bullets<T>(string heading, IReadOnlyList<T> items, Action<StringBuilder, T> write)
        => Section(heading, items, write, numbered: false);

    /// <summary>Writes a section heading and a numbered step per item, each written by <paramref name="write"/>; nothing when the list is empty.</summary>
    public DetailWriter Numbered<T>(string heading, IReadOnlyList<T> items, Action<StringBuilder, T> write)
        => Section(heading, items, write, numbered: true);

    private static void AppendText(StringBuilder text, string item) => text.Append(item);

    private DetailWriter Section<T>(string heading, IReadOnlyList<T> items, Action<StringBuilder, T> write, bool numbered)
    {
        ArgumentNullException.ThrowIfNull(items);
        ArgumentNullException.ThrowIfNull(write);
        if (items.Count == 0)
        {
            return this;
        }

        Separate();
        Buffer.Append("**").Append(heading).Append("**\n\n");
        for (var i = 0; i < items.Count; i++)
        {
            if (numbered)
            {
                Buffer.Append(i + 1).Append(". ");
            }
            else
            {
                Buffer.Append("- ");
            }

            write(Buffer, items[i]);
            Buffer.Append('\n');
        }

        return this;
    }

    /// <summary>The text, trailing white space folded into one line break. It finishes the writer: its buffer is reused.</summary>
    public override string ToString()
    {
        if (_done is not null)
        {
            return _done;
        }

        var text = Buffer;
        var end = text.Length;
        while (end > 0 && char.IsWhiteSpace(text[end - 1]))
        {
            end--;
        }

        text.Length = end;
        text.Append('\n');
        _buffer = null;
        _done = TextBuffers.Return(text);
        return _done;
    }

    private void Separate()
    {
        if (Buffer.Length > 0)
        {
            Buffer.Append('\n');
        }
    }
}
