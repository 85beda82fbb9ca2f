using CdsNatremia.Core.Engine;

namespace CdsNatremia.Core.Cards;

/// <summary>
/// Which suggestions a card offers and which it recommends, applied once to every card by the engine so that a
/// suggestion means something (alert fatigue: clinicians override what they cannot read in seconds).
/// <list type="bullet">
/// <item>Suggestions are ordered: a recommended suggestion before one that is only offered; within each, the producer's
/// own card-specific actions (remove or keep a draft order) first, then laboratory tests in the order of
/// <see cref="LabOrderUsefulness"/>.</item>
/// <item>At most <see cref="MaxRecommended"/> suggestions keep <c>isRecommended: true</c>: the most useful ones that the
/// rules recommended; the others are still offered, not recommended. A rule never gains a recommendation here.</item>
/// <item>On a chart opening (patient-view) a card shows at most <see cref="MaxOnChartOpening"/> suggestions; the tests not
/// offered there stay named in the card's text.</item>
/// </list>
/// The order and the limits are a local choice (common practice for the hyponatremia work-up: the sodium itself first
/// when it is stale or unreadable, then serum osmolality to establish tonicity, then the urine studies that separate the
/// causes, then the SIADH exclusions).
/// </summary>
public static class SuggestionPolicy
{
    /// <summary>The most suggestions a card marks as recommended.</summary>
    public const int MaxRecommended = 2;

    /// <summary>The most suggestions a card offers on a chart opening (patient-view).</summary>
    public const int MaxOnChartOpening = 3;

    /// <summary>
    /// Laboratory tests by usefulness, most useful first (LOINC codes, as in <see cref="Assessment.LabOrders"/>):
    /// serum sodium (a recheck when the latest is stale, unreadable or a bound), blood-gas sodium, serum osmolality,
    /// glucose, urine osmolality, urine sodium, cortisol, TSH, potassium, triglyceride, total protein.
    /// </summary>
    public static IReadOnlyList<string> LabOrderUsefulness { get; } =
        ["2951-2", "2947-0", "2692-2", "2345-7", "2695-5", "2955-3", "2143-6", "3016-3", "2823-3", "2571-8", "2885-2"];

    /// <summary>Returns the card with its suggestions ordered, recommendations capped and, on patient-view, the list capped.</summary>
    public static Card Apply(Card card, HookKind hook)
    {
        Guard.NotNull(card, nameof(card));
        if (card.Suggestions.Count == 0)
        {
            return card;
        }

        var ordered = card.Suggestions
            .Select((s, index) => (s, index))
            .OrderBy(x => x.s.IsRecommended == true ? 0 : 1)
            .ThenBy(x => Rank(x.s))
            .ThenBy(x => x.index)
            .Select(x => x.s)
            .ToList();
        var recommended = 0;
        for (var i = 0; i < ordered.Count; i++)
        {
            if (ordered[i].IsRecommended == true && ++recommended > MaxRecommended)
            {
                ordered[i] = ordered[i] with { IsRecommended = false };
            }
        }

        if (HookDefinitions.Of(hook).ChartOpening && ordered.Count > MaxOnChartOpening)
        {
            ordered = ordered.Take(MaxOnChartOpening).ToList();
        }

        return card with { Suggestions = ordered };
    }

    /// <summary>0 for a card-specific action; 1 + the position in <see cref="LabOrderUsefulness"/> for a test; last for an unknown test.</summary>
    private static int Rank(Suggestion suggestion)
    {
        if (!suggestion.Key.StartsWith(LabKeyPrefix, StringComparison.Ordinal))
        {
            return 0;
        }

        var position = LabOrderUsefulness.ToList().IndexOf(suggestion.Key[LabKeyPrefix.Length..]);
        return position < 0 ? LabOrderUsefulness.Count + 1 : position + 1;
    }

    private const string LabKeyPrefix = "order-";
}
