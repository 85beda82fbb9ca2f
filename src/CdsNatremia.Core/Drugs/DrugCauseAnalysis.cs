using CdsNatremia.Core.Engine;
using CdsNatremia.Core.Facts;
using CdsNatremia.Core.Knowledge;

namespace CdsNatremia.Core.Drugs;

/// <summary>
/// Finds the patient's medications that can lower sodium and judges each one's timing. One entry per ingredient and
/// group: when the same ingredient is recorded twice (a statement and an order), the record with the strongest
/// verdict (then the earliest start) speaks and the others are listed. Ordered: likely first, primary tier first.
/// </summary>
public static class DrugCauseAnalysis
{
    /// <summary>The fall behind the latest sodium, per <see cref="SodiumFall"/>.</summary>
    public static SodiumFall? Fall(DecisionContext context)
    {
        Guard.NotNull(context, nameof(context));
        return SodiumFall.Find(context.Sodium.Results, context.Thresholds.NormalFrom, context.Options.DrugCause.MeaningfulDropMmolPerL);
    }

    /// <summary>The implicated drugs among <paramref name="medications"/>.</summary>
    public static IReadOnlyList<ImplicatedDrug> Find(IReadOnlyList<CodeSet> causeSets, IEnumerable<MedicationFact> medications, SodiumFall? fall)
    {
        Guard.NotNull(causeSets, nameof(causeSets));
        Guard.NotNull(medications, nameof(medications));
        var found = new List<ImplicatedDrug>();
        foreach (var medication in medications)
        {
            foreach (var match in MedicationMatching.MatchAll(causeSets, medication))
            {
                found.Add(new ImplicatedDrug(medication, match, DrugTiming.Assess(medication, fall), []));
            }
        }

        return found
            .GroupBy(d => (d.Match.Set.Id, Ingredient: d.Match.Ingredient.ToLowerInvariant()))
            .Select(g =>
            {
                var ordered = g.OrderBy(d => d.Timing.Verdict)
                    .ThenBy(d => d.Medication.StartedAt ?? DateTimeOffset.MaxValue)
                    .ThenBy(d => d.Medication.Reference, StringComparer.Ordinal)
                    .ToList();
                return ordered[0] with
                {
                    OtherRecords = ordered.Skip(1).Select(d => d.Medication.Reference).Distinct(StringComparer.Ordinal).ToList(),
                };
            })
            .OrderBy(d => d.Timing.Verdict)
            .ThenBy(d => d.Match.Set.Tier ?? EvidenceTier.Secondary)
            .ThenBy(d => d.Match.Ingredient, StringComparer.Ordinal)
            .ToList();
    }

    /// <summary>
    /// The drugs that act together: two or more distinct ingredients whose timing does not rule them out (likely or
    /// possible). Empty when fewer than two. Their effects on sodium add up (common practice).
    /// </summary>
    public static IReadOnlyList<ImplicatedDrug> ActingTogether(IReadOnlyList<ImplicatedDrug> implicated)
    {
        Guard.NotNull(implicated, nameof(implicated));
        var counted = implicated.Where(d => d.Counts).DistinctBy(d => d.Match.Ingredient.ToLowerInvariant()).ToList();
        return counted.Count >= 2 ? counted : [];
    }
}
