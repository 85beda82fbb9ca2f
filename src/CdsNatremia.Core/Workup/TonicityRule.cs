using CdsNatremia.Core.Text;
using CdsNatremia.Core.Assessment;
using CdsNatremia.Core.Engine;

using CdsNatremia.Core.Findings;

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

        var name = Slot.Phrase("band", TonicityAssessment.NameOf(t.Band));
        var edges = Slot.Phrase("edges", Finding.Of(
            FindingKind.TonicityEdges,
            Slot.Number("hypotonicBelow", options.HypotonicBelow),
            Slot.Number("hypertonicAbove", options.HypertonicAbove)));
        var hours = Slot.Number("hours", options.PairedWithinHours);
        var certainty = t.Band == Tonicity.Unknown ? Certainty.Unknown : Certainty.Established;

        switch (t.Method)
        {
            case OsmolalityMethod.Measured:
                card.Steps.Add(Finding.Of(FindingKind.TonicityMeasuredStep, Slot.Result("measured", t.Measured!), Slot.Phrase("effective", EffectiveText(t)), name, edges)
                    .RestingOn(t.Measured!.Reference).With(certainty));
                card.Findings.Add(Finding.Of(FindingKind.TonicityMeasuredFinding, name, Slot.Number("osmolality", t.Measured!.Value), EffectiveShort(t))
                    .RestingOn(t.Measured.Reference).With(certainty).Weighted(Weights.Context));
                break;
            case OsmolalityMethod.Calculated:
                card.Sources.Add(WorkupSources.OsmolalityFormulas);
                card.Steps.Add(Finding.Of(FindingKind.TonicityCalculatedStep, hours, Slot.Phrase("calculated", CalculatedText(t)), name, edges).With(certainty));
                card.Findings.Add(Finding.Of(FindingKind.TonicityCalculatedFinding, name).With(certainty).Weighted(Weights.Context));
                break;
            default:
                card.Steps.Add(Finding.Of(FindingKind.TonicityUnknownStep, hours).With(Certainty.Unknown));
                card.Findings.Add(Finding.Of(FindingKind.TonicityUnknownFinding).With(Certainty.Unknown).Weighted(Weights.Context));
                break;
        }

        if (t.Method == OsmolalityMethod.Calculated && t.Calculated is null && t.Band == Tonicity.Unknown)
        {
            card.Steps.Add(Finding.Of(FindingKind.TonicityNoUreaStep).With(Certainty.Unknown));
        }

        if (t.Gap is { } gap)
        {
            card.Sources.Add(WorkupSources.OsmolalityFormulas);
            var above = Slot.Number("above", options.OsmolalGapAbove);
            var verdict = Finding.Of(t.GapIsHigh ? FindingKind.TonicityGapRaised : FindingKind.TonicityGapNormal, above);
            card.Steps.Add(Finding.Of(
                FindingKind.TonicityGapStep,
                Slot.Number("gap", gap),
                Slot.Number("measured", t.Measured!.Value),
                Slot.Number("calculated", t.Calculated!.Value),
                Slot.Phrase("verdict", verdict)));
            if (t.GapIsHigh)
            {
                card.Findings.Add(Finding.Of(FindingKind.TonicityGapFinding, Slot.Number("gap", gap)).Weighted(Weights.Cause));
            }
        }
    }

    /// <summary>The calculated osmolality with its inputs, in the units the laboratory reported.</summary>
    internal static Finding CalculatedText(TonicityAssessment t)
    {
        var na = Slot.Number("sodium", t.Sodium.Value);
        if (t.Calculated is not { } calculated)
        {
            return Finding.Of(
                FindingKind.TonicityCalcEffectiveOnly,
                na,
                Slot.Number("glucose", t.Glucose!.Value),
                Slot.Number("effective", t.CalculatedEffective!.Value),
                Slot.Result("glucoseResult", t.Glucose)).RestingOn(t.Glucose.Reference);
        }

        if (t.ReportedInUsUnits)
        {
            // The terms shown are the exact molar-mass conversions, so this total is the SI total, digit for digit.
            return Finding.Of(
                FindingKind.TonicityCalcUs,
                Slot.Number("calculated", calculated),
                na,
                Slot.Number("glucoseMg", t.Glucose!.OriginalValue!.Value),
                Slot.Number("ureaMg", t.Urea!.OriginalValue!.Value),
                Slot.Number("twoNa", 2 * t.Sodium.Value),
                Slot.Number("glucose", t.Glucose.Value),
                Slot.Number("urea", t.Urea.Value),
                Slot.Result("glucoseResult", t.Glucose),
                Slot.Result("ureaResult", t.Urea)).RestingOn(t.Glucose.Reference, t.Urea.Reference);
        }

        return Finding.Of(
            FindingKind.TonicityCalcSi,
            Slot.Number("calculated", calculated),
            na,
            Slot.Number("glucose", t.Glucose!.Value),
            Slot.Number("urea", t.Urea!.Value),
            Slot.Result("glucoseResult", t.Glucose),
            Slot.Result("ureaResult", t.Urea)).RestingOn(t.Glucose.Reference, t.Urea.Reference);
    }

    private static Finding EffectiveText(TonicityAssessment t)
        => t.Urea is null
            ? Finding.Of(FindingKind.TonicityEffectiveNoUrea)
            : Finding.Of(
                FindingKind.TonicityEffective,
                Slot.Number("measured", t.Measured!.Value),
                Slot.Number("urea", t.Urea.Value),
                Slot.Number("effective", t.Effective!.Value),
                Slot.Result("ureaResult", t.Urea)).RestingOn(t.Urea.Reference);

    private static Slot EffectiveShort(TonicityAssessment t)
        => t.Urea is null
            ? Slot.Verbatim("effectiveShort", string.Empty)
            : Slot.Phrase("effectiveShort", Finding.Of(FindingKind.TonicityEffectiveShort, Slot.Number("effective", t.Effective!.Value)));
}
