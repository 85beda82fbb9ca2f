using CdsNatremia.Core.Text;
using CdsNatremia.Core.Assessment;
using CdsNatremia.Core.Cards;
using CdsNatremia.Core.Engine;
using CdsNatremia.Core.Facts;

namespace CdsNatremia.Core.Workup;

/// <summary>
/// A low cortisol is more than an unmet SIADH criterion: glucocorticoid deficiency is a cause of hyponatremia in its own
/// right (2014 European guideline lists it among the causes; reference sheet) and adrenal insufficiency can be
/// life-threatening, so the card says it must be considered urgently (common practice). Replacing the glucocorticoid
/// restores free-water excretion and can raise sodium quickly, so the rate caution comes with it (from memory: the US
/// expert panel, Verbalis et al. 2013, lists glucocorticoid replacement among the causes of an unintended rapid rise).
/// Uses the newest cortisol within <see cref="WorkupOptions.EndocrineTestMaxAgeDays"/>; low means below the laboratory's
/// lower limit, else below <see cref="WorkupOptions.CortisolNormalFrom"/>.
/// </summary>
public sealed class LowCortisolRule : IAssessmentRule
{
    /// <summary>Summary priority: above the tonicity clauses (45) and "stale" (50), below paediatric (55) and "newest unusable" (60).</summary>
    internal const int SummaryPriority = 52;

    /// <inheritdoc />
    public string RuleId => "workup.low-cortisol";

    /// <inheritdoc />
    public void Apply(DecisionContext context, AssessmentBuilder card)
    {
        Guard.NotNull(context, nameof(context));
        Guard.NotNull(card, nameof(card));
        var options = context.Options.Workup;
        var cortisol = WorkupData.NewestSince(context.Request.Facts, Analyte.Cortisol, context.Request.Now.AddDays(-options.EndocrineTestMaxAgeDays));
        if (cortisol is null)
        {
            return;
        }

        var low = cortisol.ReferenceLow ?? options.CortisolNormalFrom;
        if (cortisol.Value >= low)
        {
            return;
        }

        var basis = cortisol.ReferenceLow is null ? "the default lower limit, from memory" : "the laboratory's lower limit";
        card.RuleIds.Add(RuleId);
        card.Raise(CardIndicator.Warning);
        card.ResourcesUsed.Add(cortisol.Reference);
        card.Sources.Add(WorkupSources.European2014);
        card.Findings.Add(Invariant.Format(
            $"**Low cortisol** ({Cite.Result(cortisol, context.Display)}, below {basis} of {Invariant.Number(low)} nmol/L): **adrenal insufficiency must be considered urgently**; it is a cause of low sodium in its own right and can be life-threatening."));
        card.Steps.Add(Invariant.Format(
            $"**Cortisol**: {Cite.Result(cortisol, context.Display)} is below {Invariant.Number(low)} nmol/L ({basis}): glucocorticoid deficiency gives an SIADH-like picture and must be treated as possible adrenal insufficiency until shown otherwise (common practice)."));
        card.Differential.Add("Adrenal insufficiency (glucocorticoid deficiency; with mineralocorticoid deficiency too in primary adrenal failure).");
        card.NextSteps.Add("Assess urgently for adrenal insufficiency (blood pressure, volume status, symptoms) and seek senior or endocrine advice at once, under local protocol.");
        card.NextSteps.Add("Replacing the glucocorticoid restores the kidney's free-water excretion and **can raise sodium quickly**: check sodium often once it is started and keep within the correction limits (from memory).");
        card.OfferSummaryAction(SummaryPriority, "low cortisol: consider adrenal insufficiency urgently");
    }
}
