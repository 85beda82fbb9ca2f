using CdsNatremia.Core.Facts;

namespace CdsNatremia.Core.Sodium;

/// <summary>
/// The patient's usable sodium results in time order (oldest first), with the latest result and its age.
/// Duplicates of the same Observation id are collapsed; results at the same minute keep a stable order by id.
/// </summary>
public sealed class SodiumSeries
{
    private SodiumSeries(IReadOnlyList<LabResult> ordered, DateTimeOffset now, SodiumReadingOptions options)
    {
        Results = ordered;
        Now = now;
        Latest = ordered.Count > 0 ? ordered[^1] : null;
        LatestAgeHours = Latest is null ? null : (now - Latest.EffectiveAt).TotalHours;
        LatestIsStale = LatestAgeHours > options.StaleAfterHours;
        StaleAfterHours = options.StaleAfterHours;
    }

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
        return new SodiumSeries(ordered, now, options);
    }
}
