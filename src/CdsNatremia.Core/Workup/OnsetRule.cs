using CdsNatremia.Core.Assessment;
using CdsNatremia.Core.Engine;
using CdsNatremia.Core.Facts;

using CdsNatremia.Core.Findings;

namespace CdsNatremia.Core.Workup;

/// <summary>
/// Step 3 of the work-up: acute or chronic, from the sodium series. A normal sodium less than
/// <see cref="WorkupOptions.AcuteWithinHours"/> (48 h) before the low value, with only low values between, documents an
/// acute fall; anything else is chronic or of unknown duration, which the 2014 European guideline treats as chronic.
/// </summary>
public sealed class OnsetRule : IAssessmentRule
{
    /// <inheritdoc />
    public string RuleId => "workup.onset";

    /// <summary>The last normal sodium before the latest low one, or null when none is on record.</summary>
    public static LabResult? LastNormalBefore(DecisionContext context)
    {
        Guard.NotNull(context, nameof(context));
        var latest = context.Sodium.Latest!;
        var thresholds = context.Thresholds;
        var paired = context.Options.Workup.PairedWithinHours;

        // A normal blood-gas value beside a low laboratory value (or the reverse) within the pairing window is a question of
        // method (pseudohyponatremia), not of onset: such a pair is not read as a fall.
        return context.Sodium.Results
            .Where(r => r.EffectiveAt < latest.EffectiveAt && r.Value >= thresholds.NormalFrom && r.Value <= thresholds.NormalTo)
            .Where(r => r.IsWholeBlood == latest.IsWholeBlood || (latest.EffectiveAt - r.EffectiveAt).TotalHours > paired)
            .LastOrDefault();
    }

    /// <summary>True when the low sodium is documented as less than the acute window old.</summary>
    public static bool IsAcute(DecisionContext context, out LabResult? lastNormal, out double? hours)
    {
        Guard.NotNull(context, nameof(context));
        lastNormal = LastNormalBefore(context);
        hours = lastNormal is null ? null : (context.Sodium.Latest!.EffectiveAt - lastNormal.EffectiveAt).TotalHours;
        // The fall must also be recent now: a low sodium whose last normal value is 48 h or more before this assessment
        // may have lasted that long, and the guideline treats that as chronic even if no later result was taken.
        var sinceNormalNow = lastNormal is null ? (double?)null : (context.Request.Now - lastNormal.EffectiveAt).TotalHours;
        return hours < context.Options.Workup.AcuteWithinHours && sinceNormalNow < context.Options.Workup.AcuteWithinHours;
    }

    /// <inheritdoc />
    public void Apply(DecisionContext context, AssessmentBuilder card)
    {
        Guard.NotNull(context, nameof(context));
        Guard.NotNull(card, nameof(card));
        var window = context.Options.Workup.AcuteWithinHours;
        var acute = IsAcute(context, out var lastNormal, out var hours);
        card.RuleIds.Add(RuleId);
        card.Sources.Add(WorkupSources.European2014);
        if (lastNormal is not null)
        {
            card.ResourcesUsed.Add(lastNormal.Reference);
        }

        if (acute)
        {
            card.Steps.Add(Finding.Of(
                FindingKind.OnsetAcuteStep,
                Slot.Result("lastNormal", lastNormal!),
                Slot.Hours("hours", hours!.Value),
                Slot.Number("window", window)).RestingOn(lastNormal!.Reference));
            card.Findings.Add(Finding.Of(FindingKind.OnsetAcuteFinding, Slot.Number("normal", lastNormal.Value), Slot.Hours("hours", hours.Value))
                .RestingOn(lastNormal.Reference).Weighted(Weights.Pace));
            card.Cautions.Add(Finding.Of(FindingKind.OnsetAcuteCaution, Slot.Hours("hours", hours.Value)));
            card.NextSteps.Add(Finding.Of(FindingKind.OnsetAcuteNext));
            card.Raise(context.Options.Workup.AcuteIndicator);
            card.OfferSummaryAction(42, Finding.Of(FindingKind.OnsetAcuteAction));
            return;
        }

        var why = lastNormal is null
            ? Finding.Of(FindingKind.OnsetChronicNoNormal)
            : hours < window
                ? Finding.Of(
                    FindingKind.OnsetChronicTooOldNow,
                    Slot.Result("lastNormal", lastNormal),
                    Slot.Hours("hours", hours!.Value),
                    Slot.Hours("sinceNow", (context.Request.Now - lastNormal.EffectiveAt).TotalHours),
                    Slot.Number("window", window))
                : Finding.Of(FindingKind.OnsetChronicNotWithin, Slot.Result("lastNormal", lastNormal), Slot.Hours("hours", hours!.Value), Slot.Number("window", window));
        card.Steps.Add(Finding.Of(FindingKind.OnsetChronicStep, Slot.Phrase("why", why)));
    }
}
