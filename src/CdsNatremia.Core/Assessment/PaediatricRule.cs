using CdsNatremia.Core.Cards;
using CdsNatremia.Core.Engine;

namespace CdsNatremia.Core.Assessment;

/// <summary>
/// For a patient younger than <see cref="Sodium.SeverityOptions.AdultFromAgeYears"/> (default 18): the 2014 European
/// guideline covers adults, so the card says first that its thresholds and correction limits may not apply and defers to
/// paediatric protocols. The same caution goes into the cautions of every card (<see cref="CardFooter"/>). An unknown
/// birth date says nothing (adults are the usual case; the card does not guess an age).
/// </summary>
public sealed class PaediatricRule : IAssessmentRule
{
    /// <summary>Summary priority: above "stale, recheck" (50) and the tonicity clauses (45), below "newest unusable" (60).</summary>
    internal const int SummaryPriority = 55;

    /// <inheritdoc />
    public string RuleId => "patient.paediatric";

    /// <inheritdoc />
    public void Apply(DecisionContext context, AssessmentBuilder card)
    {
        Guard.NotNull(context, nameof(context));
        Guard.NotNull(card, nameof(card));
        var adultFrom = context.Options.Severity.AdultFromAgeYears;
        if (context.Request.Facts.AgeAt(context.Request.Now) is not { } age || age >= adultFrom)
        {
            return;
        }

        card.RuleIds.Add(RuleId);
        card.Findings.Insert(0, SafetyCautions.Paediatric(age, adultFrom));
        card.Steps.Add(Invariant.Format(
            $"**Age**: {age} years, under {adultFrom} (birth date from the Patient resource): the severity bands, the correction limits and the formulas used here are adult ones (the 2014 European guideline covers adults); children's thresholds, fluid volumes and limits follow paediatric protocols."));
        card.NextSteps.Insert(0, "Follow the local paediatric protocol and seek paediatric advice; treat the adult figures on this card as a guide only.");
        card.OfferSummaryAction(SummaryPriority, Invariant.Format($"child ({age} y): adult limits may not apply, follow paediatric protocol"));
    }
}
