using CdsNatremia.Core.Cards;
using CdsNatremia.Core.Findings;

namespace CdsNatremia.Core.Assessment;

/// <summary>
/// Collects the findings the work-up rules reach about one patient before they become the assessment card's
/// <see cref="CardContent"/>. Rules add findings (typed data), never sentences; the renderers word them.
/// Not thread-safe: one builder per request.
/// </summary>
public sealed class AssessmentBuilder
{
    private readonly List<(int Priority, Finding Action)> _summaryActions = [];

    /// <summary>Key findings: the patient-specific reasons the short card chooses from (by weight).</summary>
    public List<Finding> Findings { get; } = [];

    /// <summary>Reasoning steps, each naming the data it used (full report).</summary>
    public List<Finding> Steps { get; } = [];

    /// <summary>Possible causes to consider (full report).</summary>
    public List<Finding> Differential { get; } = [];

    /// <summary>What to do next (advice for the clinician, never an order); the card shows the most urgent.</summary>
    public List<Finding> NextSteps { get; } = [];

    /// <summary>Cautions that depend on this patient (high risk, acute, stale): all shown on the card.</summary>
    public List<Finding> Cautions { get; } = [];

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
    /// Set when the low sodium is shown not to be hypotonic (hypertonic): the evidence the summary leads with (e.g. the
    /// osmolality). The card then opens with "Not hypotonic", and its indicator is capped at warning: the correction
    /// limits of hypotonic hyponatremia do not apply and it is not an emergency low-sodium card.
    /// </summary>
    public Finding? NotHypotonicEvidence { get; private set; }

    /// <summary>Marks the card as not hypotonic (see <see cref="NotHypotonicEvidence"/>); the first call wins.</summary>
    public void MarkNotHypotonic(Finding evidence) => NotHypotonicEvidence ??= evidence;

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
    public void OfferSummaryAction(int priority, Finding action) => _summaryActions.Add((priority, action));

    /// <summary>The chosen summary clause, or null.</summary>
    public Finding? SummaryAction => _summaryActions.Count == 0
        ? null
        : _summaryActions.OrderByDescending(a => a.Priority).First().Action;

    /// <summary>Adds a suggestion unless one with the same key is already there.</summary>
    public void Suggest(Suggestion suggestion)
    {
        if (Suggestions.All(s => !string.Equals(s.Key, suggestion.Key, StringComparison.Ordinal)))
        {
            Suggestions.Add(suggestion);
        }
    }
}
