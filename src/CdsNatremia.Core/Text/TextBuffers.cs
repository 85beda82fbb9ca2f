using System.Text;

namespace CdsNatremia.Core.Text;

/// <summary>
/// One reusable <see cref="StringBuilder"/> per thread for each of two sizes (a phrase, a report), so rendering does
/// not allocate a new buffer for every phrase and every report. A buffer is taken for the length of one text and given
/// back with its string; a nested text (a phrase citing a result while another phrase is being written) finds the
/// slot empty and gets a new buffer. Only buffers up to <see cref="MaxKept"/> characters are kept.
/// </summary>
internal static class TextBuffers
{
    /// <summary>The size up to which a buffer counts as a phrase's.</summary>
    public const int PhraseSize = 512;

    /// <summary>The largest buffer kept for reuse (characters).</summary>
    public const int MaxKept = 64 * 1024;

    [ThreadStatic]
    private static StringBuilder? _phrase;

    [ThreadStatic]
    private static StringBuilder? _report;

    /// <summary>A cleared buffer of at least <paramref name="capacity"/> characters.</summary>
    public static StringBuilder Take(int capacity)
    {
        var small = capacity <= PhraseSize;
        var kept = small ? _phrase : _report;
        if (kept is not null && kept.Capacity >= capacity)
        {
            if (small)
            {
                _phrase = null;
            }
            else
            {
                _report = null;
            }

            kept.Clear();
            return kept;
        }

        return new StringBuilder(capacity);
    }

    /// <summary>The buffer's text; the buffer is kept for the next text on this thread.</summary>
    public static string Return(StringBuilder buffer)
    {
        var text = buffer.ToString();
        if (buffer.Capacity <= MaxKept)
        {
            if (buffer.Capacity <= PhraseSize * 4)
            {
                _phrase = buffer;
            }
            else
            {
                _report = buffer;
            }
        }

        return text;
    }
}
