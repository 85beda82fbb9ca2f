using CdsNatremia.Core.Facts;
using CdsNatremia.Core.Findings;
using CdsNatremia.Core.Knowledge;

namespace CdsNatremia.Core.CorrectionRate;

/// <summary>
/// Finds the factors that put a patient at high risk of osmotic demyelination, per the US expert panel (Verbalis et al.,
/// Am J Med 2013;126:S1; reference sheet: secondary): sodium ≤ 105 mmol/L, low potassium, alcohol use disorder,
/// malnutrition and advanced liver disease. Conditions are matched against the ValueSets in <c>profiles/</c>.
/// </summary>
public static class HighRiskFactors
{
    /// <summary>The ValueSets of high-risk conditions, with the phrase a card names them by.</summary>
    public static IReadOnlyList<(string SetId, string Kind, string LabelKind)> ConditionSets { get; } =
    [
        ("condition-alcohol-use-disorder", "alcohol", FindingKind.RateFactorAlcohol),
        ("condition-malnutrition", "malnutrition", FindingKind.RateFactorMalnutrition),
        ("condition-cirrhosis", "liver", FindingKind.RateFactorLiver),
    ];

    /// <summary>
    /// The lowest sodium of the whole low stretch the episode belongs to (every result since the last normal one, back
    /// beyond the episode's look-back): "sodium ≤ 105 mmol/L" makes the patient high risk for the whole correction,
    /// even once that value is older than the episode window. Falls back to the episode nadir.
    /// </summary>
    public static LabResult LowestOfLowStretch(CdsNatremia.Core.Sodium.SodiumSeries series, LabResult episodeNadir, double normalFrom)
    {
        Guard.NotNull(series, nameof(series));
        Guard.NotNull(episodeNadir, nameof(episodeNadir));
        var lowest = episodeNadir;
        for (var i = series.Results.Count - 1; i >= 0; i--)
        {
            var result = series.Results[i];
            if (result.EffectiveAt > episodeNadir.EffectiveAt)
            {
                continue;
            }

            if (result.Value >= normalFrom)
            {
                break;
            }

            if (result.Value < lowest.Value)
            {
                lowest = result;
            }
        }

        return lowest;
    }

    /// <summary>Every factor found; empty when none.</summary>
    /// <param name="facts">The patient's facts.</param>
    /// <param name="nadir">The lowest sodium of the current episode, or null.</param>
    /// <param name="knowledge">The loaded code sets.</param>
    /// <param name="options">Thresholds.</param>
    public static IReadOnlyList<HighRiskFactor> Find(PatientFacts facts, LabResult? nadir, KnowledgeBase knowledge, CorrectionRateOptions options)
    {
        Guard.NotNull(facts, nameof(facts));
        Guard.NotNull(knowledge, nameof(knowledge));
        Guard.NotNull(options, nameof(options));
        var found = new List<HighRiskFactor>();
        if (nadir is not null && nadir.Value <= options.HighRiskNadirAtOrBelow)
        {
            var threshold = Slot.Number("threshold", options.HighRiskNadirAtOrBelow);
            found.Add(new HighRiskFactor(
                "nadir",
                Finding.Of(FindingKind.RateFactorNadir, Slot.Number("sodium", nadir.Value), Slot.Time("time", nadir.EffectiveAt), Slot.Text("ref", nadir.Reference), threshold).RestingOn(nadir.Reference),
                Finding.Of(FindingKind.RateFactorNadirName, threshold),
                nadir.Reference));
        }

        // Potassium during the episode (from a day before the nadir onwards; the newest result when there is no nadir):
        // a low value at the nadir counts even if it has since been replaced, and a years-old low value does not.
        var since = nadir?.EffectiveAt.AddHours(-24);
        var potassiumResults = since is { } from
            ? facts.Results(Analyte.Potassium).Where(k => k.EffectiveAt >= from)
            : facts.Results(Analyte.Potassium).Take(1);
        foreach (var potassium in potassiumResults)
        {
            var (below, basis) = potassium.ReferenceLow is { } low
                ? (low, FindingKind.RateFactorPotassiumLaboratory)
                : (options.LowPotassiumBelow, FindingKind.RateFactorPotassiumConfigured);
            if (potassium.Value < below)
            {
                found.Add(new HighRiskFactor(
                    "potassium",
                    Finding.Of(basis, Slot.Number("potassium", potassium.Value), Slot.Time("time", potassium.EffectiveAt), Slot.Text("ref", potassium.Reference), Slot.Number("below", below)).RestingOn(potassium.Reference),
                    Finding.Of(FindingKind.RateFactorPotassiumName),
                    potassium.Reference));
                break;
            }
        }

        foreach (var (setId, kind, labelKind) in ConditionSets)
        {
            if (knowledge.Find(setId) is not { } set)
            {
                continue;
            }

            var condition = facts.Conditions
                .OrderBy(c => c.ResourceId, StringComparer.Ordinal)
                .FirstOrDefault(c => set.MatchesAny(c.Codes) || set.MatchName(c.Text) is not null);
            if (condition is not null)
            {
                var label = Finding.Of(labelKind);
                var description = string.IsNullOrWhiteSpace(condition.Text)
                    ? Finding.Of(FindingKind.RateFactorConditionUntitled, Slot.Phrase("label", label), Slot.Text("ref", condition.Reference))
                    : Finding.Of(FindingKind.RateFactorCondition, Slot.Phrase("label", label), Slot.Text("text", condition.Text), Slot.Text("ref", condition.Reference));
                found.Add(new HighRiskFactor(kind, description.RestingOn(condition.Reference), label, condition.Reference));
            }
        }

        return found;
    }
}
