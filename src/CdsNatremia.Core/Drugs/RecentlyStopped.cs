using CdsNatremia.Core.Facts;
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

    /// <summary>"stopped 2026-03-06 (MedicationStatement/x)", "stopped on or before 2026-03-06 …", "stop date not recorded …" (Markdown-escaped).</summary>
    public static string When(MedicationFact medication, TimeDisplay display)
    {
        Guard.NotNull(medication, nameof(medication));
        var reference = Markdown.Escape(medication.Reference);
        return medication.EndedAt is { } end
            ? Invariant.Format($"stopped {display.Time(end)} ({reference})")
            : medication.LastRecordedAt is { } recorded
                ? Invariant.Format($"stopped on or before {display.Time(recorded)} ({reference})")
                : $"stop date not recorded ({reference})";
    }
}
