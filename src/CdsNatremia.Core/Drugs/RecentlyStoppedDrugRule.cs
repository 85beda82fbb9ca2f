using CdsNatremia.Core.Assessment;
using CdsNatremia.Core.Engine;
using CdsNatremia.Core.Findings;

namespace CdsNatremia.Core.Drugs;

/// <summary>
/// Lists the medicines that can lower sodium and were stopped within the look-back
/// (<see cref="DrugCauseOptions.RecentlyStoppedWithinDays"/>, default 14 days, from memory) as "recently stopped": a
/// possible contributor whose effect may outlast the last dose, never "likely" once stopped, and never advice to stop.
/// </summary>
public sealed class RecentlyStoppedDrugRule : IAssessmentRule
{
    /// <inheritdoc />
    public string RuleId => "drug.recently-stopped";

    /// <inheritdoc />
    public void Apply(DecisionContext context, AssessmentBuilder card)
    {
        Guard.NotNull(context, nameof(context));
        Guard.NotNull(card, nameof(card));
        var sets = DrugCauseSets.Causes(context.Knowledge);
        var stopped = RecentlyStopped.Find(context.Request.Facts, context.Request.Now, context.Options.DrugCause);
        if (sets.Count == 0 || stopped.Count == 0)
        {
            return;
        }

        var found = stopped
            .SelectMany(m => Knowledge.MedicationMatching.MatchAll(sets, m).Select(match => (Medication: m, Match: match)))
            .DistinctBy(x => (x.Medication.Reference, x.Match.Ingredient.ToLowerInvariant()))
            .ToList();
        if (found.Count == 0)
        {
            return;
        }

        card.RuleIds.Add(RuleId);
        var days = Slot.Number("days", context.Options.DrugCause.RecentlyStoppedWithinDays);
        foreach (var (medication, match) in found)
        {
            card.ResourcesUsed.Add(medication.Reference);
            var name = DrugText.Name(match);
            var group = DrugText.Group(match.Set);
            card.Steps.Add(Finding.Of(FindingKind.DrugStoppedStep, name, group, Slot.Phrase("when", RecentlyStopped.Stopped(medication)), days)
                .With(Certainty.Possible)
                .RestingOn(medication.Reference));
            card.Differential.Add(Finding.Of(FindingKind.DrugStoppedCause, name, group).With(Certainty.Possible).RestingOn(medication.Reference));
        }
    }
}
