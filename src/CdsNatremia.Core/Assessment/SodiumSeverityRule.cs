using CdsNatremia.Core.Cards;
using CdsNatremia.Core.Engine;
using CdsNatremia.Core.Facts;
using CdsNatremia.Core.Findings;
using CdsNatremia.Core.Sodium;

namespace CdsNatremia.Core.Assessment;

/// <summary>
/// Places the latest usable sodium in its severity band, says how old and how trustworthy it is, and proposes a recheck
/// when it is stale, preliminary or from a blood-gas specimen. Thresholds: <see cref="SeverityOptions"/>.
/// </summary>
public sealed class SodiumSeverityRule : IAssessmentRule
{
    /// <inheritdoc />
    public string RuleId => "sodium.severity";

    /// <inheritdoc />
    public void Apply(DecisionContext context, AssessmentBuilder card)
    {
        Guard.NotNull(context, nameof(context));
        Guard.NotNull(card, nameof(card));
        var latest = context.Sodium.Latest ?? throw new InvalidOperationException("The severity rule needs a sodium result.");
        var thresholds = context.Thresholds;
        var band = thresholds.Classify(latest.Value);
        var name = thresholds.NameOf(band);

        card.RuleIds.Add(RuleId);
        card.ResourcesUsed.Add(latest.Reference);
        card.Sources.Add(thresholds.Source);
        card.Raise(band switch
        {
            SeverityBand.Profound => context.Options.Indicators.Profound,
            SeverityBand.Moderate => context.Options.Indicators.Moderate,
            _ => context.Options.Indicators.Mild,
        });

        card.Findings.Add(Finding.Of(
            FindingKind.SeverityFinding,
            Slot.Number("sodium", latest.Value),
            Slot.Text("band", name),
            Slot.Text("range", thresholds.RangeOf(band))).RestingOn(latest.Reference).Weighted(Weights.Stated));
        card.Steps.Add(Finding.Of(
            FindingKind.SeverityStep,
            Slot.Result("result", latest),
            Slot.Text("band", name),
            Slot.Text("range", thresholds.RangeOf(band)),
            Slot.Verbatim("source", thresholds.Source)).RestingOn(latest.Reference));

        var age = context.Sodium.LatestAgeHours ?? 0;
        if (context.Sodium.LatestIsStale)
        {
            card.Steps.Add(Finding.Of(FindingKind.SeverityStaleStep, Slot.Rounded("age", age, 1), Slot.Number("window", context.Sodium.StaleAfterHours)));
            card.Cautions.Add(Finding.Of(FindingKind.SeverityStaleCaution, Slot.Time("age", latest.EffectiveAt, TimeStyle.Age)));
            card.Suggest(LabOrders.AsSuggestion(LabOrders.SerumSodium(LabOrders.Why(FindingKind.SeverityStaleOrder)), recommended: true));
            card.OfferSummaryAction(50, Finding.Of(FindingKind.SeverityStaleAction));

            // A stale result is a reason to recheck, not to interrupt: at most a warning (never critical).
            card.LimitTo(CardIndicator.Warning);
        }

        if (latest.IsPreliminary)
        {
            card.Steps.Add(Finding.Of(FindingKind.SeverityPreliminaryStep));
        }

        if (latest.IsWholeBlood)
        {
            card.Steps.Add(Finding.Of(FindingKind.SeverityWholeBloodStep));
        }

        var newerSetAside = context.Request.Facts.SetAside
            .Where(s => s.Analyte == Analyte.Sodium && s.State == FactState.Unreadable && (s.At is not { } at || at > latest.EffectiveAt))
            .ToList();
        if (newerSetAside.Count > 0)
        {
            card.Steps.Add(Finding.Of(FindingKind.SeverityNewerUnusedStep, Slot.Count("count", newerSetAside.Count)));
            card.Findings.Add(Finding.Of(FindingKind.SeverityNewerUnusedFinding, Slot.Count("count", newerSetAside.Count)).With(Certainty.CouldNotBeRead).Weighted(Weights.DataGap));
            card.Suggest(LabOrders.AsSuggestion(LabOrders.SerumSodium(LabOrders.Why(FindingKind.SeverityNewerUnusedOrder)), recommended: true));
            card.OfferSummaryAction(60, Finding.Of(FindingKind.SeverityNewerUnusedAction));
        }

        switch (band)
        {
            case SeverityBand.Profound:
                card.NextSteps.Add(Finding.Of(FindingKind.SeverityProfoundNext));
                card.OfferSummaryAction(40, Finding.Of(FindingKind.SeverityProfoundAction));
                break;
            case SeverityBand.Moderate:
                card.NextSteps.Add(Finding.Of(FindingKind.SeverityModerateNext));
                card.OfferSummaryAction(20, Finding.Of(FindingKind.SeverityModerateAction));
                break;
            default:
                card.NextSteps.Add(Finding.Of(FindingKind.SeverityMildNext));
                card.OfferSummaryAction(10, Finding.Of(FindingKind.SeverityMildAction));
                break;
        }
    }
}
