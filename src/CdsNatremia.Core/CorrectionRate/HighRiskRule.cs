using CdsNatremia.Core.Text;
using CdsNatremia.Core.Assessment;
using CdsNatremia.Core.Cards;
using CdsNatremia.Core.Engine;
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
        var factors = HighRiskFactors.Find(context.Request.Facts, lowest, context.Knowledge, options, context.Display);
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

        var found = string.Join("; ", factors.Select(f => f.Description));
        var day = Invariant.Number(limits.HighRiskDay);
        card.Findings.Add(Invariant.Format(
            $"**This patient is at high risk of osmotic demyelination** (US expert panel, Verbalis et al. 2013): {found}. The stricter limit applies: a rise of **no more than {day} mmol/L in any 24 h**."));
        card.Steps.Add(Invariant.Format(
            $"**Risk of osmotic demyelination**: checked sodium ≤ {Invariant.Number(options.HighRiskNadirAtOrBelow)} mmol/L in this low stretch, low potassium, alcohol use disorder, malnutrition and advanced liver disease; found {factors.Count}: {found}. Limit: {day} mmol/L in any 24 h and {Invariant.Number(limits.HighRiskTwoDays)} mmol/L in 48 h (the 48-h figure derived from the 24-h limit), in place of the usual {Invariant.Number(limits.FirstDay)} mmol/L in the first 24 h ({Text.Markdown.Escape(limits.Name)})."));
        card.NextSteps.Add(Invariant.Format(
            $"Plan a slow correction: no more than {day} mmol/L in any 24 h; replacing potassium also raises sodium (common practice), and a water diuresis once the cause is removed can raise it quickly, so check sodium often."));
        card.OfferSummaryAction(SummaryPriority, Invariant.Format($"high risk of osmotic demyelination: rise ≤ {day} mmol/L in any 24 h"));
    }
}
