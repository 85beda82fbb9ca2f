using CdsNatremia.Core.Assessment;
using CdsNatremia.Core.Cards;
using CdsNatremia.Core.Engine;
using CdsNatremia.Core.Findings;
using CdsNatremia.Core.Workup;

namespace CdsNatremia.Core.CorrectionRate;

/// <summary>
/// States on the assessment card that <b>this</b> patient is at high risk of osmotic demyelination when any factor of the
/// US expert panel (Verbalis et al., Am J Med 2013;126:S1) is found: sodium ≤ 105 mmol/L in the current low stretch, low
/// potassium, alcohol use disorder, malnutrition or advanced liver disease (<see cref="HighRiskFactors"/>). It names each
/// factor with its value and the stricter limit (8 mmol/L in any 24 h by default), instead of leaving only the generic
/// caution. Silent when no factor is found, and for a low sodium that is not hypotonic (correction limits do not apply).
/// </summary>
public sealed class HighRiskRule : IAssessmentRule
{
    /// <summary>Summary priority: above moderate (20) and mild (10) clauses, below "assess for severe symptoms now" (40).</summary>
    internal const int SummaryPriority = 35;

    /// <inheritdoc />
    public string RuleId => "sodium.high-risk";

    /// <inheritdoc />
    public void Apply(DecisionContext context, AssessmentBuilder card)
    {
        Guard.NotNull(context, nameof(context));
        Guard.NotNull(card, nameof(card));
        if (TonicityAssessment.From(context).Band is Tonicity.Isotonic or Tonicity.Hypertonic)
        {
            return;
        }

        var options = context.Options.CorrectionRate;
        if (CorrectionEpisode.Find(context.Sodium, options) is not { } episode)
        {
            return;
        }

        var lowest = HighRiskFactors.LowestOfLowStretch(context.Sodium, episode.Nadir, context.Thresholds.NormalFrom);
        var factors = HighRiskFactors.Find(context.Request.Facts, lowest, context.Knowledge, options);
        if (factors.Count == 0)
        {
            return;
        }

        var limits = options.Resolve();
        card.RuleIds.Add(RuleId);
        card.Raise(CardIndicator.Warning);
        foreach (var reference in factors.Select(f => f.Reference).OfType<string>())
        {
            card.ResourcesUsed.Add(reference);
        }

        foreach (var source in RateText.Sources(limits))
        {
            card.Sources.Add(source);
        }

        var day = Slot.Number("day", limits.HighRiskDay);
        var evidence = factors.Select(f => f.Reference).OfType<string>().ToArray();

        // A patient-specific caution: short on the card; the full statement and the check itself in the reasoning.
        card.Cautions.Add(RateText.HighRiskCaution(factors, limits)!);
        card.Steps.Add(Finding.Of(FindingKind.RateHighRiskStatement, RateText.Factors(factors), day).RestingOn(evidence));
        card.Steps.Add(Finding.Of(
            FindingKind.RateHighRiskStep,
            Slot.Number("nadir", options.HighRiskNadirAtOrBelow),
            Slot.Count("count", factors.Count),
            RateText.Factors(factors),
            day,
            Slot.Number("twoDays", limits.HighRiskTwoDays),
            Slot.Number("firstDay", limits.FirstDay),
            Slot.Text("limits", limits.Name)).RestingOn(evidence));
        card.NextSteps.Add(Finding.Of(FindingKind.RateHighRiskNext, day));
        card.OfferSummaryAction(SummaryPriority, Finding.Of(FindingKind.RateHighRiskAction, day));
    }
}
