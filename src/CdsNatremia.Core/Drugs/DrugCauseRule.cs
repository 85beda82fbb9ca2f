using CdsNatremia.Core.Assessment;
using CdsNatremia.Core.Cards;
using CdsNatremia.Core.Engine;
using CdsNatremia.Core.Facts;
using CdsNatremia.Core.Findings;
using CdsNatremia.Core.Rendering;

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
        var implicated = DrugCauseAnalysis.Find(sets, context.Request.Facts.Medications, fall);
        if (implicated.Count == 0)
        {
            return;
        }

        card.RuleIds.Add(RuleId);
        card.Sources.Add(DrugText.KnowledgeSource);
        card.Steps.Add(FallStep(fall));
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
            card.Steps.Add(Step(drug, treatment ? heartFailure : null));
            card.Differential.Add(Finding.Of(
                    treatment ? FindingKind.DrugCauseHeartFailure : FindingKind.DrugCause,
                    DrugText.Name(drug.Match),
                    DrugText.Group(drug.Match.Set),
                    Slot.Phrase("verdict", drug.Timing.VerdictFinding))
                .With(drug.Timing.Certainty)
                .RestingOn(drug.Medication.Reference));
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

        // A likely drug cause is what the prescriber can act on now: the weightiest kind of reason (Weights.Culprit).
        var likely = implicated.Where(d => d.Timing.Verdict == TimingVerdict.Likely).ToList();
        foreach (var drug in likely)
        {
            var treatment = HeartFailureTreatment.IsTreatment(drug.Match, heartFailure);
            card.Findings.Add(Finding.Of(
                    treatment ? FindingKind.DrugLikelyHeartFailure : FindingKind.DrugLikely,
                    DrugText.Name(drug.Match),
                    DrugText.Group(drug.Match.Set),
                    Slot.Phrase("tier", DrugText.Tier(drug.Match.Set)))
                .With(Certainty.Likely)
                .Weighted(Weights.Culprit)
                .RestingOn([.. drug.Timing.Evidence.Evidence]));
        }

        // Names only on the card: each drug's group is in its own reasoning step.
        var together = DrugCauseAnalysis.ActingTogether(implicated);
        if (together.Count > 0)
        {
            card.Findings.Add(Finding.Of(
                    FindingKind.DrugTogether,
                    Slot.List("names", together.Select(d => (SlotValue)new TextValue(d.Match.Ingredient, Escape: true)), TogetherSeparator))
                .With(Certainty.Possible)
                .Weighted(Weights.Cause)
                .RestingOn([.. together.Select(d => d.Medication.Reference)]));
        }

        if (likely.FirstOrDefault(d => d.IsPrimary && !HeartFailureTreatment.IsTreatment(d.Match, heartFailure)) is { } first)
        {
            card.OfferSummaryAction(SummaryPriority, Finding.Of(FindingKind.DrugActionReviewLikely, DrugText.Name(first.Match)).With(Certainty.Likely));
        }

        if (implicated.Any(d => d.Counts))
        {
            card.Suggest(LabOrders.AsSuggestion(
                LabOrders.SerumSodium(LabOrders.Why(FindingKind.DrugRecheckWhileTaking)), recommended: false));
        }
    }

    /// <summary>The summary clause's priority: above "review causes and recheck" (10) and "work up the cause" (20), below the acute and urgent clauses.</summary>
    public const int SummaryPriority = 30;

    /// <summary>How the names of medicines acting together are joined (" and ", from the catalogue).</summary>
    private static string TogetherSeparator => PhraseCatalogue.Default.Text(FindingKind.DrugListAnd);

    private static Finding FallStep(SodiumFall? fall)
    {
        if (fall is null)
        {
            return Finding.Of(FindingKind.DrugFallNone).With(Certainty.Unknown);
        }

        var firstLow = DrugTiming.SodiumAt("firstLow", fall.FirstLow);
        return fall.Before is { } before
            ? Finding.Of(FindingKind.DrugFallKnown, DrugTiming.SodiumAt("before", before), firstLow).RestingOn(before.Reference, fall.FirstLow.Reference)
            : Finding.Of(FindingKind.DrugFallStartUnknown, firstLow).With(Certainty.Unknown).RestingOn(fall.FirstLow.Reference);
    }

    private static Finding Step(ImplicatedDrug drug, ConditionFact? heartFailure)
    {
        var medication = drug.Medication;
        var name = DrugText.Name(drug.Match);
        var medicine = medication.Text is { } text && !string.Equals(text, drug.Match.Ingredient, StringComparison.OrdinalIgnoreCase)
            ? Finding.Of(FindingKind.DrugMedicineInProduct, name, Slot.Text("product", text))
            : Finding.Of(FindingKind.DrugMedicine, name);
        var reference = Slot.Text("reference", medication.Reference);
        var records = drug.OtherRecords.Count > 0
            ? Finding.Of(FindingKind.DrugRecordsMany, reference, Slot.Names("others", drug.OtherRecords))
            : Finding.Of(FindingKind.DrugRecordsOne, reference);
        Slot[] slots =
        [
            Slot.Phrase("medicine", medicine),
            Slot.Phrase("records", records),
            Slot.Phrase("how", DrugText.HowMatched(drug.Match)),
            Slot.Phrase("group", DrugText.GroupAndTier(drug.Match.Set)),
            Slot.Phrase("timing", drug.Timing.Evidence),
            Slot.Phrase("verdict", drug.Timing.VerdictFinding),
        ];
        var step = heartFailure is null
            ? Finding.Of(FindingKind.DrugStep, slots)
            : Finding.Of(FindingKind.DrugStepHeartFailure, [.. slots, Slot.Phrase("heartFailure", HeartFailureTreatment.Cite(heartFailure))]);
        return step.With(drug.Timing.Certainty).RestingOn([medication.Reference, .. drug.OtherRecords, .. drug.Timing.Evidence.Evidence]);
    }
}
