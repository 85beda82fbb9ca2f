using CdsNatremia.Core.Assessment;
using CdsNatremia.Core.Engine;
using CdsNatremia.Core.Facts;
using CdsNatremia.Core.Text;

using CdsNatremia.Core.Findings;

namespace CdsNatremia.Core.Workup;

/// <summary>
/// Step 5 of the work-up. The service cannot examine the patient, so it never states a volume status: it lists the clues
/// in the record (conditions from the <c>condition-*</c> knowledge sets, diuretics in use) with what each usually goes
/// with, and gives the differential for each volume status the clinician may find (common practice).
/// </summary>
public sealed class VolumeCluesRule : IAssessmentRule
{
    /// <summary>Condition sets read as clues, with what each usually goes with.</summary>
    internal static readonly IReadOnlyList<(string SetId, string Meaning)> ConditionClues =
    [
        ("condition-heart-failure", FindingKind.VolumeMeaningHeartFailure),
        ("condition-cirrhosis", FindingKind.VolumeMeaningCirrhosis),
        ("condition-nephrotic-syndrome", FindingKind.VolumeMeaningNephroticSyndrome),
        ("condition-chronic-kidney-disease", FindingKind.VolumeMeaningChronicKidneyDisease),
        ("condition-vomiting", FindingKind.VolumeMeaningVomiting),
        ("condition-diarrhoea", FindingKind.VolumeMeaningDiarrhoea),
        ("condition-adrenal-insufficiency", FindingKind.VolumeMeaningAdrenalInsufficiency),
        ("condition-hypothyroidism", FindingKind.VolumeMeaningHypothyroidism),
        ("condition-pneumonia", FindingKind.VolumeMeaningPneumonia),
        ("condition-intracranial-disorder", FindingKind.VolumeMeaningIntracranialDisorder),
        ("condition-small-cell-lung-cancer", FindingKind.VolumeMeaningSmallCellLungCancer),
        ("condition-alcohol-use-disorder", FindingKind.VolumeMeaningAlcoholUseDisorder),
        ("condition-malnutrition", FindingKind.VolumeMeaningMalnutrition),
    ];

    /// <inheritdoc />
    public string RuleId => "workup.volume-clues";

    /// <inheritdoc />
    public void Apply(DecisionContext context, AssessmentBuilder card)
    {
        Guard.NotNull(context, nameof(context));
        Guard.NotNull(card, nameof(card));
        var tonicity = TonicityAssessment.From(context);
        if (tonicity.Band is Tonicity.Isotonic or Tonicity.Hypertonic)
        {
            return;
        }

        card.RuleIds.Add(RuleId);
        card.Sources.Add(WorkupSources.CommonPractice);
        var clues = new List<SlotValue>();
        foreach (var (condition, meaning) in FindConditionClues(context))
        {
            card.ResourcesUsed.Add(condition.Reference);
            var text = string.IsNullOrWhiteSpace(condition.Text)
                ? Slot.Verbatim("text", string.Empty)
                : Slot.Phrase("text", Finding.Of(FindingKind.VolumeClueConditionText, Slot.Text("text", condition.Text)));
            clues.Add(new PhraseValue(Finding.Of(
                FindingKind.VolumeClueCondition,
                Slot.Text("label", meaning.Label),
                Slot.Text("reference", condition.Reference),
                text,
                Slot.Phrase("meaning", Finding.Of(meaning.Text))).RestingOn(condition.Reference)));
        }

        foreach (var diuretic in DiureticExposure.Find(context))
        {
            card.ResourcesUsed.Add(diuretic.Medication.Reference);
            clues.Add(new PhraseValue(Finding.Of(FindingKind.VolumeClueDiuretic, Slot.Phrase("drug", diuretic.Describe()))));
        }

        foreach (var stopped in DiureticExposure.FindRecentlyStopped(context))
        {
            card.ResourcesUsed.Add(stopped.Medication.Reference);
            clues.Add(new PhraseValue(Finding.Of(FindingKind.VolumeClueDiureticStopped, Slot.Phrase("drug", stopped.Describe()))));
        }

        // Set-aside data is not "no clue": a medicine that could not be read makes diuretic use unknown, named by its own text.
        if (DiureticExposure.Observe(context).CouldNotBeReadText is { } unreadable)
        {
            clues.Add(new PhraseValue(Finding.Of(FindingKind.VolumeClueDiureticUnknown, Slot.Text("text", unreadable)).With(Certainty.CouldNotBeRead)));
        }

        var facts = context.Request.Facts;
        var conditions = WorkupData.ConditionsUnreadable(facts);
        var medications = WorkupData.MedicationsUnreadable(facts);
        var gap = (conditions, medications) switch
        {
            (true, true) => Slot.Phrase("gap", Finding.Of(FindingKind.VolumeGapBoth)),
            (true, false) => Slot.Phrase("gap", Finding.Of(FindingKind.VolumeGapConditions)),
            (false, true) => Slot.Phrase("gap", Finding.Of(FindingKind.VolumeGapMedications)),
            _ => Slot.Verbatim("gap", string.Empty),
        };
        card.Steps.Add(clues.Count == 0
            ? Finding.Of(FindingKind.VolumeStepNone, gap)
            : Finding.Of(FindingKind.VolumeStep, Slot.List("clues", clues, "; "), gap));

        card.Differential.Add(Finding.Of(FindingKind.VolumeCauseLow).With(Certainty.Possible));
        card.Differential.Add(Finding.Of(FindingKind.VolumeCauseNormal).With(Certainty.Possible));
        card.Differential.Add(Finding.Of(FindingKind.VolumeCauseHigh).With(Certainty.Possible));
        card.NextSteps.Add(Finding.Of(FindingKind.VolumeNext));
    }

    /// <summary>Conditions in the record that match a clue set, each with the set's label and what it usually goes with.</summary>
    internal static IEnumerable<(ConditionFact Condition, (string Label, string Text) Meaning)> FindConditionClues(DecisionContext context)
    {
        foreach (var (setId, meaning) in ConditionClues)
        {
            if (context.Knowledge.Find(setId) is not { } set)
            {
                continue;
            }

            foreach (var condition in context.Request.Facts.Conditions.OrderBy(c => c.ResourceId, StringComparer.Ordinal))
            {
                if (set.MatchesAny(condition.Codes))
                {
                    yield return (condition, (set.Label, meaning));
                }
            }
        }
    }
}
