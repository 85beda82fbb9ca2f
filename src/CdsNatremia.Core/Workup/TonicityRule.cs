using CdsNatremia.Core.Text;
using CdsNatremia.Core.Assessment;
using CdsNatremia.Core.Engine;

namespace CdsNatremia.Core.Workup;

/// <summary>
/// Step 1 of the work-up: is the low sodium hypotonic? Measured serum osmolality (LOINC 2692-2) first, else calculated
/// (SI or, when reported so, the US-unit form), with the method shown, the effective osmolality (urea excluded) and the
/// osmolal gap when both exist. Thresholds: <see cref="WorkupOptions"/>.
/// </summary>
public sealed class TonicityRule : IAssessmentRule
{
    /// <inheritdoc />
    public string RuleId => "workup.tonicity";

    /// <inheritdoc />
    public void Apply(DecisionContext context, AssessmentBuilder card)
    {
        Guard.NotNull(context, nameof(context));
        Guard.NotNull(card, nameof(card));
        var options = context.Options.Workup;
        var t = TonicityAssessment.From(context);
        card.RuleIds.Add(RuleId);
        card.Sources.Add(WorkupSources.Siadh);
        foreach (var used in new[] { t.Measured, t.Glucose, t.Urea }.OfType<Facts.LabResult>())
        {
            card.ResourcesUsed.Add(used.Reference);
        }

        var name = TonicityAssessment.NameOf(t.Band);
        var edges = Invariant.Format(
            $"hypotonic when effective osmolality is below {Invariant.Number(options.HypotonicBelow)} mOsm/kg (SIADH criteria; 2014 European guideline); hypertonic when total osmolality is above {Invariant.Number(options.HypertonicAbove)} mOsm/kg (reference range 275–295: common practice)");

        switch (t.Method)
        {
            case OsmolalityMethod.Measured:
                card.Steps.Add(Invariant.Format($"**Tonicity** (measured osmolality, the preferred method): {Cite.Result(t.Measured!, context.Display)}. {EffectiveText(t, context.Display)} → **{name}** ({edges})."));
                card.Findings.Add(Invariant.Format($"Serum tonicity: **{name}** (measured osmolality {Invariant.Number(t.Measured!.Value)} mOsm/kg{EffectiveShort(t)})."));
                break;
            case OsmolalityMethod.Calculated:
                card.Sources.Add(WorkupSources.OsmolalityFormulas);
                card.Steps.Add(Invariant.Format(
                    $"**Tonicity** (calculated: no measured serum osmolality within {Invariant.Number(options.PairedWithinHours)} h of the sodium): {CalculatedText(t, context.Display)} → **{name}** ({edges}). A calculated value rests on the measured sodium itself, so it cannot exclude a falsely low sodium (pseudohyponatremia) or unmeasured osmoles; a measured osmolality settles it."));
                card.Findings.Add(Invariant.Format($"Serum tonicity: **{name}** by calculation only (measured osmolality not available)."));
                break;
            default:
                card.Steps.Add(Invariant.Format(
                    $"**Tonicity**: **unknown**: no measured serum osmolality and no glucose within {Invariant.Number(options.PairedWithinHours)} h of the sodium to calculate one. Until it is known, the low sodium is worked up as possibly hypotonic."));
                card.Findings.Add("Serum tonicity: **unknown** (no measured osmolality, no glucose to calculate one).");
                break;
        }

        if (t.Method == OsmolalityMethod.Calculated && t.Calculated is null && t.Band == Tonicity.Unknown)
        {
            card.Steps.Add("Urea is not available, so only the effective osmolality could be calculated and it is not low; whether the serum is isotonic or hypertonic needs a measured osmolality.");
        }

        if (t.Gap is { } gap)
        {
            card.Sources.Add(WorkupSources.OsmolalityFormulas);
            var verdict = t.GapIsHigh
                ? Invariant.Format($"above {Invariant.Number(options.OsmolalGapAbove)} mOsm/kg, **raised**: unmeasured osmoles (e.g. alcohols, mannitol) or a falsely low sodium (pseudohyponatremia) are possible")
                : Invariant.Format($"not above {Invariant.Number(options.OsmolalGapAbove)} mOsm/kg");
            card.Steps.Add(Invariant.Format(
                $"**Osmolal gap** {Invariant.Number(gap)} mOsm/kg (measured {Invariant.Number(t.Measured!.Value)} − calculated {Invariant.Number(t.Calculated!.Value)}): {verdict}."));
            if (t.GapIsHigh)
            {
                card.Findings.Add(Invariant.Format($"Osmolal gap {Invariant.Number(gap)} mOsm/kg: raised."));
            }
        }
    }

    /// <summary>The calculated osmolality with its inputs, in the units the laboratory reported.</summary>
    internal static string CalculatedText(TonicityAssessment t, TimeDisplay display)
    {
        var na = Invariant.Number(t.Sodium.Value);
        if (t.Calculated is not { } calculated)
        {
            return Invariant.Format(
                $"effective osmolality 2 × {na} + glucose {Invariant.Number(t.Glucose!.Value)} = {Invariant.Number(t.CalculatedEffective!.Value)} mOsm/kg (urea not available; {Cite.Result(t.Glucose, display)})");
        }

        if (t.ReportedInUsUnits)
        {
            // The terms shown are the exact molar-mass conversions, so this total is the SI total, digit for digit.
            return Invariant.Format(
                $"{Invariant.Number(calculated)} mOsm/kg (US units as reported: 2 × {na} + glucose {Invariant.Number(t.Glucose!.OriginalValue!.Value)} mg/dL ÷ 18 + urea nitrogen {Invariant.Number(t.Urea!.OriginalValue!.Value)} mg/dL ÷ 2.8 = {Invariant.Number(2 * t.Sodium.Value)} + {Invariant.Number(t.Glucose.Value)} + {Invariant.Number(t.Urea.Value)}, with the exact divisors 18.016 and 2.8014; {Cite.Result(t.Glucose, display)}; {Cite.Result(t.Urea, display)})");
        }

        return Invariant.Format(
            $"{Invariant.Number(calculated)} mOsm/kg (SI units: 2 × {na} + glucose {Invariant.Number(t.Glucose!.Value)} + urea {Invariant.Number(t.Urea!.Value)} mmol/L; {Cite.Result(t.Glucose, display)}; {Cite.Result(t.Urea, display)})");
    }

    private static string EffectiveText(TonicityAssessment t, TimeDisplay display)
    {
        if (t.Urea is null)
        {
            return "Urea is not available, so the effective osmolality (urea excluded) is taken as the measured value, an upper bound";
        }

        return Invariant.Format(
            $"Effective osmolality, excluding urea (an ineffective osmole that crosses cell membranes: common practice): {Invariant.Number(t.Measured!.Value)} − urea {Invariant.Number(t.Urea.Value)} = {Invariant.Number(t.Effective!.Value)} mOsm/kg ({Cite.Result(t.Urea, display)})");
    }

    private static string EffectiveShort(TonicityAssessment t)
        => t.Urea is null ? string.Empty : Invariant.Format($", effective {Invariant.Number(t.Effective!.Value)} mOsm/kg");
}
