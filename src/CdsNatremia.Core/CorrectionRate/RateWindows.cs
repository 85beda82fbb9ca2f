using CdsNatremia.Core.Facts;
using CdsNatremia.Core.Findings;

namespace CdsNatremia.Core.CorrectionRate;

/// <summary>
/// Measures the rise of sodium in 24-h and 48-h windows of an episode. A window of length L is anchored at the nadir
/// while the time it is measured at is no more than L after the nadir (so a result exactly 24 h after the nadir still
/// belongs to the first 24 h); later, it is the window of length L ending at that time, and its baseline is the lowest of
/// the last result at or before the window's start and the results inside it. No rate is measured between results less
/// than <see cref="CorrectionRateOptions.MinimumRateSpanHours"/> apart (<see cref="RateWindow.SpanTooShort"/>). Pure.
/// </summary>
public static class RateWindows
{
    /// <summary>
    /// Measures one window.
    /// </summary>
    /// <param name="episode">The episode.</param>
    /// <param name="at">The time the window ends at or is measured at: the latest result's time for the rate watch, "now" for an order.</param>
    /// <param name="lengthHours">24 or 48.</param>
    /// <param name="limits">The correction limits.</param>
    /// <param name="highRisk">True when the patient is at high risk.</param>
    /// <param name="now">The assessment time, for hours left.</param>
    /// <param name="options">Approaching margin and projection settings.</param>
    public static RateWindow Measure(
        CorrectionEpisode episode,
        DateTimeOffset at,
        double lengthHours,
        CorrectionLimits limits,
        bool highRisk,
        DateTimeOffset now,
        CorrectionRateOptions options)
    {
        Guard.NotNull(episode, nameof(episode));
        Guard.NotNull(limits, nameof(limits));
        Guard.NotNull(options, nameof(options));
        var nadir = episode.Nadir;
        var anchored = (at - nadir.EffectiveAt).TotalHours <= lengthHours;
        var start = anchored ? nadir.EffectiveAt : at.AddHours(-lengthHours);
        var end = anchored ? nadir.EffectiveAt.AddHours(lengthHours) : at;
        if (!anchored && !highRisk && lengthHours <= 24 && limits.FirstDay != limits.LaterDay)
        {
            // A preset with a larger first-day limit (2014 European guideline: 10, then 8 in each 24 h after) counts days
            // from the nadir: day 2 runs from nadir + 24 h to nadir + 48 h, and so on. A rolling window here would charge
            // the first day's allowed rise against a later day's smaller limit and raise a false alarm.
            var days = Math.Floor((at - nadir.EffectiveAt).TotalHours / 24);
            start = nadir.EffectiveAt.AddHours(24 * days);
            end = start.AddHours(24);
        }

        var inRange = episode.Results.Where(r => CorrectionEpisode.Minute(r.EffectiveAt) <= CorrectionEpisode.Minute(at)).ToList();
        var latest = inRange.Contains(episode.Latest) ? episode.Latest : inRange[^1];
        LabResult baseline;
        if (anchored)
        {
            baseline = nadir;
        }
        else
        {
            var atStart = inRange.Where(r => r.EffectiveAt <= start).OrderBy(r => r.EffectiveAt).LastOrDefault() ?? nadir;
            // A baseline closer to the latest than the minimum span gives no rate (measurement variation, not correction).
            var candidates = inRange
                .Where(r => r.EffectiveAt > start && CorrectionEpisode.Minute(r.EffectiveAt) < CorrectionEpisode.Minute(latest.EffectiveAt)
                    && (latest.EffectiveAt - r.EffectiveAt).TotalHours >= options.MinimumRateSpanHours)
                .Prepend(atStart);
            baseline = candidates.OrderBy(r => r.Value).ThenBy(r => r.EffectiveAt).First();
        }

        // Rounded to 0.1 mmol/L, the precision cards print: 127.7 − 117.7 must read as 10, not 9.999999999999986.
        var rise = Math.Round(latest.Value - baseline.Value, 1, MidpointRounding.AwayFromZero);
        var limit = lengthHours <= 24 ? limits.Day(anchored, highRisk) : limits.TwoDay(highRisk);
        var label = Finding.Of((lengthHours <= 24, anchored) switch
        {
            (true, true) => highRisk ? FindingKind.RateLimitDayHighRisk : FindingKind.RateLimitFirstDay,
            (true, false) => highRisk ? FindingKind.RateLimitDayHighRisk : FindingKind.RateLimitLaterDay,
            (false, true) => highRisk ? FindingKind.RateLimitTwoDaysHighRisk : FindingKind.RateLimitFirstTwoDays,
            (false, false) => highRisk ? FindingKind.RateLimitTwoDaysHighRisk : FindingKind.RateLimitAnyTwoDays,
        });

        double? hoursLeft = anchored ? Math.Max(0, (end - now).TotalHours) : null;
        var elapsed = (latest.EffectiveAt - baseline.EffectiveAt).TotalHours;
        var spanTooShort = !ReferenceEquals(latest, baseline) && elapsed < options.MinimumRateSpanHours;
        double? projected = anchored && rise > 0 && elapsed > 0 && !spanTooShort
            ? rise + (rise / elapsed * Math.Max(0, (end - latest.EffectiveAt).TotalHours))
            : null;

        var status = rise <= 0 || spanTooShort ? RateStatus.NoRise
            : rise >= limit ? RateStatus.AtOrPast
            : rise >= limit - options.ApproachingWithinMmolPerL ? RateStatus.Approaching
            : projected >= limit && elapsed >= options.ProjectAfterHours ? RateStatus.Approaching
            : RateStatus.Within;

        // A peak inside the window that reached the limit counts even when sodium has come down since (overshoot, then
        // re-lowering): the limit was passed, and the card must say so rather than report only the latest rise.
        LabResult? passedAt = null;
        if (status != RateStatus.AtOrPast)
        {
            var peak = inRange
                .Where(r => r.EffectiveAt > baseline.EffectiveAt && r.EffectiveAt >= start
                    && (r.EffectiveAt - baseline.EffectiveAt).TotalHours >= options.MinimumRateSpanHours)
                .OrderByDescending(r => r.Value)
                .ThenBy(r => r.EffectiveAt)
                .FirstOrDefault();
            if (peak is not null && Math.Round(peak.Value - baseline.Value, 1, MidpointRounding.AwayFromZero) >= limit)
            {
                passedAt = peak;
                status = RateStatus.AtOrPast;
            }
        }

        return new RateWindow(lengthHours, anchored, start, end, baseline, latest, rise, limit, label, hoursLeft, projected, status)
        {
            PassedAt = passedAt,
            SpanTooShort = spanTooShort,
        };
    }
}
