using CdsNatremia.Core.Assessment;
using CdsNatremia.Core.Engine;

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
        if (outlook is not { } known)
        {
            card.Steps.Add(Invariant.Format(
                $"**Furst ratio** (urine-to-serum electrolytes, Furst et al. 2000): {ratio.Computation()}; urine potassium is needed to say whether fluid restriction will work."));
            return;
        }

        var meaning = FurstRatio.Meaning(known, options);
        card.Steps.Add(Invariant.Format($"**Furst ratio** (urine-to-serum electrolytes, Furst et al. 2000): {ratio.Computation()}; {meaning}."));
        card.Findings.Add(Invariant.Format($"Furst ratio {Invariant.Number(ratio.Value)}: {meaning}."));
        card.NextSteps.Add(Invariant.Format($"Fluid restriction, if the cause calls for it (e.g. SIADH): Furst ratio {Invariant.Number(ratio.Value)}, {meaning}."));
    }
}
