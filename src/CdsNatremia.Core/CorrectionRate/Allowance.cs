using CdsNatremia.Core.Engine;
using CdsNatremia.Core.Facts;
using CdsNatremia.Core.Findings;

namespace CdsNatremia.Core.CorrectionRate;

/// <summary>
/// How much more the sodium may rise now: the 24-h and 48-h windows measured at the assessment time (or at the latest
/// result if that is a little later), and the smaller allowance left of the two.
/// </summary>
/// <param name="Episode">The current episode.</param>
/// <param name="Day">The 24-h window.</param>
/// <param name="TwoDays">The 48-h window.</param>
/// <param name="Factors">High-risk factors (empty when none).</param>
/// <param name="Limits">The limits in force.</param>
public sealed record Allowance(CorrectionEpisode Episode, RateWindow Day, RateWindow TwoDays, IReadOnlyList<HighRiskFactor> Factors, CorrectionLimits Limits)
{
    /// <summary>The allowance left, mmol/L: the smaller of the two windows' (negative when a limit is already passed).</summary>
    public double Remaining => Math.Min(Day.Remaining, TwoDays.Remaining);

    /// <summary>The window whose allowance is the smaller.</summary>
    public RateWindow Binding => Day.Remaining <= TwoDays.Remaining ? Day : TwoDays;

    /// <summary>The allowance for a request, or null when there is no usable sodium.</summary>
    public static Allowance? For(DecisionContext context)
    {
        Guard.NotNull(context, nameof(context));
        var options = context.Options.CorrectionRate;
        if (CorrectionEpisode.Find(context.Sodium, options) is not { } episode)
        {
            return null;
        }

        var limits = options.Resolve();
        var factors = HighRiskFactors.Find(context.Request.Facts, HighRiskFactors.LowestOfLowStretch(context.Sodium, episode.Nadir, context.Thresholds.NormalFrom), context.Knowledge, options);
        var now = context.Request.Now;
        var at = episode.Latest.EffectiveAt > now ? episode.Latest.EffectiveAt : now;
        return new Allowance(
            episode,
            RateWindows.Measure(episode, at, 24, limits, factors.Count > 0, now, options),
            RateWindows.Measure(episode, at, 48, limits, factors.Count > 0, now, options),
            factors,
            limits);
    }

    /// <summary>
    /// True when an order card has something to say about sodium: the episode's nadir is below the normal range, or no
    /// sodium could be used although some was received (the card then says so). With no sodium data at all, or a sodium
    /// that stayed normal, an order of a common fluid gets no card.
    /// </summary>
    public static bool Concerns(DecisionContext context, Allowance? allowance)
    {
        Guard.NotNull(context, nameof(context));
        return allowance is null
            ? context.Request.Facts.SetAside.Any(s => s.Analyte == Analyte.Sodium)
            : allowance.Episode.Nadir.Value < context.Thresholds.NormalFrom;
    }

    /// <summary>
    /// The window in which the correction reached or passed its limit (now, or at a peak since re-lowered), or null. Used to
    /// recognise a deliberate re-lowering after over-correction (desmopressin or water ordered under senior care).
    /// </summary>
    public RateWindow? Overcorrected => new[] { Day, TwoDays }.FirstOrDefault(w => w.Status == RateStatus.AtOrPast || w.PassedAt is not null);

    /// <summary>Where the correction stands and what is left, as reasoning steps for a card's report.</summary>
    public IReadOnlyList<Finding> Describe(CorrectionRateOptions options)
    {
        Guard.NotNull(options, nameof(options));
        var lines = new List<Finding>();
        if (!Episode.IsRising)
        {
            lines.Add(Finding.Of(FindingKind.RateAllowanceNoRise, Slot.Number("nadir", Episode.Nadir.Value), Slot.Time("time", Episode.Nadir.EffectiveAt)).RestingOn(Episode.Nadir.Reference));
        }

        lines.Add(RateText.Window(Day, options));
        lines.Add(RateText.Window(TwoDays, options));
        lines.Add(RateText.HighRisk(Factors, Limits, options));
        lines.Add(LeftNow);
        return lines;
    }

    /// <summary>The allowance left now (never below 0), with the window that binds.</summary>
    public Finding LeftNow => Finding.Of(FindingKind.RateAllowanceLeft, Slot.Number("remaining", Math.Max(0, Remaining)), Slot.Phrase("label", Binding.LimitLabel));
}
