using CdsNatremia.Core.Cards;

namespace CdsNatremia.Service.Security;

/// <summary>
/// What an endpoint may add to the request log line: counts and identifiers of the service's own making (rule ids),
/// never anything taken from the patient's data.
/// </summary>
internal static class RequestLogItems
{
    public const string RuleIds = "natremia.ruleIds";

    public const string CardCount = "natremia.cardCount";

    /// <summary>Notes the cards issued: how many, and the ids of the rules that produced them.</summary>
    public static void NoteCards(HttpContext context, IReadOnlyList<Card> cards)
    {
        ArgumentNullException.ThrowIfNull(context);
        ArgumentNullException.ThrowIfNull(cards);
        context.Items[CardCount] = cards.Count;
        context.Items[RuleIds] = string.Join(",", cards.SelectMany(c => c.RuleIds).Distinct(StringComparer.Ordinal).Order(StringComparer.Ordinal));
    }
}
