using CdsNatremia.Core.Facts;
using CdsNatremia.Core.Findings;

namespace CdsNatremia.Core.CorrectionRate;

/// <summary>
/// The rise of serum sodium in one 24-h or 48-h window, with its limit. A window is anchored at the nadir while the
/// latest result is within its length of the nadir (the "first 24 h" of the guidelines); later it is the window of that
/// length ending at the latest result ("any 24 h"). Immutable.
/// </summary>
/// <param name="LengthHours">24 or 48.</param>
/// <param name="AnchoredAtNadir">True when the window starts at the nadir.</param>
/// <param name="Start">Window start.</param>
/// <param name="End">Window end (nadir + length when anchored; the latest result's time when rolling).</param>
/// <param name="Baseline">The result the rise is measured from (the lowest at or before the window's start or inside it).</param>
/// <param name="Latest">The result the rise is measured to.</param>
/// <param name="Rise">Latest minus baseline, mmol/L (negative when falling).</param>
/// <param name="Limit">The limit that applies, mmol/L.</param>
/// <param name="LimitLabel">Which limit, as a phrase (e.g. <see cref="FindingKind.RateLimitFirstDay"/>: "first 24 h after the nadir").</param>
/// <param name="HoursLeft">Hours from now to the end of an anchored window (0 when it has ended); null for a rolling window.</param>
/// <param name="ProjectedRise">The rise at the window's end if the current rate goes on; null when it cannot be projected.</param>
/// <param name="Status">Where the rise stands.</param>
public sealed record RateWindow(
    double LengthHours,
    bool AnchoredAtNadir,
    DateTimeOffset Start,
    DateTimeOffset End,
    LabResult Baseline,
    LabResult Latest,
    double Rise,
    double Limit,
    Finding LimitLabel,
    double? HoursLeft,
    double? ProjectedRise,
    RateStatus Status)
{
    /// <summary>
    /// A result inside the window whose rise from the baseline reached the limit although the latest result is lower
    /// (an overshoot since re-lowered, or a falling-back value): the limit was passed even if the latest rise is within it.
    /// </summary>
    public LabResult? PassedAt { get; init; }

    /// <summary>
    /// True when the baseline and the latest result are closer than the minimum span
    /// (<see cref="CorrectionRateOptions.MinimumRateSpanHours"/>): no rate is computed and the status is "no rise".
    /// </summary>
    public bool SpanTooShort { get; init; }

    /// <summary>True when the rise was measured over more hours than the window's length (no result at the window's start).</summary>
    public bool MeasuredOverLongerSpan => ElapsedHours > LengthHours + (1.0 / 60);

    /// <summary>Hours between the baseline and the latest result.</summary>
    public double ElapsedHours => (Latest.EffectiveAt - Baseline.EffectiveAt).TotalHours;

    /// <summary>Allowance left in this window, mmol/L (negative when past the limit).</summary>
    public double Remaining => Limit - Math.Max(0, Rise);

    /// <summary>True when the baseline and latest come from different kinds of specimen (blood gas or point of care vs laboratory).</summary>
    public bool MixedSpecimens => Baseline.IsWholeBlood != Latest.IsWholeBlood;
}
