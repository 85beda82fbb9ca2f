using CdsNatremia.Core.Assessment;
using CdsNatremia.Core.Engine;
using CdsNatremia.Core.Facts;
using CdsNatremia.Core.Text;

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
        ("condition-heart-failure", "usually found with a high extracellular volume (oedema) and low effective arterial blood volume"),
        ("condition-cirrhosis", "usually found with a high extracellular volume (ascites, oedema) and low effective arterial blood volume"),
        ("condition-nephrotic-syndrome", "usually found with a high extracellular volume (oedema)"),
        ("condition-chronic-kidney-disease", "reduced free-water excretion; volume may be high or low"),
        ("condition-vomiting", "fluid and sodium loss, usually with a low extracellular volume (vomiting and nausea also release vasopressin)"),
        ("condition-diarrhoea", "fluid and sodium loss, usually with a low extracellular volume"),
        ("condition-adrenal-insufficiency", "mineralocorticoid lack gives low volume; glucocorticoid lack gives an SIADH-like, euvolaemic picture"),
        ("condition-hypothyroidism", "a cause of euvolaemic hyponatremia when severe"),
        ("condition-pneumonia", "a cause of SIADH (euvolaemic)"),
        ("condition-intracranial-disorder", "a cause of SIADH or of cerebral salt wasting"),
        ("condition-small-cell-lung-cancer", "a cause of SIADH (ectopic vasopressin)"),
        ("condition-alcohol-use-disorder", "low solute intake (beer drinking) with dilute urine"),
        ("condition-malnutrition", "low solute intake"),
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
        var clues = new List<string>();
        foreach (var (condition, meaning) in FindConditionClues(context))
        {
            card.ResourcesUsed.Add(condition.Reference);
            clues.Add(Invariant.Format($"{meaning.Label} ({Markdown.Escape(condition.Reference)}{Describe(condition)}): {meaning.Text}"));
        }

        foreach (var diuretic in DiureticExposure.Find(context))
        {
            card.ResourcesUsed.Add(diuretic.Medication.Reference);
            clues.Add("diuretic in use: " + diuretic.Describe(context.Display) + ": sodium and volume loss; urine sodium is hard to read");
        }

        foreach (var stopped in DiureticExposure.FindRecentlyStopped(context))
        {
            card.ResourcesUsed.Add(stopped.Medication.Reference);
            clues.Add("diuretic recently stopped: " + stopped.Describe(context.Display) + ": recent sodium and volume loss is possible");
        }

        // Set-aside data is not "no clue": a medicine that could not be read makes diuretic use unknown, named by its own text.
        if (DiureticExposure.Observe(context).CouldNotBeReadText is { } unreadable)
        {
            clues.Add("diuretic use: **unknown** (" + unreadable + ")");
        }

        var facts = context.Request.Facts;
        var unavailable = new List<string>();
        if (WorkupData.ConditionsUnreadable(facts))
        {
            unavailable.Add("conditions");
        }

        if (WorkupData.MedicationsUnreadable(facts))
        {
            unavailable.Add("medications");
        }

        var gaps = unavailable.Count == 0 ? string.Empty : " The record's " + string.Join(" and ", unavailable) + " could not be read, so clues may be missing.";
        var found = clues.Count == 0 ? "none found in the record." : string.Join("; ", clues) + ".";
        card.Steps.Add(
            "**Volume clues** (the service cannot examine the patient and does **not** decide the volume status; the clinician does): " + found + gaps);

        card.Differential.Add("If the clinician finds **low extracellular volume** (hypovolaemia): vomiting or diarrhoea, diuretics, adrenal insufficiency, cerebral or renal salt wasting, third-space losses.");
        card.Differential.Add("If **normal volume** (euvolaemia): SIADH (drugs, lung or intracranial disease, cancer, pain, nausea, after surgery), hypothyroidism, glucocorticoid deficiency, excess water or low solute intake.");
        card.Differential.Add("If **high volume** (oedema, ascites): heart failure, cirrhosis, nephrotic syndrome, advanced kidney disease.");
        card.NextSteps.Add("Assess the volume status at the bedside (skin turgor, mucous membranes, jugular venous pressure, oedema, ascites, orthostatic blood pressure); it steers the differential above.");
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
                if (condition.Codes.Any(set.Matches))
                {
                    yield return (condition, (set.Label, meaning));
                }
            }
        }
    }

    private static string Describe(ConditionFact condition)
        => string.IsNullOrWhiteSpace(condition.Text) ? string.Empty : ", \"" + Markdown.Escape(condition.Text) + "\"";
}
