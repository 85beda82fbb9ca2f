using CdsNatremia.Core.Facts;
using CdsNatremia.Core.Findings;
using CdsNatremia.Core.Rendering;
using CdsNatremia.Core.Text;

namespace CdsNatremia.Core.Drugs;

/// <summary>
/// The medicines that stopped within <see cref="DrugCauseOptions.RecentlyStoppedWithinDays"/> of the assessment. A
/// record with an end time counts when the end is inside the look-back; without one, when it was last recorded inside
/// it (use ended at or before then); with no time at all, it counts as "possibly recent" (the cautious reading: a stop
/// date that is not recorded is not a stop date long ago). Pure.
/// </summary>
public static class RecentlyStopped
{
    /// <summary>The recently stopped medicines, oldest reference first.</summary>
    public static IReadOnlyList<MedicationFact> Find(PatientFacts facts, DateTimeOffset now, DrugCauseOptions options)
    {
        Guard.NotNull(facts, nameof(facts));
        Guard.NotNull(options, nameof(options));
        var from = now.AddDays(-options.RecentlyStoppedWithinDays);
        return facts.StoppedMedications
            .Where(m => (m.EndedAt ?? m.LastRecordedAt) is not { } at || at >= from)
            .OrderBy(m => m.Reference, StringComparer.Ordinal)
            .ToList();
    }

    /// <summary>True when the record says when use ended (or when it was last recorded), so "recent" is known, not assumed.</summary>
    public static bool IsDated(MedicationFact medication) => Guard.NotNull(medication, nameof(medication)).EndedAt is not null || medication.LastRecordedAt is not null;

    /// <summary>"stopped 2026-03-06 … (MedicationStatement/x)", "stopped on or before …", "stop date not recorded …" as a finding.</summary>
    public static Finding Stopped(MedicationFact medication)
    {
        Guard.NotNull(medication, nameof(medication));
        var reference = Slot.Text("reference", medication.Reference);
        var finding = medication.EndedAt is { } end
            ? Finding.Of(FindingKind.DrugStoppedEnded, Slot.Time("time", end), reference)
            : medication.LastRecordedAt is { } recorded
                ? Finding.Of(FindingKind.DrugStoppedOnOrBefore, Slot.Time("time", recorded), reference)
                : Finding.Of(FindingKind.DrugStoppedUndated, reference).With(Certainty.Unknown);
        return finding.RestingOn(medication.Reference);
    }
}
