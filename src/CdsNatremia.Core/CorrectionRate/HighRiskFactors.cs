using CdsNatremia.Core.Facts;
using CdsNatremia.Core.Knowledge;
using CdsNatremia.Core.Text;

namespace CdsNatremia.Core.CorrectionRate;

/// <summary>
/// Finds the factors that put a patient at high risk of osmotic demyelination, per the US expert panel (Verbalis et al.,
/// Am J Med 2013;126:S1; reference sheet: secondary): sodium ≤ 105 mmol/L, low potassium, alcohol use disorder,
/// malnutrition and advanced liver disease. Conditions are matched against the ValueSets in <c>profiles/</c>.
/// </summary>
public static class HighRiskFactors
{
    /// <summary>The ValueSets of high-risk conditions, with the word a card uses.</summary>
    public static IReadOnlyList<(string SetId, string Kind, string Label)> ConditionSets { get; } =
    [
        ("condition-alcohol-use-disorder", "alcohol", "alcohol use disorder"),
        ("condition-malnutrition", "malnutrition", "malnutrition"),
        ("condition-cirrhosis", "liver", "advanced liver disease"),
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
    /// <param name="display">How times are printed (default UTC).</param>
    public static IReadOnlyList<HighRiskFactor> Find(PatientFacts facts, LabResult? nadir, KnowledgeBase knowledge, CorrectionRateOptions options, TimeDisplay? display = null)
    {
        display ??= TimeDisplay.Utc(default);
        Guard.NotNull(facts, nameof(facts));
        Guard.NotNull(knowledge, nameof(knowledge));
        Guard.NotNull(options, nameof(options));
        var found = new List<HighRiskFactor>();
        if (nadir is not null && nadir.Value <= options.HighRiskNadirAtOrBelow)
        {
            found.Add(new HighRiskFactor(
                "nadir",
                Invariant.Format($"lowest sodium {Invariant.Number(nadir.Value)} mmol/L at {display.Time(nadir.EffectiveAt)} ({Markdown.Escape(nadir.Reference)}) is at or below {Invariant.Number(options.HighRiskNadirAtOrBelow)} mmol/L"),
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
                ? (low, "the laboratory's lower reference limit")
                : (options.LowPotassiumBelow, "the configured lower limit");
            if (potassium.Value < below)
            {
                found.Add(new HighRiskFactor(
                    "potassium",
                    Invariant.Format($"low potassium: {Invariant.Number(potassium.Value)} mmol/L at {display.Time(potassium.EffectiveAt)} ({Markdown.Escape(potassium.Reference)}), below {basis} of {Invariant.Number(below)} mmol/L"),
                    potassium.Reference));
                break;
            }
        }

        foreach (var (setId, kind, label) in ConditionSets)
        {
            if (knowledge.Find(setId) is not { } set)
            {
                continue;
            }

            var condition = facts.Conditions
                .OrderBy(c => c.ResourceId, StringComparer.Ordinal)
                .FirstOrDefault(c => c.Codes.Any(set.Matches) || set.MatchName(c.Text) is not null);
            if (condition is not null)
            {
                var text = string.IsNullOrWhiteSpace(condition.Text) ? string.Empty : ": " + Markdown.Escape(condition.Text);
                found.Add(new HighRiskFactor(kind, $"{label}{text} ({Markdown.Escape(condition.Reference)})", condition.Reference));
            }
        }

        return found;
    }
}
