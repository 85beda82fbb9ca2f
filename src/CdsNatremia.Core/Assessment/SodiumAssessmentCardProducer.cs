using CdsNatremia.Core.Cards;
using CdsNatremia.Core.Engine;
using CdsNatremia.Core.Facts;
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
            builder.Findings.Add("Sodium history was not available: onset, correction rate and drug timing could not be checked.");
        }

        return [Compose(context, latest, band, builder), .. builder.ExtraCards];
    }

    private Card Compose(DecisionContext context, LabResult latest, SeverityBand band, AssessmentBuilder builder)
    {
        var thresholds = context.Thresholds;
        var labels = latest.IsPreliminary ? ", preliminary" : string.Empty;
        // Tonicity decides the summary's opening: a hypertonic low sodium is "not hypotonic" first, never a low-sodium emergency.
        // That summary names the evidence and the likely osmole, so it carries the result's age only (the time is in the detail).
        var summary = Summary.Fit(builder.NotHypotonicEvidence is { } evidence
            ? Invariant.Format(
                $"Not hypotonic: sodium {Invariant.Number(latest.Value)} mmol/L ({thresholds.NameOf(band)} range{labels}, {context.Display.Age(latest.EffectiveAt)}) with {evidence} — {builder.SummaryAction ?? "review"}.")
            : Invariant.Format(
                $"Sodium {Invariant.Number(latest.Value)} mmol/L ({thresholds.NameOf(band)} hyponatremia{labels}, {context.Display.AgeAndTime(latest.EffectiveAt)}) — {builder.SummaryAction ?? "review"}."));

        var detail = new DetailWriter()
            .Paragraph(Invariant.Format($"**Low sodium work-up** as of {context.Display.Time(context.Request.Now)}. Advisory only."))
            .Bullets("Findings", builder.Findings)
            .Numbered("Reasoning (with the data each step used)", builder.Steps)
            .Bullets("Possible causes to consider", builder.Differential)
            .Bullets("What clinicians usually consider next", builder.NextSteps);
        CardFooter.Write(detail, context, builder.Sources);

        return new Card
        {
            Summary = summary,
            Indicator = builder.FinalIndicator,
            Detail = detail.ToString(),
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
        var detail = new DetailWriter()
            .Paragraph(sodiumSetAside.Count > 0
                ? Invariant.Format(
                    $"**No usable sodium result.** {sodiumSetAside.Count} sodium result(s) of this patient were received but none could be used, so the service makes **no assessment** and gives no advice on them.")
                : "**No usable sodium result of this patient** was received, so the service makes **no assessment**.")
            .Bullets("What to do", ["Check the results in the laboratory system, and repeat the sodium if it is needed."]);
        CardFooter.Write(detail, facts, [], context.Display);
        return
        [
            new Card
            {
                Summary = Summary.Fit(sodiumSetAside.Count > 0
                    ? Invariant.Format($"{sodiumSetAside.Count} sodium result(s) could not be used (see detail); no assessment made.")
                    : "No usable sodium result of this patient; no assessment made — check the data and repeat sodium."),
                Indicator = CardIndicator.Info,
                Detail = detail.ToString(),
                Topic = "sodium-assessment",
                RuleIds = [RuleId, "sodium.unusable"],
                ResourcesUsed = [],
                Suggestions = [LabOrders.AsSuggestion(LabOrders.SerumSodium("No usable sodium result was available."), recommended: false)],
            },
        ];
    }
}
