using CdsNatremia.Core.Assessment;
using CdsNatremia.Core.Engine;

using CdsNatremia.Core.Findings;

namespace CdsNatremia.Core.Workup;

/// <summary>
/// The Furst ratio step: with urine sodium, urine potassium and serum sodium, (U_Na + U_K) / S_Na and what it implies for
/// fluid restriction (<see cref="FurstRatio"/>). Only for hypotonic (or not yet known) hyponatremia with urine that is not
/// maximally dilute: with dilute urine the kidney is already excreting water. Thresholds: <see cref="WorkupOptions"/>.
/// </summary>
public sealed class FurstRatioRule : IAssessmentRule
{
    /// <inheritdoc />
    public string RuleId => "workup.furst-ratio";

    /// <inheritdoc />
    public void Apply(DecisionContext context, AssessmentBuilder card)
    {
        Guard.NotNull(context, nameof(context));
        Guard.NotNull(card, nameof(card));
        if (TonicityAssessment.From(context).Band is Tonicity.Isotonic or Tonicity.Hypertonic || FurstRatio.For(context) is not { } ratio)
        {
            return;
        }

        var options = context.Options.Workup;
        card.RuleIds.Add(RuleId);
        card.Sources.Add(FurstRatio.Source);
        card.ResourcesUsed.Add(ratio.UrineSodium.Reference);
        if (ratio.UrinePotassium is { } potassium)
        {
            card.ResourcesUsed.Add(potassium.Reference);
        }

        var outlook = ratio.Outlook(options);
        var computation = Slot.Phrase("computation", ratio.Computation());
        Finding Resting(Finding f) => ratio.UrinePotassium is { } uk ? f.RestingOn(ratio.UrineSodium.Reference, uk.Reference) : f.RestingOn(ratio.UrineSodium.Reference);
        if (outlook is not { } known)
        {
            card.Steps.Add(Resting(Finding.Of(FindingKind.FurstStepIncomplete, computation)));
            return;
        }

        var meaning = Slot.Phrase("meaning", FurstRatio.Meaning(known, options));
        var value = Slot.Number("value", ratio.Value);
        card.Steps.Add(Resting(Finding.Of(FindingKind.FurstStep, computation, meaning)));
        card.Findings.Add(Resting(Finding.Of(FindingKind.FurstFinding, value, meaning)).Weighted(known == FluidRestrictionOutlook.RestrictionUnlikelyToWork ? Weights.Cause + 5 : Weights.Cause - 5));
        card.NextSteps.Add(Finding.Of(FindingKind.FurstNext, value, meaning));
    }
}
