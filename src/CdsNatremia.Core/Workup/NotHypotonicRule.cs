using CdsNatremia.Core.Assessment;
using CdsNatremia.Core.Engine;
using CdsNatremia.Core.Facts;
using CdsNatremia.Core.Text;

using CdsNatremia.Core.Findings;

namespace CdsNatremia.Core.Workup;

/// <summary>
/// Step 2 of the work-up: when the serum is not hypotonic, the low sodium is not a water excess. Normal measured
/// osmolality → possible pseudohyponatremia (triglyceride, total protein, direct ion-selective electrode sodium); high
/// osmolality with high glucose → glucose-corrected sodium by Katz and Hillier; high osmolality without high glucose → other
/// osmoles. The band's indicator is kept (the number is still abnormal and the cause may itself be urgent), but the summary
/// and the next steps say plainly that this is not hypotonic hyponatremia. A high glucose in hypotonic serum still gets its
/// corrected sodium, since part of the fall is glucose.
/// </summary>
public sealed class NotHypotonicRule : IAssessmentRule
{
    /// <summary>Summary priority: above the band's own clause (≤ 40), below "stale, recheck" (50).</summary>
    internal const int SummaryPriority = 45;

    /// <inheritdoc />
    public string RuleId => "workup.not-hypotonic";

    /// <inheritdoc />
    public void Apply(DecisionContext context, AssessmentBuilder card)
    {
        Guard.NotNull(context, nameof(context));
        Guard.NotNull(card, nameof(card));
        var options = context.Options.Workup;
        var t = TonicityAssessment.From(context);
        var spoke = false;

        if (t.GlucoseIsHigh)
        {
            spoke = true;
            GlucoseCorrection(t, options, card);
        }

        if (t.Band == Tonicity.Isotonic && t.Method == OsmolalityMethod.Measured)
        {
            spoke = true;
            Pseudohyponatremia(context, t, options, card);
            // A raised gap alone does not decide: pseudohyponatremia raises it too (the measured sodium is falsely low).
            if (OsmoleAgents.InRecord(context.Request.Facts).Count > 0)
            {
                IsotonicWithOsmole(context, t, card);
            }
        }
        else if (t.Band == Tonicity.Hypertonic && !t.GlucoseIsHigh)
        {
            spoke = true;
            OtherOsmoles(context, t, card);
        }
        else if (t.Band == Tonicity.Unknown && OsmoleAgents.InRecord(context.Request.Facts) is { Count: > 0 } agents)
        {
            spoke = true;
            OsmoleWithoutOsmolality(agents, card);
        }

        if (spoke)
        {
            card.RuleIds.Add(RuleId);
        }
    }

    private static void GlucoseCorrection(TonicityAssessment t, WorkupOptions options, AssessmentBuilder card)
    {
        var mgPerDl = t.GlucoseMgPerDl!.Value;
        var na = t.Sodium.Value;
        var katz = Math.Round(OsmolalityFormulas.KatzCorrectedSodium(na, mgPerDl), 1);
        var hillier = Math.Round(OsmolalityFormulas.HillierCorrectedSodium(na, mgPerDl), 1);
        var chosen = options.GlucoseCorrection == GlucoseCorrectionMethod.Katz ? katz : hillier;
        var method = Slot.Verbatim("method", options.GlucoseCorrection == GlucoseCorrectionMethod.Katz ? "Katz" : "Hillier");
        card.Sources.Add(WorkupSources.Katz);
        card.Sources.Add(WorkupSources.Hillier);
        card.ResourcesUsed.Add(t.Glucose!.Reference);

        var steep = mgPerDl > OsmolalityFormulas.HillierSteepAboveMgPerDl
            ? Slot.Phrase("steep", Finding.Of(
                FindingKind.HypertonicGlucoseSteep,
                Slot.Number("above", OsmolalityFormulas.HillierSteepAboveMgPerDl),
                Slot.Number("per100", OsmolalityFormulas.HillierSteepPer100MgPerDl),
                Slot.Number("steep", Math.Round(OsmolalityFormulas.HillierSteepCorrectedSodium(na, mgPerDl), 1))))
            : Slot.Verbatim("steep", string.Empty);
        var glucose = t.Glucose;
        card.Steps.Add(Finding.Of(
            FindingKind.HypertonicGlucoseStep,
            Slot.Result("glucose", glucose),
            Slot.Number("mgPerDl", mgPerDl),
            Slot.Number("sodium", na),
            Slot.Number("katz", katz),
            Slot.Number("hillier", hillier),
            steep,
            method).RestingOn(glucose.Reference));
        card.Findings.Add(Finding.Of(
            FindingKind.HypertonicGlucoseFinding,
            Slot.Number("glucose", glucose.Value),
            Slot.Number("mgPerDl", mgPerDl),
            Slot.Number("katz", katz),
            Slot.Number("hillier", hillier)).RestingOn(glucose.Reference).Weighted(Weights.Culprit - 1));

        var corrected = Slot.Number("corrected", chosen);
        if (t.Band == Tonicity.Hypertonic)
        {
            card.MarkNotHypotonic(Finding.Of(FindingKind.HypertonicGlucoseEvidence, Slot.Rounded("glucose", glucose.Value, 1)));
            card.Findings.Insert(0, Finding.Of(FindingKind.HypertonicGlucoseNotHypotonic).Weighted(Weights.Culprit));
            card.NextSteps.Insert(0, Finding.Of(FindingKind.HypertonicGlucoseNext, corrected));
            card.Differential.Add(Finding.Of(FindingKind.HypertonicGlucoseCause).With(Certainty.Likely));
            card.OfferSummaryAction(SummaryPriority, Finding.Of(FindingKind.HypertonicGlucoseAction, corrected, method));
        }
        else
        {
            card.NextSteps.Add(Finding.Of(FindingKind.HypertonicGlucosePartialNext, corrected, method));
        }
    }

