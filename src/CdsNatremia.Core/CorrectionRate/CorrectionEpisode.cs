using CdsNatremia.Core.Facts;
using CdsNatremia.Core.Sodium;

namespace CdsNatremia.Core.CorrectionRate;

/// <summary>
/// The current episode of a sodium series: the nadir that started it (the lowest usable sodium within the look-back
/// before the latest result; the most recent one when the lowest value occurs more than once) and every result from the
/// nadir on. Results at the same minute as the latest are all kept; the highest of them is taken as the latest, which is
/// the cautious choice for an over-correction check. Immutable.
/// </summary>
public sealed class CorrectionEpisode
{
    private CorrectionEpisode(LabResult nadir, LabResult latest, IReadOnlyList<LabResult> results, IReadOnlyList<LabResult> sameTimeAsLatest, double lookbackHours)
    {
        Nadir = nadir;
        Latest = latest;
        Results = results;
        SameTimeAsLatest = sameTimeAsLatest;
        LookbackHours = lookbackHours;
    }

    /// <summary>The lowest sodium of the episode.</summary>
    public LabResult Nadir { get; }

    /// <summary>The latest sodium (highest of those at the latest minute).</summary>
    public LabResult Latest { get; }

    /// <summary>Results from the nadir's time to the latest, oldest first.</summary>
    public IReadOnlyList<LabResult> Results { get; }

    /// <summary>Other results at the same minute as <see cref="Latest"/> (empty normally).</summary>
    public IReadOnlyList<LabResult> SameTimeAsLatest { get; }

    /// <summary>The look-back used to find the nadir, hours.</summary>
    public double LookbackHours { get; }

    /// <summary>Latest minus nadir, mmol/L (0 when the latest is the nadir).</summary>
    public double RiseSinceNadir => Latest.Value - Nadir.Value;

    /// <summary>Hours from the nadir to the latest result.</summary>
    public double HoursSinceNadir => (Latest.EffectiveAt - Nadir.EffectiveAt).TotalHours;

    /// <summary>True when the sodium has risen since the nadir.</summary>
    public bool IsRising => RiseSinceNadir > 0;

    /// <summary>The episode of a series, or null when the series is empty.</summary>
    public static CorrectionEpisode? Find(SodiumSeries series, CorrectionRateOptions options)
    {
        Guard.NotNull(series, nameof(series));
        Guard.NotNull(options, nameof(options));
        if (series.Results.Count == 0)
        {
            return null;
        }

        var latestTime = series.Results.Max(r => Minute(r.EffectiveAt));
        var atLatest = series.Results.Where(r => Minute(r.EffectiveAt) == latestTime).ToList();
        var latest = atLatest.OrderByDescending(r => r.Value).ThenBy(r => r.ResourceId, StringComparer.Ordinal).First();
        var from = latestTime.AddHours(-options.EpisodeLookbackHours);
        var recent = series.Results.Where(r => r.EffectiveAt >= from).ToList();
        var lowest = recent.Min(r => r.Value);

        // The most recent occurrence of the lowest value: correction is counted from the last time sodium was that low.
        var nadir = recent.Where(r => r.Value == lowest).OrderBy(r => r.EffectiveAt).ThenBy(r => r.ResourceId, StringComparer.Ordinal).Last();
        // Compared to the minute, like the latest result: a lower value a few seconds after the chosen latest one (a blood
        // gas beside a laboratory value) is simultaneous with it, so the latest result always belongs to the episode.
        var results = series.Results.Where(r => Minute(r.EffectiveAt) >= Minute(nadir.EffectiveAt)).ToList();
        return new CorrectionEpisode(nadir, latest, results, atLatest.Where(r => !ReferenceEquals(r, latest)).ToList(), options.EpisodeLookbackHours);
    }

    /// <summary>Times compared to the minute: results reported at the same minute are simultaneous.</summary>
    internal static DateTimeOffset Minute(DateTimeOffset time)
        => new(time.UtcTicks - (time.UtcTicks % TimeSpan.TicksPerMinute), TimeSpan.Zero);
}
