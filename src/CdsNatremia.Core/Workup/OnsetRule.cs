using CdsNatremia.Core.Text;
using CdsNatremia.Core.Assessment;
using CdsNatremia.Core.Engine;
using CdsNatremia.Core.Facts;

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
            card.Steps.Add(Invariant.Format(
                $"**Onset**: the last normal sodium, {Cite.Result(lastNormal!, context.Display)}, was {WorkupData.Duration(hours!.Value)} before the low value: a fall documented within {Invariant.Number(window)} h, so **acute** hyponatremia (2014 European guideline)."));
            card.Findings.Add(Invariant.Format($"**Acute** onset: normal sodium {Invariant.Number(lastNormal!.Value)} mmol/L {WorkupData.Duration(hours.Value)} earlier."));
            card.NextSteps.Add("Acute hyponatremia carries a higher risk of brain oedema: assess symptoms now and look for a recent cause (hypotonic intravenous fluids, surgery, drugs, excessive drinking, exercise).");
            card.Raise(context.Options.Workup.AcuteIndicator);
            card.OfferSummaryAction(42, "acute fall (< 48 h): assess symptoms now");
            return;
        }

        var why = lastNormal is null
            ? "no normal sodium is on record before it"
            : hours < window
                ? Invariant.Format($"the last normal sodium, {Cite.Result(lastNormal, context.Display)}, was {WorkupData.Duration(hours!.Value)} before the low value, but {WorkupData.Duration((context.Request.Now - lastNormal.EffectiveAt).TotalHours)} before this assessment, so the low sodium may have lasted {Invariant.Number(window)} h or more")
                : Invariant.Format($"the last normal sodium, {Cite.Result(lastNormal, context.Display)}, was {WorkupData.Duration(hours!.Value)} before the low value, not within {Invariant.Number(window)} h");
        card.Steps.Add(Invariant.Format(
            $"**Onset**: {why}: **chronic or of unknown duration**, which the 2014 European guideline treats as chronic (correction limits apply)."));
    }
}
