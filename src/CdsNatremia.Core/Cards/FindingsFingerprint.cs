using System.Security.Cryptography;
using System.Text;
using CdsNatremia.Core.Engine;

namespace CdsNatremia.Core.Cards;

/// <summary>
/// A stable fingerprint of what a card found, computed from the card's data, never its text: the card topic, its
/// indicator (which follows the severity band), the newest sodium result's reference (and the newest bound's), the rules
/// that spoke and every resource the card used (the implicated medicines among them). The same chart gives the same
/// fingerprint; a new result, a worse band or a new medicine gives another. Lowercase hex SHA-256; holds no patient data
/// in clear.
/// </summary>
public static class FindingsFingerprint
{
    /// <summary>The fingerprint of <paramref name="card"/> as decided in <paramref name="context"/>.</summary>
    public static string Of(Card card, DecisionContext context)
    {
        Guard.NotNull(card, nameof(card));
        Guard.NotNull(context, nameof(context));
        var parts = new List<string>
        {
            "topic=" + card.Topic,
            "indicator=" + card.Indicator,
            "sodium=" + (context.Sodium.Latest?.Reference ?? "-"),
            "bound=" + (context.Sodium.NewestBound?.Reference ?? "-"),
        };
        parts.AddRange(card.RuleIds.Distinct(StringComparer.Ordinal).Order(StringComparer.Ordinal).Select(r => "rule=" + r));
        if (card.Content is { } content)
        {
            parts.AddRange(content.All().Select(f => f.Kind).Distinct(StringComparer.Ordinal).Order(StringComparer.Ordinal).Select(k => "finding=" + k));
        }

        parts.AddRange(card.ResourcesUsed.Distinct(StringComparer.Ordinal).Order(StringComparer.Ordinal).Select(r => "used=" + r));
        return Convert.ToHexStringLower(SHA256.HashData(Encoding.UTF8.GetBytes(string.Join("\n", parts))));
    }
}
