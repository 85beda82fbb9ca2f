namespace CdsNatremia.Core.Cards;

/// <summary>CDS Hooks requires a card summary under 140 characters; this keeps every summary inside it.</summary>
public static class Summary
{
    /// <summary>The longest summary the service sends (the standard says "less than 140 characters").</summary>
    public const int MaxLength = 139;

    /// <summary>Returns the text, cut at a word boundary with an ellipsis if it is too long.</summary>
    public static string Fit(string text)
    {
        Guard.NotNull(text, nameof(text));
        var trimmed = text.Trim();
        if (trimmed.Length <= MaxLength)
        {
            return trimmed;
        }

        var cut = trimmed[..(MaxLength - 1)];
        var space = cut.LastIndexOf(' ');
        if (space > MaxLength / 2)
        {
            cut = cut[..space];
        }

        return cut.TrimEnd(',', ';', ':', ' ') + "…";
    }
}
