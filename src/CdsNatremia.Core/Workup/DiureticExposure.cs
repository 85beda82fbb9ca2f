using CdsNatremia.Core.Engine;
using CdsNatremia.Core.Facts;
using CdsNatremia.Core.Knowledge;
using CdsNatremia.Core.Text;

namespace CdsNatremia.Core.Workup;

/// <summary>
/// The diuretics the patient takes (active or intended, not draft orders), with when they started. The work-up needs only
/// presence and timing: a diuretic makes urine sodium hard to read and fails the SIADH "no recent diuretic" criterion.
/// Drug-cause reasoning is not done here.
/// </summary>
/// <param name="Medication">The medication record.</param>
/// <param name="Match">Why it counts as a diuretic.</param>
public sealed record DiureticExposure(MedicationFact Medication, MedicationMatch Match)
{
    /// <summary>
    /// Knowledge sets read as diuretics: thiazides and loop diuretics, plus any set whose id names a diuretic (so a
    /// potassium-sparing set added later is picked up without a code change).
    /// </summary>
    public static IEnumerable<CodeSet> DiureticSets(KnowledgeBase knowledge)
        => Guard.NotNull(knowledge, nameof(knowledge)).WithIdPrefix("drug-")
            .Where(s => s.Id == "drug-thiazide" || s.Id.Contains("diuretic", StringComparison.Ordinal));

    /// <summary>Every diuretic in the record (statements and orders that are active or intended).</summary>
    public static IReadOnlyList<DiureticExposure> Find(DecisionContext context)
    {
        Guard.NotNull(context, nameof(context));
        var sets = DiureticSets(context.Knowledge).ToList();
        return context.Request.Facts.Medications
            .Where(m => m.Use is MedicationUse.Active or MedicationUse.Intended)
            .Select(m => sets.Select(s => MedicationMatching.Match(s, m)).OfType<MedicationMatch>().Select(match => new DiureticExposure(m, match)).FirstOrDefault())
            .OfType<DiureticExposure>()
            .OrderBy(d => d.Medication.Reference, StringComparer.Ordinal)
            .ToList();
    }

    /// <summary>True when the diuretic was (or may have been) in use at <paramref name="at"/>: started before it, or start unknown.</summary>
    public bool InUseAt(DateTimeOffset at) => Medication.Use == MedicationUse.Active && (Medication.StartedAt is not { } start || start <= at);

    /// <summary>"metolazone (thiazide or thiazide-like diuretic, MedicationStatement/s07-mtz, since 2026-02-24 00:00 UTC)".</summary>
    public string Describe()
    {
        var since = Medication.StartedAt is { } start ? "since " + Invariant.Time(start) : "start time not recorded";
        var use = Medication.Use == MedicationUse.Intended ? "intended, " : string.Empty;
        return $"{Markdown.Escape(Match.Ingredient)} ({Markdown.Escape(Match.Set.Label)}, {use}{Markdown.Escape(Medication.Reference)}, {since})";
    }
}
