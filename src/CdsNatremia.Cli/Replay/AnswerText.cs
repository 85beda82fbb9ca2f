using System.Globalization;
using System.Text.Json.Nodes;
using System.Text.RegularExpressions;

namespace CdsNatremia.Cli.Replay;

/// <summary>The readable text of an answer's cards (summary, detail, suggestion and link labels), and small readers over it.</summary>
internal sealed partial class AnswerText
{
    public AnswerText(ReplayResult result)
    {
        ArgumentNullException.ThrowIfNull(result);
        Cards = result.Cards.OfType<JsonObject>().ToList();
        Assessment = result.AssessmentCard;
        All = string.Join("\n\n", Cards.Select(Text));
    }

    /// <summary>The cards of the answer.</summary>
    public IReadOnlyList<JsonObject> Cards { get; }

    /// <summary>The sodium assessment card, or null.</summary>
    public JsonObject? Assessment { get; }

    /// <summary>Every card's text, one after the other.</summary>
    public string All { get; }

    /// <summary>A card's summary, detail, suggestion labels and link labels.</summary>
    public static string Text(JsonObject card)
    {
        ArgumentNullException.ThrowIfNull(card);
        var parts = new List<string?> { (string?)card["summary"], (string?)card["detail"], Report(card) };
        parts.AddRange((card["suggestions"] as JsonArray ?? []).OfType<JsonObject>().Select(s => (string?)s["label"]));
        parts.AddRange((card["links"] as JsonArray ?? []).OfType<JsonObject>().Select(l => (string?)l["label"]));
        return string.Join("\n", parts.Where(p => p is not null));
    }

    /// <summary>The card's full report (Markdown) from its findings extension, or null.</summary>
    public static string? Report(JsonObject card)
        => (string?)card?["extension"]?["cdsnatremia-findings"]?["report"];

    /// <summary>True when <paramref name="words"/> appear in the cards (case-insensitive).</summary>
    public bool Mentions(string words) => All.Contains(words, StringComparison.OrdinalIgnoreCase);

    /// <summary>True when the number appears in the cards as a number of its own ("12.7" in "+12.7 mmol/L", not in "112.7").</summary>
    public bool MentionsNumber(double value) => ContainsNumber(All, value);

    /// <summary>True when the number appears in <paramref name="text"/> as a number of its own.</summary>
    public static bool ContainsNumber(string text, double value)
        => NumberToken().Matches(text).Any(m => double.TryParse(m.Value, NumberStyles.Float, CultureInfo.InvariantCulture, out var n) && Math.Abs(n - value) < 1e-9);

    /// <summary>The first number captured by <paramref name="pattern"/> in the cards' text, or null.</summary>
    public double? Number(Regex pattern)
    {
        ArgumentNullException.ThrowIfNull(pattern);
        var match = pattern.Match(All);
        return match.Success && double.TryParse(match.Groups[1].Value, NumberStyles.Float, CultureInfo.InvariantCulture, out var n) ? n : null;
    }

    /// <summary>The "Data set aside" section of the cards' details (up to the next bold heading line), or empty.</summary>
    public string SetAsideSection()
    {
        var sections = Cards.Select(c => Report(c) ?? (string?)c["detail"] ?? string.Empty)
            .Select(d => SetAside().Match(d))
            .Where(m => m.Success)
            .Select(m => m.Groups[1].Value);
        return string.Join("\n", sections);
    }

    [GeneratedRegex(@"(?<![\d.])-?\d+(?:\.\d+)?(?![\d])")]
    private static partial Regex NumberToken();

    [GeneratedRegex(@"\*\*Data set aside[^\n]*\n([\s\S]*?)(?=\n\*\*[A-Z]|\z)")]
    private static partial Regex SetAside();
}
