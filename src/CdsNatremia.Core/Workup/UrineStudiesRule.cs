using CdsNatremia.Core.Text;
using CdsNatremia.Core.Assessment;
using CdsNatremia.Core.Engine;
using CdsNatremia.Core.Facts;

using CdsNatremia.Core.Findings;

namespace CdsNatremia.Core.Workup;

/// <summary>
/// Step 4 of the work-up, in the 2014 European guideline's order: urine osmolality first (≤ 100 mOsm/kg: relative excess
/// water or low solute intake, and urine sodium then does not steer), then urine sodium (≤ 30 mmol/L: low effective
/// arterial blood volume; &gt; 30: diuretics, kidney disease, SIADH, adrenal insufficiency, hypothyroidism, cerebral or
/// renal salt wasting). Urine tests taken far from the serum sodium, or while a diuretic was in use, are labelled.
/// Only hypotonic (or not yet known) hyponatremia is read this way.
/// </summary>
public sealed class UrineStudiesRule : IAssessmentRule
{
    /// <inheritdoc />
    public string RuleId => "workup.urine";

    /// <inheritdoc />
    public void Apply(DecisionContext context, AssessmentBuilder card)
    {
        Guard.NotNull(context, nameof(context));
        Guard.NotNull(card, nameof(card));
        var options = context.Options.Workup;
        var tonicity = TonicityAssessment.From(context);
        if (tonicity.Band is Tonicity.Isotonic or Tonicity.Hypertonic)
        {
            return;
        }

        var urine = UrineStudies.From(context);
        var serum = context.Sodium.Latest!;
        card.RuleIds.Add(RuleId);
        card.Sources.Add(WorkupSources.European2014);

        var dilute = Slot.Number("dilute", options.DiluteUrineAtOrBelow);
        var low = Slot.Number("low", options.LowUrineSodiumAtOrBelow);
        if (urine.Osmolality is { } osm)
        {
            card.ResourcesUsed.Add(osm.Reference);
            var cited = Slot.Phrase("cited", urine.CiteWithLabels(osm, serum, options));
            if (urine.IsDilute)
            {
                var sodiumNote = urine.Sodium is { } una
                    ? Slot.Phrase("sodiumNote", Finding.Of(FindingKind.UrineOsmolalityDiluteSodiumNote, Slot.Number("sodium", una.Value)))
                    : Slot.Verbatim("sodiumNote", string.Empty);
                card.Steps.Add(Finding.Of(FindingKind.UrineOsmolalityDiluteStep, cited, dilute, sodiumNote).RestingOn(osm.Reference));
                card.Findings.Add(Finding.Of(FindingKind.UrineOsmolalityDiluteFinding, Slot.Number("osmolality", osm.Value)).RestingOn(osm.Reference).Weighted(Weights.Cause));
                card.Differential.Add(Finding.Of(FindingKind.UrineOsmolalityDiluteCause).With(Certainty.Likely));
                card.NextSteps.Add(Finding.Of(FindingKind.UrineOsmolalityDiluteNext));
                return;
            }

            card.Steps.Add(Finding.Of(FindingKind.UrineOsmolalityConcentratedStep, cited, dilute).RestingOn(osm.Reference));
        }
        else
        {
            card.Steps.Add(Finding.Of(FindingKind.UrineOsmolalityMissingStep, Slot.Phrase("why", NotUsable(context, Analyte.UrineOsmolality, serum))));
        }

        if (urine.Sodium is not { } una2)
        {
            card.Steps.Add(Finding.Of(FindingKind.UrineSodiumMissingStep, Slot.Phrase("why", NotUsable(context, Analyte.UrineSodium, serum)), low));
            return;
        }

        card.ResourcesUsed.Add(una2.Reference);
        var cited2 = Slot.Phrase("cited", urine.CiteWithLabels(una2, serum, options));
        var onDiuretic = urine.DiureticsAtUrineSodium.Count > 0;
        var sodium = Slot.Number("sodium", una2.Value);
        if (una2.Value <= options.LowUrineSodiumAtOrBelow)
        {
            var diureticNote = onDiuretic ? Slot.Phrase("diureticNote", Finding.Of(FindingKind.UrineSodiumLowDiureticNote)) : Slot.Verbatim("diureticNote", string.Empty);
            card.Steps.Add(Finding.Of(FindingKind.UrineSodiumLowStep, cited2, low, diureticNote).RestingOn(una2.Reference));
            card.Findings.Add(Finding.Of(FindingKind.UrineSodiumLowFinding, sodium, low).RestingOn(una2.Reference).Weighted(Weights.Cause));
            card.Differential.Add(Finding.Of(FindingKind.UrineSodiumLowCause).With(Certainty.Likely));
            return;
        }

        var caution = onDiuretic ? Slot.Phrase("diureticNote", Finding.Of(FindingKind.UrineSodiumHighDiureticNote)) : Slot.Verbatim("diureticNote", string.Empty);
        card.Steps.Add(Finding.Of(FindingKind.UrineSodiumHighStep, cited2, low, caution).RestingOn(una2.Reference));
        card.Findings.Add(Finding.Of(onDiuretic ? FindingKind.UrineSodiumHighFindingDiuretic : FindingKind.UrineSodiumHighFinding, sodium, low)
            .RestingOn(una2.Reference).Weighted(Weights.Cause));
        card.Differential.Add(Finding.Of(FindingKind.UrineSodiumHighCause).With(Certainty.Possible));
    }

    /// <summary>"not available", or why the result that was received could not be used (set aside, or only a bound).</summary>
    private static Finding NotUsable(DecisionContext context, Analyte analyte, LabResult serum)
        => context.Request.Facts.Observe(analyte, serum.EffectiveAt.AddHours(-context.Options.Workup.UrineUsableBeforeSodiumHours)).Match(
            _ => Finding.Of(FindingKind.UrineNotUsableAbsent),
            bound => Finding.Of(FindingKind.UrineNotUsableBound, Slot.Verbatim("bound", Bounds.Describe(bound)), Slot.Text("unit", bound.Unit), Slot.Text("reference", bound.Reference)),
            unread => Finding.Of(FindingKind.UrineNotUsableUnread, Slot.Verbatim("text", unread.CouldNotBeReadText!)).With(Certainty.CouldNotBeRead),
            _ => Finding.Of(FindingKind.UrineNotUsableAbsent));
}
