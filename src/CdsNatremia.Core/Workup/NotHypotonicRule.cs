using CdsNatremia.Core.Assessment;
using CdsNatremia.Core.Engine;
using CdsNatremia.Core.Facts;
using CdsNatremia.Core.Text;

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
            GlucoseCorrection(t, options, card, context.Display);
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

    private static void GlucoseCorrection(TonicityAssessment t, WorkupOptions options, AssessmentBuilder card, TimeDisplay display)
    {
        var mgPerDl = t.GlucoseMgPerDl!.Value;
        var na = t.Sodium.Value;
        var katz = Math.Round(OsmolalityFormulas.KatzCorrectedSodium(na, mgPerDl), 1);
        var hillier = Math.Round(OsmolalityFormulas.HillierCorrectedSodium(na, mgPerDl), 1);
        var chosen = options.GlucoseCorrection == GlucoseCorrectionMethod.Katz ? katz : hillier;
        var chosenName = options.GlucoseCorrection == GlucoseCorrectionMethod.Katz ? "Katz" : "Hillier";
        card.Sources.Add(WorkupSources.Katz);
        card.Sources.Add(WorkupSources.Hillier);
        card.ResourcesUsed.Add(t.Glucose!.Reference);

        var steep = mgPerDl > OsmolalityFormulas.HillierSteepAboveMgPerDl
            ? Invariant.Format(
                $" Above {Invariant.Number(OsmolalityFormulas.HillierSteepAboveMgPerDl)} mg/dL Hillier et al. found the fall steeper (about {Invariant.Number(OsmolalityFormulas.HillierSteepPer100MgPerDl)} mmol/L per 100 mg/dL); applied to the glucose above {Invariant.Number(OsmolalityFormulas.HillierSteepAboveMgPerDl)} mg/dL it gives {Invariant.Number(Math.Round(OsmolalityFormulas.HillierSteepCorrectedSodium(na, mgPerDl), 1))} mmol/L, so the true value may be higher still.")
            : string.Empty;
        card.Steps.Add(Invariant.Format(
            $"**Glucose-corrected sodium**: {Cite.Result(t.Glucose, display)} = {Invariant.Number(mgPerDl)} mg/dL. Katz (1.6 mmol/L per 100 mg/dL above 100): {Invariant.Number(na)} + 1.6 × ({Invariant.Number(mgPerDl)} − 100)/100 = **{Invariant.Number(katz)} mmol/L**. Hillier (2.4 per 100 mg/dL above 100): **{Invariant.Number(hillier)} mmol/L**.{steep} This service uses {chosenName} (configured)."));
        card.Findings.Add(Invariant.Format($"Glucose {Invariant.Number(t.Glucose.Value)} mmol/L ({Invariant.Number(mgPerDl)} mg/dL): glucose-corrected sodium {Invariant.Number(katz)} (Katz) to {Invariant.Number(hillier)} mmol/L (Hillier)."));

        if (t.Band == Tonicity.Hypertonic)
        {
            card.MarkNotHypotonic(Invariant.Format($"glucose {ClinicalNumber.Rounded(t.Glucose.Value, 1)} mmol/L"));
            card.Findings.Insert(0, "This is **not hypotonic hyponatremia**: glucose holds water outside the cells and dilutes the sodium. The correction limits of hypotonic hyponatremia do not apply to this dilution.");
            card.NextSteps.Add(Invariant.Format(
                $"Treat the hyperglycaemia and any volume deficit rather than the sodium (no treatment for the dilution itself); the sodium rises as glucose falls, towards the corrected value of about {Invariant.Number(chosen)} mmol/L, so recheck sodium and glucose together."));
            card.Differential.Add("Hyperglycaemia (translocational, hypertonic hyponatremia).");
            card.OfferSummaryAction(SummaryPriority, Invariant.Format($"corrected sodium {Invariant.Number(chosen)} mmol/L ({chosenName})"));
        }
        else
        {
            card.NextSteps.Add(Invariant.Format(
                $"Part of the fall is from glucose; judge the severity on the corrected sodium of about {Invariant.Number(chosen)} mmol/L ({chosenName}) as well as the measured value."));
        }
    }

    private static void Pseudohyponatremia(DecisionContext context, TonicityAssessment t, WorkupOptions options, AssessmentBuilder card)
    {
        var facts = context.Request.Facts;
        var at = t.Sodium.EffectiveAt;
        var triglyceride = WorkupData.Paired(facts, Analyte.Triglyceride, at, options.PairedWithinHours);
        var protein = WorkupData.Paired(facts, Analyte.TotalProtein, at, options.PairedWithinHours);
        card.Sources.Add(WorkupSources.CommonPractice);

        var clues = new List<string>();
        var checks = new List<string>();
        if (triglyceride is not null)
        {
            card.ResourcesUsed.Add(triglyceride.Reference);
            var high = triglyceride.Value >= options.HighTriglycerideFrom;
            checks.Add(Invariant.Format($"{Cite.Result(triglyceride, context.Display)}: {(high ? "**very high**" : "not high enough to explain it")} (threshold {Invariant.Number(options.HighTriglycerideFrom)} mmol/L, about 1000 mg/dL: from memory)"));
            if (high)
            {
                clues.Add("very high triglycerides");
            }
        }
        else
        {
            checks.Add("triglyceride not available");
        }

        if (protein is not null)
        {
            card.ResourcesUsed.Add(protein.Reference);
            var high = protein.Value >= options.HighTotalProteinFrom;
            checks.Add(Invariant.Format($"{Cite.Result(protein, context.Display)}: {(high ? "**very high**" : "not high enough to explain it")} (threshold {Invariant.Number(options.HighTotalProteinFrom)} g/L: from memory)"));
            if (high)
            {
                clues.Add("very high total protein");
            }
        }
        else
        {
            checks.Add("total protein not available");
        }

        var cause = clues.Count > 0 ? " with " + string.Join(" and ", clues) : string.Empty;
        card.Steps.Add(Invariant.Format(
            $"**Normal measured osmolality with a low sodium**: possible **pseudohyponatremia**{cause}, a laboratory artefact of indirect ion-selective electrode methods when lipids or proteins take up plasma volume. Checked: {string.Join("; ", checks)}."));
        card.Findings.Add(Invariant.Format($"This is **not hypotonic hyponatremia**: the measured osmolality is normal; the low sodium may be an artefact (pseudohyponatremia){cause}."));
        card.Differential.Add("Pseudohyponatremia (very high triglycerides or paraprotein/total protein).");
        card.Differential.Add("Isotonic hyponatremia from other effective osmoles (glucose, mannitol, glycine or sorbitol irrigation fluid).");
        // A whole-blood (blood-gas) sodium is measured by direct ion-selective electrode, which lipids and proteins do not disturb.
        var direct = t.Sodium.IsWholeBlood
            ? t.Sodium
            : context.Sodium.Results.Where(r => r.IsWholeBlood && Math.Abs((r.EffectiveAt - at).TotalHours) <= options.PairedWithinHours).LastOrDefault();
        if (direct is not null)
        {
            card.ResourcesUsed.Add(direct.Reference);
            var normal = direct.Value >= context.Thresholds.NormalFrom;
            card.Steps.Add(Invariant.Format(
                $"**Direct sodium**: {Cite.Result(direct, context.Display)} is a whole-blood (direct ion-selective electrode) value: {(normal ? "it is **normal**, which supports an artefact" : "it is also low, so the low sodium is **real** and an artefact is unlikely; look for another effective osmole")}."));
            if (!normal)
            {
                card.OfferSummaryAction(SummaryPriority, "normal osmolality but low direct sodium: look for other osmoles");
                return;
            }
        }
        else
        {
            card.Suggest(LabOrders.AsSuggestion(LabOrders.BloodSodium("Normal measured osmolality with a low laboratory sodium: a direct ion-selective electrode sodium tells an artefact from true hyponatremia."), recommended: true));
        }

        card.NextSteps.Add("Confirm with a direct ion-selective electrode sodium (for example on a blood-gas analyser). If it is normal, the low value is an artefact and **no sodium treatment is indicated** for it; look after the lipid or protein disorder instead.");
        card.OfferSummaryAction(SummaryPriority, "normal osmolality: possible artefact, check a direct-ISE (blood-gas) sodium");
    }

    private static void OtherOsmoles(DecisionContext context, TonicityAssessment t, AssessmentBuilder card)
    {
        var glucose = t.Glucose is null
            ? "glucose is not available, so hyperglycaemia is not excluded"
            : Invariant.Format($"glucose is not high ({Cite.Result(t.Glucose, context.Display)})");
        var agents = OsmoleAgents.InRecord(context.Request.Facts);
        foreach (var (medication, _) in agents)
        {
            card.ResourcesUsed.Add(medication.Reference);
        }

        var named = agents.Count == 0
            ? "No such agent is in the medication record received."
            : "**In the record**: " + string.Join("; ", agents.Select(a => $"{a.Label} ({Markdown.Escape(a.Medication.Reference)}{Describe(a.Medication)})")) + ": the likely osmole.";
        var osmolality = Invariant.Format($"{(t.Method == OsmolalityMethod.Measured ? "osmolality" : "calculated osmolality")} {Invariant.Number(t.Total!.Value)} mOsm/kg");
        var likely = agents.Count == 0 ? null : string.Join(" or ", agents.Select(a => a.Label).Distinct(StringComparer.Ordinal));
        card.Sources.Add(WorkupSources.CommonPractice);
        card.MarkNotHypotonic(osmolality);
        card.Steps.Add(Invariant.Format(
            $"**High osmolality without high glucose**: {glucose}. Other osmoles that draw water out of cells and lower the sodium: **mannitol**, **glycine or sorbitol** irrigation fluid, **radiocontrast**, and, for the osmolality but not the tonicity, alcohols (ethanol, methanol, ethylene glycol) and a high urea. {named}"));
        card.Findings.Insert(0, likely is null
            ? Invariant.Format($"This is **not hypotonic hyponatremia** ({osmolality}): look for another osmole. The correction limits of hypotonic hyponatremia do not apply.")
            : Invariant.Format($"This is **not hypotonic hyponatremia** ({osmolality}): the likely osmole is **{likely}**, in the record. The correction limits of hypotonic hyponatremia do not apply."));
        card.Differential.Add("Hypertonic hyponatremia from mannitol, irrigation fluids or contrast; raised osmolality from alcohols or urea.");
        card.NextSteps.Add("Review recent infusions, surgery with irrigation, contrast studies and alcohol or toxic-alcohol exposure; treat the cause rather than the sodium.");
        card.OfferSummaryAction(SummaryPriority, likely is null
            ? "look for another osmole; treat the cause"
            : Invariant.Format($"likely {likely}; treat the cause"));
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
            ? Invariant.Format($"osmolality {Invariant.Number(t.Measured!.Value)} mOsm/kg (gap {Invariant.Number(t.Gap!.Value)})")
            : Invariant.Format($"osmolality {Invariant.Number(t.Measured!.Value)} mOsm/kg");
        var likely = string.Join(" or ", agents.Select(a => a.Label).Distinct(StringComparer.Ordinal));
        card.MarkNotHypotonic(evidence);
        card.Findings.Insert(0, Invariant.Format(
            $"This is **not hypotonic hyponatremia** ({evidence}): the likely osmole is **{likely}**, in the record. The correction limits of hypotonic hyponatremia do not apply."));
        card.OfferSummaryAction(SummaryPriority + 1, Invariant.Format($"likely {likely}"));
    }

    private static void OsmoleWithoutOsmolality(IReadOnlyList<(MedicationFact Medication, string Label)> agents, AssessmentBuilder card)
    {
        foreach (var (medication, _) in agents)
        {
            card.ResourcesUsed.Add(medication.Reference);
        }

        var listed = string.Join("; ", agents.Select(a => $"{a.Label} ({Markdown.Escape(a.Medication.Reference)}{Describe(a.Medication)})"));
        card.Sources.Add(WorkupSources.CommonPractice);
        card.Steps.Add($"**An osmole is in the record** ({listed}) and the tonicity is unknown: the low sodium may be hypertonic or isotonic rather than hypotonic. A measured serum osmolality settles it before the sodium is treated.");
        card.Findings.Add($"Possible osmole in the record: {listed}; the low sodium may not be hypotonic (measure serum osmolality).");
        card.OfferSummaryAction(SummaryPriority, Invariant.Format($"{agents[0].Label} in the record: measure osmolality before treating"));
    }

    private static string Describe(MedicationFact medication)
        => string.IsNullOrWhiteSpace(medication.Text) ? string.Empty : ", \"" + Markdown.Escape(medication.Text) + "\"";
}
