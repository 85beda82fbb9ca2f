using CdsNatremia.Core.Facts;

namespace CdsNatremia.Core.Sodium;

/// <summary>
/// The patient's usable sodium results in time order (oldest first), with the latest result and its age, and what is
/// known beyond them: a newer bound (<see cref="NewestBound"/>) and newer results that could not be read
/// (<see cref="NewerUnreadable"/>). Only measurements are in <see cref="Results"/>, so no rate is computed from a bound.
/// Duplicates of the same Observation id are collapsed; results at the same minute keep a stable order by id.
/// </summary>
public sealed class SodiumSeries
{
    private SodiumSeries(IReadOnlyList<LabResult> ordered, DateTimeOffset now, SodiumReadingOptions options, PatientFacts facts)
    {
        Results = ordered;
        Now = now;
        Latest = ordered.Count > 0 ? ordered[^1] : null;
        LatestAgeHours = Latest is null ? null : (now - Latest.EffectiveAt).TotalHours;
        LatestIsStale = LatestAgeHours > options.StaleAfterHours;
        StaleAfterHours = options.StaleAfterHours;
        NewestBound = facts.BoundedLabs
            .Where(l => l.Analyte == Analyte.Sodium && (Latest is null || l.EffectiveAt >= Latest.EffectiveAt))
            .OrderByDescending(l => l.EffectiveAt)
            .ThenBy(l => l.ResourceId, StringComparer.Ordinal)
            .FirstOrDefault();
        var newestKnown = NewestBound?.EffectiveAt ?? Latest?.EffectiveAt;
        NewerUnreadable = facts.SetAside
            .Where(s => s.Analyte == Analyte.Sodium && s.State == FactState.Unreadable && (newestKnown is null || s.At is not { } at || at > newestKnown))
            .ToList();
    }

    /// <summary>
    /// The newest sodium bound (comparator &lt;, &gt;…) at or after <see cref="Latest"/>, or null. A bound places the sodium
    /// on one side of a number; it is never a value to compute a rate or difference with.
    /// </summary>
    public LabResult? NewestBound { get; }

    /// <summary>
    /// Sodium results set aside as unreadable (impossible value, unknown unit, unparseable) that are newer than every
    /// usable or bounded sodium, or have no time: the newest sodium may be one of them. Another patient's, superseded and
    /// withdrawn results are not here.
    /// </summary>
    public IReadOnlyList<SetAsideItem> NewerUnreadable { get; }

    /// <summary>The state of the newest sodium: bounded, unreadable, usable or absent.</summary>
    public FactState NewestState
        => NewestBound is not null ? FactState.Bounded
            : NewerUnreadable.Count > 0 ? FactState.Unreadable
            : Latest is not null ? FactState.Usable
            : FactState.Absent;

    /// <summary>Usable sodium results, oldest first.</summary>
    public IReadOnlyList<LabResult> Results { get; }

    /// <summary>The assessment time.</summary>
    public DateTimeOffset Now { get; }

    /// <summary>The newest usable sodium, or null when there is none.</summary>
    public LabResult? Latest { get; }

    /// <summary>Hours between <see cref="Latest"/> and now.</summary>
    public double? LatestAgeHours { get; }

    /// <summary>True when the newest result is older than the stale window.</summary>
    public bool LatestIsStale { get; }

    /// <summary>The stale window in hours, for the card text.</summary>
    public double StaleAfterHours { get; }

    /// <summary>Builds the series from the facts' sodium results.</summary>
    public static SodiumSeries From(PatientFacts facts, DateTimeOffset now, SodiumReadingOptions options)
    {
        Guard.NotNull(facts, nameof(facts));
        Guard.NotNull(options, nameof(options));
        var ordered = facts.Labs
            .Where(l => l.Analyte == Analyte.Sodium)
            .GroupBy(l => l.ResourceId, StringComparer.Ordinal)
            .Select(g => g.First())
            .OrderBy(l => l.EffectiveAt)
            .ThenBy(l => l.ResourceId, StringComparer.Ordinal)
            .ToList();
        return new SodiumSeries(ordered, now, options, facts);
    }
}
