using CdsNatremia.Core.Text;
using CdsNatremia.Core.Assessment;
using CdsNatremia.Core.Engine;
using CdsNatremia.Core.Facts;

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

        if (urine.Osmolality is { } osm)
        {
            card.ResourcesUsed.Add(osm.Reference);
            if (urine.IsDilute)
            {
                var naNote = urine.Sodium is { } una
                    ? Invariant.Format($" Urine sodium {Invariant.Number(una.Value)} mmol/L is reported but, with maximally dilute urine, it does not steer the reasoning.")
                    : string.Empty;
                card.Steps.Add(Invariant.Format(
                    $"**Urine osmolality**: {urine.CiteWithLabels(osm, serum, options, context.Display)} is at or below {Invariant.Number(options.DiluteUrineAtOrBelow)} mOsm/kg: maximally dilute urine, so **relative excess water intake** (or low solute intake) (2014 European guideline).{naNote}"));
                card.Findings.Add(Invariant.Format($"Dilute urine (osmolality {Invariant.Number(osm.Value)} mOsm/kg): relative excess water or low solute intake."));
                card.Differential.Add("Primary polydipsia or excess water intake; low solute intake (poor diet, \"tea and toast\", beer drinking).");
                card.NextSteps.Add("Water restriction and a normal diet usually correct it; a brisk water diuresis can raise the sodium too fast, so recheck sodium often.");
                return;
            }

            card.Steps.Add(Invariant.Format(
                $"**Urine osmolality**: {urine.CiteWithLabels(osm, serum, options, context.Display)} is above {Invariant.Number(options.DiluteUrineAtOrBelow)} mOsm/kg: the kidneys are not excreting free water (vasopressin activity); urine sodium comes next."));
        }
        else
        {
            card.Steps.Add("**Urine osmolality**: " + NotUsable(context, Analyte.UrineOsmolality, serum) + "; it decides whether water intake alone explains the low sodium (≤ 100 mOsm/kg).");
        }

        if (urine.Sodium is not { } una2)
        {
            card.Steps.Add(Invariant.Format(
                $"**Urine sodium**: {NotUsable(context, Analyte.UrineSodium, serum)}; at or below {Invariant.Number(options.LowUrineSodiumAtOrBelow)} mmol/L it points to low effective arterial blood volume, above it to renal sodium loss or SIADH."));
            return;
        }

        card.ResourcesUsed.Add(una2.Reference);
        var cited = urine.CiteWithLabels(una2, serum, options, context.Display);
        var onDiuretic = urine.DiureticsAtUrineSodium.Count > 0;
        if (una2.Value <= options.LowUrineSodiumAtOrBelow)
        {
            var diureticNote = onDiuretic ? " A low urine sodium despite a diuretic still points the same way." : string.Empty;
            card.Steps.Add(Invariant.Format(
                $"**Urine sodium**: {cited} is at or below {Invariant.Number(options.LowUrineSodiumAtOrBelow)} mmol/L: **low effective arterial blood volume** (2014 European guideline).{diureticNote}"));
            card.Findings.Add(Invariant.Format($"Urine sodium {Invariant.Number(una2.Value)} mmol/L (≤ {Invariant.Number(options.LowUrineSodiumAtOrBelow)}): low effective arterial blood volume."));
            card.Differential.Add("Low effective arterial blood volume: with low extracellular volume, gastrointestinal losses, third spacing or past diuretics; with high extracellular volume, heart failure, cirrhosis or nephrotic syndrome.");
            return;
        }

        var caution = onDiuretic
            ? " Because a diuretic was in use when it was taken, a high urine sodium **cannot be read** as SIADH or salt wasting: it may simply be the diuretic."
            : string.Empty;
        card.Steps.Add(Invariant.Format(
            $"**Urine sodium**: {cited} is above {Invariant.Number(options.LowUrineSodiumAtOrBelow)} mmol/L: renal sodium loss or normal intake with water retention: diuretics, kidney disease, SIADH, adrenal insufficiency, hypothyroidism, cerebral or renal salt wasting (2014 European guideline).{caution}"));
        card.Findings.Add(Invariant.Format($"Urine sodium {Invariant.Number(una2.Value)} mmol/L (> {Invariant.Number(options.LowUrineSodiumAtOrBelow)}){(onDiuretic ? ", taken on a diuretic" : string.Empty)}."));
        card.Differential.Add("Urine sodium above the cut-off: diuretics, kidney disease, SIADH, adrenal insufficiency, hypothyroidism, cerebral or renal salt wasting.");
    }

    /// <summary>"not available", or why the result that was received could not be used (set aside, or only a bound).</summary>
    private static string NotUsable(DecisionContext context, Analyte analyte, LabResult serum)
        => context.Request.Facts.Observe(analyte, serum.EffectiveAt.AddHours(-context.Options.Workup.UrineUsableBeforeSodiumHours)).Match(
            _ => "not available",
            bound => Invariant.Format($"reported only as a bound ({Bounds.Describe(bound)} {bound.Unit}, {Markdown.Escape(bound.Reference)}), not a measurement"),
            unread => "**unknown** (" + unread.CouldNotBeReadText + ")",
            _ => "not available");
}
