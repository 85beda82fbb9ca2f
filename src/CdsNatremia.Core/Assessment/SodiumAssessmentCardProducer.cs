using CdsNatremia.Core.Cards;
using CdsNatremia.Core.Engine;
using CdsNatremia.Core.Facts;
using CdsNatremia.Core.Findings;
using CdsNatremia.Core.Sodium;
using CdsNatremia.Core.Text;

namespace CdsNatremia.Core.Assessment;

/// <summary>
/// The one assessment card per request. A normal or high sodium gives no card (no alert noise; high sodium is out of
/// scope), unless a newer sodium could not be read (<see cref="ImperfectSodiumCards.NewestUnreadable"/>). A newest sodium
/// that is a bound gets <see cref="ImperfectSodiumCards.Bounded"/>. A low sodium runs the work-up rules in order and
/// composes their output. When no sodium could be used but some were received, an info card says what was set aside and
/// why, and gives no advice on it.
/// </summary>
public sealed class SodiumAssessmentCardProducer : ICardProducer
{
    private readonly IReadOnlyList<IAssessmentRule> _rules;

    /// <summary>Creates the producer with the work-up rules to run.</summary>
    public SodiumAssessmentCardProducer(IReadOnlyList<IAssessmentRule> rules) => _rules = Guard.NotNull(rules, nameof(rules));

    /// <inheritdoc />
    public string RuleId => "sodium.assessment";

    /// <inheritdoc />
    public IEnumerable<Card> Produce(DecisionContext context)
    {
        Guard.NotNull(context, nameof(context));
        var latest = context.Sodium.Latest;
        if (context.Sodium.NewestBound is { } bound)
        {
            // A bound (e.g. "<100") newer than any measurement is reasoned with, never computed with.
            return ImperfectSodiumCards.Bounded(context, bound, RuleId) is { } boundedCard ? [boundedCard] : [];
        }

        if (latest is null)
        {
            return UnusableOnly(context);
        }

        var band = context.Thresholds.Classify(latest.Value);
        if (band is SeverityBand.Normal or SeverityBand.AboveRange)
        {
            // Never silent when the newest sodium could not be read: "no card" would read as "sodium is fine".
            return context.Sodium.NewerUnreadable.Count > 0 ? [ImperfectSodiumCards.NewestUnreadable(context, latest, RuleId)] : [];
        }

        var builder = new AssessmentBuilder();
        foreach (var rule in _rules)
        {
            rule.Apply(context, builder);
        }

        if (context.Request.Facts.SodiumHistoryUnavailable is { } history)
        {
            builder.Steps.Add(ImperfectSodiumCards.HistoryStep(history));
            builder.Findings.Add(Finding.Of(FindingKind.HistoryUnavailable).Weighted(Weights.DataGap));
        }

        return [Compose(context, latest, band, builder), .. builder.ExtraCards];
    }

    private Card Compose(DecisionContext context, LabResult latest, SeverityBand band, AssessmentBuilder builder)
    {
        var thresholds = context.Thresholds;
        var action = builder.SummaryAction ?? Finding.Of(FindingKind.ActionReview);
        var sodiumSlots = new[]
        {
            Slot.Number("sodium", latest.Value),
            Slot.Text("band", thresholds.NameOf(band)),
            Slot.Time("age", latest.EffectiveAt, TimeStyle.Age),
            Slot.Time("when", latest.EffectiveAt, TimeStyle.AgeAndTime),
            Slot.Time("time", latest.EffectiveAt),
            Slot.Phrase("action", action),
        };

        // Tonicity decides the summary's opening: a hypertonic low sodium is "not hypotonic" first, never a low-sodium emergency.
        // That summary names the evidence and the likely osmole, so it carries the result's age only (the time is in the detail).
        var summary = builder.NotHypotonicEvidence is { } evidence
            ? Finding.Of(latest.IsPreliminary ? FindingKind.SummaryNotHypotonicPreliminary : FindingKind.SummaryNotHypotonic, [.. sodiumSlots, Slot.Phrase("evidence", evidence)])
            : Finding.Of(latest.IsPreliminary ? FindingKind.SummaryLowPreliminary : FindingKind.SummaryLow, sodiumSlots);
        var headline = Finding.Of(
            builder.NotHypotonicEvidence is null ? FindingKind.HeadlineLow : FindingKind.HeadlineNotHypotonic,
            sodiumSlots).RestingOn(latest.Reference);

        var content = new CardContent
        {
            Summary = summary,
            Headline = headline,
            Reasons = builder.Findings,
            Steps = builder.Steps,
            Causes = builder.Differential,
            NextSteps = builder.NextSteps,
            Cautions = builder.Cautions,
            Sources = [.. builder.Sources],
        };

        return new Card
        {
            Content = content,
            Indicator = builder.FinalIndicator,
            Topic = "sodium-assessment",
            RuleIds = [RuleId, .. builder.RuleIds],
            ResourcesUsed = [.. builder.ResourcesUsed],
            Suggestions = builder.Suggestions,
            SelectionBehavior = SelectionBehavior.Any,
        };
    }

    private IEnumerable<Card> UnusableOnly(DecisionContext context)
    {
        var facts = context.Request.Facts;
        var sodiumSetAside = facts.SetAside.Where(s => s.Analyte == Analyte.Sodium && s.State != FactState.NotThisPatient).ToList();
        var anotherPatients = facts.SetAside.Count(s => s.Analyte == Analyte.Sodium && s.State == FactState.NotThisPatient);
        if (sodiumSetAside.Count == 0 && anotherPatients == 0)
        {
            return [];
        }

        // Another patient's results are only counted (in the footer): they never shape the summary.
        var count = Slot.Count("count", sodiumSetAside.Count);
        var content = new CardContent
        {
            Summary = Finding.Of(sodiumSetAside.Count > 0 ? FindingKind.UnusableSummary : FindingKind.UnusableOnlyOthersSummary, count),
            Headline = Finding.Of(sodiumSetAside.Count > 0 ? FindingKind.UnusableHeadline : FindingKind.UnusableOnlyOthersHeadline, count),
            NextSteps = [Finding.Of(FindingKind.UnusableNext)],
            Sources = [],
        };
        return
        [
            new Card
            {
                Content = content,
                Indicator = CardIndicator.Info,
                Topic = "sodium-assessment",
                RuleIds = [RuleId, "sodium.unusable"],
                ResourcesUsed = [],
                Suggestions = [LabOrders.AsSuggestion(LabOrders.SerumSodium(LabOrders.Why(FindingKind.AssessmentUnusableOrder)), recommended: false)],
            },
        ];
    }
}
