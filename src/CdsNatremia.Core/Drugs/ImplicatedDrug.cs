using CdsNatremia.Core.Facts;
using CdsNatremia.Core.Knowledge;

namespace CdsNatremia.Core.Drugs;

/// <summary>A medication that matched a drug-cause set, with how it matched and what its timing says.</summary>
/// <param name="Medication">The record the verdict rests on.</param>
/// <param name="Match">The set, the ingredient and how it matched (code or name).</param>
/// <param name="Timing">The timing verdict and evidence.</param>
/// <param name="OtherRecords">Other records of the same ingredient in the same group (e.g. a statement and an order).</param>
public sealed record ImplicatedDrug(MedicationFact Medication, MedicationMatch Match, TimingEvidence Timing, IReadOnlyList<string> OtherRecords)
{
    /// <summary>True for the primary (well-established) tier.</summary>
    public bool IsPrimary => Match.Set.Tier == EvidenceTier.Primary;

    /// <summary>True when timing does not rule it out (likely or possible).</summary>
    public bool Counts => Timing.Verdict is TimingVerdict.Likely or TimingVerdict.Possible;
}