    private static void Pseudohyponatremia(DecisionContext context, TonicityAssessment t, WorkupOptions options, AssessmentBuilder card)
    {
        var facts = context.Request.Facts;
        var at = t.Sodium.EffectiveAt;
        var triglyceride = WorkupData.Paired(facts, Analyte.Triglyceride, at, options.PairedWithinHours);
        var protein = WorkupData.Paired(facts, Analyte.TotalProtein, at, options.PairedWithinHours);
        card.Sources.Add(WorkupSources.CommonPractice);

        var clues = new List<SlotValue>();
        var checks = new List<SlotValue>();
        void Check(LabResult? result, double threshold, string unit, Slot note, string clueKind, string missingKind)
        {
            if (result is null)
            {
                checks.Add(new PhraseValue(Finding.Of(missingKind).With(Certainty.Unknown)));
                return;
            }

            card.ResourcesUsed.Add(result.Reference);
            var high = result.Value >= threshold;
            checks.Add(new PhraseValue(Finding.Of(
                high ? FindingKind.PseudoCheckHigh : FindingKind.PseudoCheckNotHigh,
                Slot.Result("result", result),
                Slot.Number("threshold", threshold),
                Slot.Verbatim("unit", unit),
                note).RestingOn(result.Reference)));
            if (high)
            {
                clues.Add(new PhraseValue(Finding.Of(clueKind)));
            }
        }

        Check(triglyceride, options.HighTriglycerideFrom, "mmol/L", Slot.Phrase("note", Finding.Of(FindingKind.PseudoCheckTriglycerideNote)), FindingKind.PseudoClueTriglyceride, FindingKind.PseudoCheckNoTriglyceride);
        Check(protein, options.HighTotalProteinFrom, "g/L", Slot.Verbatim("note", string.Empty), FindingKind.PseudoClueProtein, FindingKind.PseudoCheckNoProtein);

        var with = clues.Count > 0
            ? Slot.Phrase("with", Finding.Of(FindingKind.PseudoWith, Slot.List("clues", clues, " and ")))
            : Slot.Verbatim("with", string.Empty);
        card.Steps.Add(Finding.Of(FindingKind.PseudoStep, with, Slot.List("checks", checks, "; ")));
        card.Findings.Add(Finding.Of(FindingKind.PseudoFinding, with).With(Certainty.Possible).Weighted(Weights.Culprit));
        card.Differential.Add(Finding.Of(FindingKind.PseudoCauseArtefact).With(Certainty.Possible));
        card.Differential.Add(Finding.Of(FindingKind.PseudoCauseIsotonic).With(Certainty.Possible));
        // A whole-blood (blood-gas) sodium is measured by direct ion-selective electrode, which lipids and proteins do not disturb.
        var direct = t.Sodium.IsWholeBlood
            ? t.Sodium
            : context.Sodium.Results.Where(r => r.IsWholeBlood && Math.Abs((r.EffectiveAt - at).TotalHours) <= options.PairedWithinHours).LastOrDefault();
        if (direct is not null)
        {
            card.ResourcesUsed.Add(direct.Reference);
            var normal = direct.Value >= context.Thresholds.NormalFrom;
            card.Steps.Add(Finding.Of(normal ? FindingKind.PseudoDirectNormalStep : FindingKind.PseudoDirectLowStep, Slot.Result("result", direct)).RestingOn(direct.Reference));
            if (!normal)
            {
                card.OfferSummaryAction(SummaryPriority, Finding.Of(FindingKind.PseudoDirectLowAction));
                return;
            }
        }
        else
        {
            card.Suggest(LabOrders.AsSuggestion(LabOrders.BloodSodium(LabOrders.Why(FindingKind.PseudoDirectOrder)), recommended: true));
        }

        card.NextSteps.Insert(0, Finding.Of(FindingKind.PseudoNext));
        card.OfferSummaryAction(SummaryPriority, Finding.Of(FindingKind.PseudoAction));
    }

