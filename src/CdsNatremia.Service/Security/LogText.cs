namespace CdsNatremia.Service.Security;

/// <summary>Makes caller-supplied text safe for a log line: control characters replaced (no forged lines), length capped.</summary>
internal static class LogText
{
    public static string Clip(string? text, int max = 80)
    {
        if (string.IsNullOrEmpty(text))
        {
            return "(none)";
        }

        var clipped = text.Length <= max ? text : text[..max] + "…";
        return string.Create(clipped.Length, clipped, (span, source) =>
        {
            for (var i = 0; i < source.Length; i++)
            {
                span[i] = char.IsControl(source[i]) ? '?' : source[i];
            }
        });
    }
}
