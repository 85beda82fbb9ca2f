using CdsNatremia.Core.Text;

namespace CdsNatremia.Core.CorrectionRate;

/// <summary>How the rate cards word a window, a specimen note and the high-risk factors; shared by both producers.</summary>
internal static class RateText
{
    public static string Hours(double hours) => Invariant.Number(Math.Round(hours, 1));

    /// <summary>A limit, an input or a difference of inputs, printed as used (<see cref="ClinicalNumber"/>).</summary>
    public static string Mmol(double value) => ClinicalNumber.Format(value) + " mmol/L";

    /// <summary>A derived estimate (a projection, a rate per day), rounded to one decimal as a result.</summary>
    public static string MmolRounded(double value) => ClinicalNumber.Rounded(value, 1) + " mmol/L";

    public static string Status(RateStatus status) => status switch
    {
        RateStatus.NoRise => "no rise",
        RateStatus.Within => "within the limit",
        RateStatus.Approaching => "approaching the limit",
        RateStatus.AtOrPast => "at or past the limit",
        _ => throw new ArgumentOutOfRangeException(nameof(status), status, null),
    };

    /// <summary>One computation step for a window, with its inputs.</summary>
    public static string Window(RateWindow w, CorrectionRateOptions options, TimeDisplay display)
    {
        var kind = w.AnchoredAtNadir
            ? Invariant.Format($"anchored at the nadir, {display.Time(w.Start)} to {display.Time(w.End)}")
            : Invariant.Format($"the {Hours(w.LengthHours)} h ending {display.Time(w.End)}, from {display.Time(w.Start)}");
        var rise = ReferenceEquals(w.Baseline, w.Latest)
            ? Invariant.Format($"one value only, {Invariant.Number(w.Latest.Value)} mmol/L ({Markdown.Escape(w.Latest.Reference)}, {display.Time(w.Latest.EffectiveAt)}), so no rise measured")
            : w.SpanTooShort
                ? Invariant.Format($"{Invariant.Number(w.Baseline.Value)} ({Markdown.Escape(w.Baseline.Reference)}, {display.Time(w.Baseline.EffectiveAt)}) and {Invariant.Number(w.Latest.Value)} ({Markdown.Escape(w.Latest.Reference)}, {display.Time(w.Latest.EffectiveAt)}) are only {Hours(w.ElapsedHours)} h apart, less than the {Hours(options.MinimumRateSpanHours)} h minimum span, so no rate is computed from them (common practice)")
                : Invariant.Format($"rise = {Invariant.Number(w.Latest.Value)} ({Markdown.Escape(w.Latest.Reference)}, {display.Time(w.Latest.EffectiveAt)}) − {Invariant.Number(w.Baseline.Value)} ({Markdown.Escape(w.Baseline.Reference)}, {display.Time(w.Baseline.EffectiveAt)}) = **{Mmol(w.Rise)}** over {Hours(w.ElapsedHours)} h");
        var heading = w.MeasuredOverLongerSpan
            ? Invariant.Format($"**{Hours(w.LengthHours)}-h limit, rise measured over {Hours(w.ElapsedHours)} h** (no result at the window's start, so the last one before it is the baseline; the rise within any {Hours(w.LengthHours)} h may be smaller)")
            : Invariant.Format($"**{Hours(w.LengthHours)}-h window**");
        var text = Invariant.Format(
            $"{heading} ({kind}): {rise}; limit ({w.LimitLabel}) {Mmol(w.Limit)}; {Status(w.Status)}");
        if (w.Status == RateStatus.Approaching && w.Rise < w.Limit - options.ApproachingWithinMmolPerL)
        {
            text += " (by projection)";
        }

        if (w.Status != RateStatus.AtOrPast && w.Remaining > 0)
        {
            text += Invariant.Format($"; allowance left {Mmol(w.Remaining)}");
        }

        if (w.HoursLeft is { } left)
        {
            text += left > 0
                ? Invariant.Format($"; {Hours(left)} h left in the window (to {display.Time(w.End)})")
                : Invariant.Format($"; the window ended at {display.Time(w.End)}");
        }

        if (w.ProjectedRise is { } projected && w.ElapsedHours > 0)
        {
            var rate = w.Rise / w.ElapsedHours;
            var toEnd = (w.End - w.Latest.EffectiveAt).TotalHours;
            text += Invariant.Format(
                $". Projection: {Invariant.Number(Math.Round(rate, 2))} mmol/L per h ({Mmol(w.Rise)} / {Hours(w.ElapsedHours)} h) × {Hours(toEnd)} h to the window's end + {Mmol(w.Rise)} = **{MmolRounded(projected)}** by {display.Time(w.End)} if the current rate goes on");
        }

        if (w.MixedSpecimens)
        {
            text += ". " + MixedSpecimenNote;
        }

        return text + ".";
    }

    public const string MixedSpecimenNote =
        "The start and end values come from different kinds of specimen (blood gas or point-of-care whole blood vs laboratory serum or plasma); " +
        "the methods can differ by a few mmol/L, so part of the change may be the method (common practice)";

    public static string HighRisk(IReadOnlyList<HighRiskFactor> factors, CorrectionLimits limits)
        => factors.Count == 0
            ? Invariant.Format($"No factor of high risk of osmotic demyelination was found in the data received (checked: nadir ≤ 105 mmol/L, low potassium, alcohol use disorder, malnutrition, advanced liver disease); the usual limits apply.")
            : Invariant.Format($"**High risk of osmotic demyelination**, so the stricter limits apply ({Mmol(limits.HighRiskDay)} in any 24 h; {Mmol(limits.HighRiskTwoDays)} in 48 h, derived from the 24-h limit): ") + string.Join("; ", factors.Select(f => f.Description)) + ".";

    public static IReadOnlyList<string> Sources(CorrectionLimits limits) =>
    [
        Markdown.Escape(limits.Source),
        "High-risk factors for osmotic demyelination: US expert panel (Verbalis et al., Am J Med 2013;126:S1).",
    ];
}
