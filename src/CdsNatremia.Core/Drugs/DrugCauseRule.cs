using CdsNatremia.Core.Assessment;
using CdsNatremia.Core.Cards;
using CdsNatremia.Core.Engine;
using CdsNatremia.Core.Text;

namespace CdsNatremia.Core.Drugs;

/// <summary>
/// Adds the medicines that can lower sodium to the assessment card: each implicated drug with its group and tier, the
/// matched ingredient and how it matched, the timing evidence against the fall (<see cref="SodiumFall"/>,
/// <see cref="DrugTiming"/>), drugs acting together, and what clinicians usually consider. Never an order.
/// Thresholds: <see cref="DrugCauseOptions"/>.
/// </summary>
public sealed class DrugCauseRule : IAssessmentRule
{
    /// <inheritdoc />
    public string RuleId => "drug.cause";

    /// <inheritdoc />
    public void Apply(DecisionContext context, AssessmentBuilder card)
    {
        Guard.NotNull(context, nameof(context));
        Guard.NotNull(card, nameof(card));
        var sets = DrugCauseSets.Causes(context.Knowledge);
        if (sets.Count == 0)
        {
            return;
        }

        var fall = DrugCauseAnalysis.Fall(context);
        var implicated = DrugCauseAnalysis.Find(sets, context.Request.Facts.Medications, fall, context.Display);
        if (implicated.Count == 0)
        {
            return;
        }

        card.RuleIds.Add(RuleId);
        card.Sources.Add("Drug groups and codes: CdsNatremia knowledge files (profiles/valuesets; each code's source is listed in its file)");
        card.Steps.Add(FallStep(fall, context.Display));
        if (fall?.Before is { } before)
        {
            card.ResourcesUsed.Add(before.Reference);
        }

        if (fall is not null)
        {
            card.ResourcesUsed.Add(fall.FirstLow.Reference);
        }

        var heartFailure = HeartFailureTreatment.HeartFailure(context);
        foreach (var drug in implicated)
        {
            card.ResourcesUsed.Add(drug.Medication.Reference);
            var treatment = HeartFailureTreatment.IsTreatment(drug.Match, heartFailure);
            var inHeartFailure = treatment ? $" It treats the patient's {HeartFailureTreatment.Cite(heartFailure!)}: part of that treatment, not stopped for the sodium." : string.Empty;
            card.Steps.Add(Step(drug) + inHeartFailure);
            card.Differential.Add(Invariant.Format(
                $"Medicine effect: {DrugText.Name(drug.Match)} ({Markdown.Escape(drug.Match.Set.Label)}), {drug.Timing.VerdictText} by timing{(treatment ? "; here part of heart-failure treatment" : string.Empty)}."));
            if (treatment)
            {
                card.ResourcesUsed.Add(heartFailure!.Reference);
                card.NextSteps.Add(HeartFailureTreatment.Considerations(drug.Match, heartFailure));
            }
            else if (drug.Counts)
            {
                card.NextSteps.Add(DrugText.Considerations(drug.Match));
            }
        }

        var likely = implicated.Where(d => d.Timing.Verdict == TimingVerdict.Likely).ToList();
        foreach (var drug in likely)
        {
            card.Findings.Add(Invariant.Format(
                $"**{DrugText.Name(drug.Match)}** ({Markdown.Escape(drug.Match.Set.Label)}, {(drug.IsPrimary ? "primary" : "secondary")} tier) is a **likely contributor**: it began before the fall."));
        }

        var together = DrugCauseAnalysis.ActingTogether(implicated);
        if (together.Count > 0)
        {
            var names = string.Join(" and ", together.Select(d => $"{DrugText.Name(d.Match)} ({Markdown.Escape(d.Match.Set.Label)})"));
            card.Findings.Add($"**Medicines acting together**: {names}; their effects on sodium add up (common practice).");
        }

        if (likely.FirstOrDefault(d => d.IsPrimary && !HeartFailureTreatment.IsTreatment(d.Match, heartFailure)) is { } first)
        {
            card.OfferSummaryAction(30, $"review {first.Match.Ingredient}, a likely cause");
        }

        if (implicated.Any(d => d.Counts))
        {
            card.Suggest(LabOrders.AsSuggestion(
                LabOrders.SerumSodium("A medicine that can lower sodium is being taken; recheck sodium after any change."), recommended: false));
        }
    }

    private static string FallStep(SodiumFall? fall, TimeDisplay display)
    {
        if (fall is null)
        {
            return "**The fall in sodium**: no low sodium to set the medicines against.";
        }

        var first = Invariant.Format($"{Invariant.Number(fall.FirstLow.Value)} mmol/L at {display.Time(fall.FirstLow.EffectiveAt)} ({Markdown.Escape(fall.FirstLow.Reference)})");
        return fall.Before is { } before
            ? Invariant.Format(
                $"**The fall in sodium**: {Invariant.Number(before.Value)} mmol/L at {display.Time(before.EffectiveAt)} ({Markdown.Escape(before.Reference)}) before the fall; {first} is the first result near the lowest level of this low stretch. A medicine started before that first low result is a likely contributor; one started on or after it, unlikely.")
            : Invariant.Format(
                $"**The fall in sodium**: no earlier higher sodium is on record; the first low result is {first}, so when the fall began is unknown.");
    }

    private static string Step(ImplicatedDrug drug)
    {
        var medication = drug.Medication;
        var product = medication.Text is { } text && !string.Equals(text, drug.Match.Ingredient, StringComparison.OrdinalIgnoreCase)
            ? $" in \"{Markdown.Escape(text)}\""
            : string.Empty;
        var others = drug.OtherRecords.Count > 0
            ? "; also recorded in " + string.Join(", ", drug.OtherRecords.Select(Markdown.Escape))
            : string.Empty;
        return $"**Medicine**: {DrugText.Name(drug.Match)}{product} ({Markdown.Escape(medication.Reference)}{others}), {DrugText.HowMatched(drug.Match)}; group {DrugText.GroupAndTier(drug.Match.Set)}. Timing: {drug.Timing.Text}: **{drug.Timing.VerdictText}**.";
    }
}
