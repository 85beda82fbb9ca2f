using CdsNatremia.Core.Text;
using CdsNatremia.Core.Assessment;
using CdsNatremia.Core.Cards;
using CdsNatremia.Core.Engine;
using CdsNatremia.Core.Facts;

using CdsNatremia.Core.Findings;

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

        var basis = Finding.Of(cortisol.ReferenceLow is null ? FindingKind.CortisolBasisDefault : FindingKind.CortisolBasisLaboratory);
        card.RuleIds.Add(RuleId);
        card.Raise(CardIndicator.Warning);
        card.ResourcesUsed.Add(cortisol.Reference);
        card.Sources.Add(WorkupSources.European2014);
        Slot[] slots = [Slot.Result("result", cortisol), Slot.Phrase("basis", basis), Slot.Number("low", low)];
        card.Findings.Add(Finding.Of(FindingKind.CortisolFinding, slots).RestingOn(cortisol.Reference).Weighted(Weights.Urgent));
        card.Steps.Add(Finding.Of(FindingKind.CortisolStep, slots).RestingOn(cortisol.Reference));
        card.Differential.Add(Finding.Of(FindingKind.CortisolCause).With(Certainty.Possible));
        card.NextSteps.Insert(0, Finding.Of(FindingKind.CortisolNext));
        card.NextSteps.Add(Finding.Of(FindingKind.CortisolNextReplacement));
        card.OfferSummaryAction(SummaryPriority, Finding.Of(FindingKind.CortisolAction));
    }
}