    private static void OtherOsmoles(DecisionContext context, TonicityAssessment t, AssessmentBuilder card)
    {
        var glucose = t.Glucose is null
            ? Finding.Of(FindingKind.OsmoleGlucoseMissing).With(Certainty.Unknown)
            : Finding.Of(FindingKind.OsmoleGlucoseNotHigh, Slot.Result("result", t.Glucose)).RestingOn(t.Glucose.Reference);
        var agents = OsmoleAgents.InRecord(context.Request.Facts);
        foreach (var (medication, _) in agents)
        {
            card.ResourcesUsed.Add(medication.Reference);
        }

        var named = agents.Count == 0
            ? Finding.Of(FindingKind.OsmoleNamedNone)
            : Finding.Of(FindingKind.OsmoleNamed, Agents(agents));
        var osmolality = Finding.Of(
            t.Method == OsmolalityMethod.Measured ? FindingKind.OsmoleOsmolalityMeasured : FindingKind.OsmoleOsmolalityCalculated,
            Slot.Number("value", t.Total!.Value));
        var likely = agents.Count == 0 ? null : Likely(agents);
        card.Sources.Add(WorkupSources.CommonPractice);
        card.MarkNotHypotonic(osmolality);
        card.Steps.Add(Finding.Of(FindingKind.OsmoleStep, Slot.Phrase("glucose", glucose), Slot.Phrase("named", named)));
        card.Findings.Insert(0, (likely is null
            ? Finding.Of(FindingKind.OsmoleFindingUnnamed, Slot.Phrase("osmolality", osmolality))
            : Finding.Of(FindingKind.OsmoleFindingNamed, Slot.Phrase("osmolality", osmolality), Likely(agents))).Weighted(Weights.Culprit));
        card.Differential.Add(Finding.Of(FindingKind.OsmoleCause).With(Certainty.Possible));
        card.NextSteps.Insert(0, Finding.Of(FindingKind.OsmoleNext));
        card.OfferSummaryAction(SummaryPriority, likely is null
            ? Finding.Of(FindingKind.OsmoleActionUnnamed)
            : Finding.Of(FindingKind.OsmoleActionNamed, Likely(agents)));
    }

    /// <summary>
    /// A normal measured osmolality with an osmotic agent in the record: the agent likely holds the osmolality up, so the
    /// low sodium is not hypotonic (summary and indicator as for hypertonic). The gap, when raised, is quoted as evidence.
    /// </summary>
    private static void IsotonicWithOsmole(DecisionContext context, TonicityAssessment t, AssessmentBuilder card)
    {
        var agents = OsmoleAgents.InRecord(context.Request.Facts);
        foreach (var (medication, _) in agents)
        {
            card.ResourcesUsed.Add(medication.Reference);
        }

        var evidence = t.GapIsHigh
            ? Finding.Of(FindingKind.OsmoleOsmolalityGap, Slot.Number("value", t.Measured!.Value), Slot.Number("gap", t.Gap!.Value))
            : Finding.Of(FindingKind.OsmoleOsmolalityMeasured, Slot.Number("value", t.Measured!.Value));
        card.MarkNotHypotonic(evidence);
        card.Findings.Insert(0, Finding.Of(FindingKind.OsmoleFindingNamed, Slot.Phrase("osmolality", evidence), Likely(agents)).Weighted(Weights.Culprit));
        card.OfferSummaryAction(SummaryPriority + 1, Finding.Of(FindingKind.OsmoleActionIsotonic, Likely(agents)));
    }

    private static void OsmoleWithoutOsmolality(IReadOnlyList<(MedicationFact Medication, string Label)> agents, AssessmentBuilder card)
    {
        foreach (var (medication, _) in agents)
        {
            card.ResourcesUsed.Add(medication.Reference);
        }

        card.Sources.Add(WorkupSources.CommonPractice);
        card.Steps.Add(Finding.Of(FindingKind.OsmoleUnknownStep, Agents(agents)));
        card.Findings.Add(Finding.Of(FindingKind.OsmoleUnknownFinding, Agents(agents)).With(Certainty.Possible).Weighted(Weights.Culprit));
        card.OfferSummaryAction(SummaryPriority, Finding.Of(FindingKind.OsmoleUnknownAction, Slot.Text("label", agents[0].Label)));
    }

    private static Slot Likely(IReadOnlyList<(MedicationFact Medication, string Label)> agents)
        => Slot.List("likely", agents.Select(a => a.Label).Distinct(StringComparer.Ordinal).Select(l => (SlotValue)new TextValue(l, Escape: true)), " or ");

    private static Slot Agents(IReadOnlyList<(MedicationFact Medication, string Label)> agents)
        => Slot.List("agents", agents.Select(a => (SlotValue)new PhraseValue(Finding.Of(
            FindingKind.OsmoleAgent,
            Slot.Text("label", a.Label),
            Slot.Text("reference", a.Medication.Reference),
            string.IsNullOrWhiteSpace(a.Medication.Text)
                ? Slot.Verbatim("text", string.Empty)
                : Slot.Phrase("text", Finding.Of(FindingKind.OsmoleAgentText, Slot.Text("text", a.Medication.Text)))).RestingOn(a.Medication.Reference))), "; ");
}
