using CdsNatremia.Core.Cards;

namespace CdsNatremia.Core.Assessment;

/// <summary>
/// Collects what the work-up rules say about one patient before it becomes the assessment card.
/// Not thread-safe: one builder per request.
/// </summary>
public sealed class AssessmentBuilder
{
    private readonly List<(int Priority, string Text)> _summaryActions = [];

    /// <summary>Key findings, shown first.</summary>
    public List<string> Findings { get; } = [];

    /// <summary>Reasoning steps, numbered, each naming the data it used.</summary>
    public List<string> Steps { get; } = [];

    /// <summary>Possible causes to consider.</summary>
    public List<string> Differential { get; } = [];

    /// <summary>What to do next (advice for the clinician, never an order).</summary>
    public List<string> NextSteps { get; } = [];

    /// <summary>Orderable suggestions (missing tests).</summary>
    public List<Suggestion> Suggestions { get; } = [];

    /// <summary>Sources cited by the steps.</summary>
    public SortedSet<string> Sources { get; } = new(StringComparer.Ordinal);

    /// <summary>Rules that contributed.</summary>
    public List<string> RuleIds { get; } = [];

    /// <summary>Resources the reasoning used.</summary>
    public SortedSet<string> ResourcesUsed { get; } = new(StringComparer.Ordinal);

    /// <summary>Separate cards a rule raises where something is urgent (e.g. a critical correction-rate card).</summary>
    public List<Card> ExtraCards { get; } = [];

    private CardIndicator _raised = CardIndicator.Info;
    private CardIndicator _ceiling = CardIndicator.Critical;

    /// <summary>The card's indicator so far: the highest raised, but never above a ceiling a rule set.</summary>
    public CardIndicator Indicator => _raised > _ceiling ? _ceiling : _raised;

    /// <summary>
    /// Set when the low sodium is shown not to be hypotonic (hypertonic): the short evidence the summary leads with, e.g.
    /// "osmolality 305 mOsm/kg". The card then opens with "Not hypotonic", and its indicator is capped at warning: the
    /// correction limits of hypotonic hyponatremia do not apply and it is not an emergency low-sodium card.
    /// </summary>
    public string? NotHypotonicEvidence { get; private set; }

    /// <summary>Marks the card as not hypotonic (see <see cref="NotHypotonicEvidence"/>); the first call wins.</summary>
    public void MarkNotHypotonic(string evidence) => NotHypotonicEvidence ??= evidence;

    /// <summary>The indicator the card carries: <see cref="Indicator"/>, capped at warning when not hypotonic.</summary>
    public CardIndicator FinalIndicator => NotHypotonicEvidence is not null && Indicator > CardIndicator.Warning ? CardIndicator.Warning : Indicator;

    /// <summary>Raises the indicator; never lowers it.</summary>
    public void Raise(CardIndicator indicator)
    {
        if (indicator > _raised)
        {
            _raised = indicator;
        }
    }

    /// <summary>
    /// Sets a ceiling on the indicator (e.g. a stale result gives at most a warning: recheck first); the lowest ceiling wins.
    /// </summary>
    public void LimitTo(CardIndicator ceiling)
    {
        if (ceiling < _ceiling)
        {
            _ceiling = ceiling;
        }
    }

    /// <summary>Offers the short "what to do" clause of the summary; the highest priority wins, ties go to the first.</summary>
    public void OfferSummaryAction(int priority, string text) => _summaryActions.Add((priority, text));

    /// <summary>The chosen summary clause, or null.</summary>
    public string? SummaryAction => _summaryActions.Count == 0
        ? null
        : _summaryActions.OrderByDescending(a => a.Priority).First().Text;

    /// <summary>Adds a suggestion unless one with the same key is already there.</summary>
    public void Suggest(Suggestion suggestion)
    {
        if (Suggestions.All(s => !string.Equals(s.Key, suggestion.Key, StringComparison.Ordinal)))
        {
            Suggestions.Add(suggestion);
        }
    }
}
