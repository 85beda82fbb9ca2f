using CdsNatremia.Core.Assessment;
using CdsNatremia.Core.Engine;
using CdsNatremia.Core.Text;

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
        var days = Invariant.Number(context.Options.DrugCause.RecentlyStoppedWithinDays);
        foreach (var (medication, match) in found)
        {
            card.ResourcesUsed.Add(medication.Reference);
            var name = DrugText.Name(match);
            card.Steps.Add(Invariant.Format(
                $"**Recently stopped medicine**: {name} ({Markdown.Escape(match.Set.Label)}), {RecentlyStopped.When(medication, context.Display)}, within the {days}-day look-back (from memory: a drug's effect on sodium can outlast the last dose): a **possible contributor**, not a likely one now that it has stopped."));
            card.Differential.Add(Invariant.Format($"Medicine effect: {name} ({Markdown.Escape(match.Set.Label)}), **recently stopped**: a possible contributor."));
        }
    }
}
