using System.ComponentModel.DataAnnotations;

namespace CdsNatremia.Core.Sodium;

/// <summary>How old and how new a result may be before the service labels or rejects it.</summary>
public sealed class SodiumReadingOptions
{
    /// <summary>
    /// A result older than this many hours is "stale": still shown, labelled, and a recheck suggested.
    /// Default 72 h (common practice for an inpatient chart; an operator may shorten it).
    /// </summary>
    [Range(1, 24 * 365)]
    public double StaleAfterHours { get; set; } = 72;

    /// <summary>
    /// A result timed more than this many minutes after "now" is set aside as an impossible future time.
    /// Default 10 min, to tolerate small clock differences between systems (common practice).
    /// </summary>
    [Range(0, 24 * 60)]
    public double FutureToleranceMinutes { get; set; } = 10;
}
