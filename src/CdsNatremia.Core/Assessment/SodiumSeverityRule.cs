using CdsNatremia.Core.Cards;
using CdsNatremia.Core.Engine;
using CdsNatremia.Core.Facts;
using CdsNatremia.Core.Sodium;
using CdsNatremia.Core.Text;

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

        card.Findings.Add(Invariant.Format($"Latest usable sodium {Invariant.Number(latest.Value)} mmol/L: **{name} hyponatremia** ({thresholds.RangeOf(band)})."));
        card.Steps.Add(Invariant.Format(
            $"**Severity**: {Cite.Result(latest, context.Display)} is in the {name} band ({thresholds.RangeOf(band)}; {thresholds.Source})."));

        var age = context.Sodium.LatestAgeHours ?? 0;
        if (context.Sodium.LatestIsStale)
        {
            card.Steps.Add(Invariant.Format(
                $"**Age of the result**: taken {ClinicalNumber.Rounded(age, 1)} h before this assessment, older than the {Invariant.Number(context.Sodium.StaleAfterHours)} h window: **stale**; today's sodium may differ."));
            card.Suggest(LabOrders.AsSuggestion(LabOrders.SerumSodium("Latest sodium is stale; recheck before acting."), recommended: true));
            card.OfferSummaryAction(50, "result is stale, recheck sodium");

            // A stale result is a reason to recheck, not to interrupt: at most a warning (never critical).
            card.LimitTo(CardIndicator.Warning);
        }

        if (latest.IsPreliminary)
        {
            card.Steps.Add("**Result status**: the latest sodium is **preliminary**; it is counted, but confirm the final result before acting on it.");
        }

        if (latest.IsWholeBlood)
        {
            card.Steps.Add("**Specimen**: the latest sodium is a whole-blood (blood-gas or point-of-care) value; it can differ from laboratory serum sodium by a few mmol/L.");
        }

        var newerSetAside = context.Request.Facts.SetAside
            .Where(s => s.Analyte == Analyte.Sodium && s.State == FactState.Unreadable && (s.At is not { } at || at > latest.EffectiveAt))
            .ToList();
        if (newerSetAside.Count > 0)
        {
            card.Steps.Add(Invariant.Format(
                $"**Newer results not used**: {newerSetAside.Count} sodium result(s) newer than this one were set aside (see *Data set aside*); this assessment rests on the older usable value."));
            card.Suggest(LabOrders.AsSuggestion(LabOrders.SerumSodium("The newest sodium could not be used; repeat it."), recommended: true));
            card.OfferSummaryAction(60, "newest result unusable, repeat sodium");
        }

        switch (band)
        {
            case SeverityBand.Profound:
                card.NextSteps.Add("Assess for severe symptoms now (vomiting, seizures, drowsiness, cardiorespiratory distress); severe symptoms are an emergency under local protocol.");
                card.OfferSummaryAction(40, "assess for severe symptoms now");
                break;
            case SeverityBand.Moderate:
                card.NextSteps.Add("Assess symptoms and work up the cause; recheck sodium to see the trend.");
                card.OfferSummaryAction(20, "assess symptoms and work up the cause");
                break;
            default:
                card.NextSteps.Add("Review likely causes (including medicines) and recheck sodium to see the trend.");
                card.OfferSummaryAction(10, "review causes and recheck");
                break;
        }
    }
}
