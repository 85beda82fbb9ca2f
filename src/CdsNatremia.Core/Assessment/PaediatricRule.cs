using CdsNatremia.Core.Cards;
using CdsNatremia.Core.Engine;

using CdsNatremia.Core.Findings;

namespace CdsNatremia.Core.Assessment;

/// <summary>
/// For a patient younger than <see cref="Sodium.SeverityOptions.AdultFromAgeYears"/> (default 18): the 2014 European
/// guideline covers adults, so the card says first that its thresholds and correction limits may not apply and defers to
/// paediatric protocols. The engine puts the same caution first among the cautions of every card (<see cref="Engine.DecisionEngine"/>). An unknown
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
        card.Steps.Add(Finding.Of(FindingKind.PaediatricStep, Slot.Count("age", age), Slot.Count("adultFrom", adultFrom)));
        card.NextSteps.Insert(0, Finding.Of(FindingKind.PaediatricNext));
        card.OfferSummaryAction(SummaryPriority, Finding.Of(FindingKind.PaediatricAction, Slot.Count("age", age)));
    }
}
