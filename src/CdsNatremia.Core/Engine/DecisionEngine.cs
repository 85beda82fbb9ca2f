using CdsNatremia.Core.Cards;
using CdsNatremia.Core.Findings;
using CdsNatremia.Core.Rendering;
using CdsNatremia.Core.Knowledge;

namespace CdsNatremia.Core.Engine;

/// <summary>
/// Runs the card producers the hook's definition names (<see cref="HookDefinition.Producers"/>), in registration order, and returns their cards, most urgent first:
/// critical before warning before info; among cards of the same urgency, a safety card (correction rate, order warning)
/// before the work-up card, so a critical correction-rate card is never preceded by the work-up. Ties keep registration
/// order. Pure and thread-safe: it holds only immutable options and knowledge.
/// </summary>
public sealed class DecisionEngine
{
    private readonly IReadOnlyList<ICardProducer> _producers;
    private readonly RuleOptions _options;
    private readonly KnowledgeBase _knowledge;
    private readonly TimeZoneInfo _displayZone;

    /// <summary>Creates the engine; <paramref name="displayZone"/> is the zone cards print times in (default UTC).</summary>
    public DecisionEngine(IEnumerable<ICardProducer> producers, RuleOptions options, KnowledgeBase knowledge, TimeZoneInfo? displayZone = null)
    {
        _displayZone = displayZone ?? TimeZoneInfo.Utc;
        _producers = Guard.NotNull(producers, nameof(producers)).ToArray();
        _options = Guard.NotNull(options, nameof(options));
        _knowledge = Guard.NotNull(knowledge, nameof(knowledge));
    }

    /// <summary>The producers, in order.</summary>
    public IReadOnlyList<ICardProducer> Producers => _producers;

    /// <summary>Decides which cards to show.</summary>
    public IReadOnlyList<Card> Decide(DecisionRequest request)
    {
        var context = new DecisionContext(request, _options, _knowledge, _displayZone);
        var hook = HookDefinitions.Of(request.Hook);
        var produced = new List<Card>();
        foreach (var producer in _producers)
        {
            if (hook.Runs(producer))
            {
                produced.AddRange(producer.Produce(context));
            }
        }

        // Most urgent first; a safety card before the work-up; ties keep the order produced (the index breaks them).
        var order = new int[produced.Count];
        for (var i = 0; i < order.Length; i++)
        {
            order[i] = i;
        }

        Array.Sort(order, (a, b) =>
        {
            var byIndicator = ((int)produced[b].Indicator).CompareTo((int)produced[a].Indicator);
            if (byIndicator != 0)
            {
                return byIndicator;
            }

            var byKind = WorkupLast(produced[a]).CompareTo(WorkupLast(produced[b]));
            return byKind != 0 ? byKind : a.CompareTo(b);
        });

        var cards = new List<Card>(order.Length);
        foreach (var index in order)
        {
            cards.Add(Finish(produced[index], context));
        }

        return cards;
    }

    /// <summary>
    /// The steps every card passes through once: suggestions ordered and capped (<see cref="SuggestionPolicy"/>) and the
    /// override reasons of its kind (<see cref="OverrideReasonChoice"/>) and the findings fingerprint (<see cref="FindingsFingerprint"/>).
    /// </summary>
    private Card Finish(Card card, DecisionContext context)
    {
        var rendered = Render(card, context);
        return SuggestionPolicy.Apply(rendered, context.Request.Hook) with
        {
            OverrideReasons = OverrideReasonChoice.For(rendered.Topic, _knowledge),
            Fingerprint = FindingsFingerprint.Of(rendered, context),
        };
    }

    /// <summary>
    /// Renders the card's findings once: the summary and short detail (<see cref="CardRenderer"/>) and the full report
    /// (<see cref="ReportRenderer"/>). A child's caution is added here, to every card, in one place.
    /// </summary>
    private static Card Render(Card card, DecisionContext context)
    {
        if (card.Content is not { } content)
        {
            return card with { Report = card.Report.Length > 0 ? card.Report : card.Detail };
        }

        var age = context.Request.Facts.AgeAt(context.Request.Now);
        var adultFrom = context.Options.Severity.AdultFromAgeYears;
        if (age < adultFrom)
        {
            content = content with
            {
                Cautions = [Finding.Of(FindingKind.PaediatricCautionShort, Slot.Count("age", age.Value)), .. content.Cautions],
                Steps = [.. content.Steps, SafetyCautions.Paediatric(age.Value, adultFrom)],
            };
        }

        var render = new RenderContext(context.Request.Facts, context.Display);
        return card with
        {
            Content = content,
            Summary = CardRenderer.Summary(content, render),
            Detail = CardRenderer.Detail(content, render),
            Report = ReportRenderer.Render(content, render),
        };
    }

    /// <summary>How this engine shows times for a request at <paramref name="now"/> (its display zone).</summary>
    public Text.TimeDisplay DisplayAt(DateTimeOffset now) => new(_displayZone, now);

    /// <summary>0 for a safety card, 1 for the work-up (sodium assessment) card.</summary>
    private static int WorkupLast(Card card) => string.Equals(card.Topic, "sodium-assessment", StringComparison.Ordinal) ? 1 : 0;
}
