using CdsNatremia.Core.Facts;
using CdsNatremia.Core.Findings;
using CdsNatremia.Core.Text;

namespace CdsNatremia.Core.CorrectionRate;

/// <summary>
/// The findings the rate cards share: a window as a computation step, a signed change, the high-risk statement and
/// caution, a stale caution and the sources. Findings only: the wording is in <c>Phrases/CorrectionRate.resx</c>.
/// </summary>
internal static class RateText
{
    /// <summary>The second source every rate card cites.</summary>
    public const string HighRiskSource = "High-risk factors for osmotic demyelination: US expert panel (Verbalis et al., Am J Med 2013;126:S1).";

    /// <summary>Hours, rounded to 0.1 h for display (a computed span).</summary>
    public static Slot Hours(string name, double hours) => Slot.Rounded(name, hours, 1);

    /// <summary>A change with its sign (+1.9, -0.4, 0), rounded to 0.1 mmol/L as a result.</summary>
    public static Slot Signed(string name, double value)
    {
        var rounded = Math.Round(value, 1, MidpointRounding.AwayFromZero);
        return Slot.Phrase(name, Finding.Of(rounded > 0 ? FindingKind.RateSignedPositive : FindingKind.RateSignedOther, Slot.Rounded("value", rounded, 1)));
    }

    /// <summary>The phrase of a window status.</summary>
    public static Finding Status(RateStatus status) => Finding.Of(status switch
    {
        RateStatus.NoRise => FindingKind.RateStatusNoRise,
        RateStatus.Within => FindingKind.RateStatusWithin,
        RateStatus.Approaching => FindingKind.RateStatusApproaching,
        RateStatus.AtOrPast => FindingKind.RateStatusAtOrPast,
        _ => throw new ArgumentOutOfRangeException(nameof(status), status, null),
    });

    /// <summary>One computation step for a window, with its inputs.</summary>
    public static Finding Window(RateWindow w, CorrectionRateOptions options)
    {
        Guard.NotNull(w, nameof(w));
        Guard.NotNull(options, nameof(options));
        var span = w.AnchoredAtNadir
            ? Finding.Of(FindingKind.RateWindowSpanAnchored, Slot.Time("start", w.Start), Slot.Time("end", w.End))
            : Finding.Of(FindingKind.RateWindowSpanRolling, Hours("length", w.LengthHours), Slot.Time("end", w.End), Slot.Time("start", w.Start));
        Slot[] ends =
        [
            Slot.Number("latest", w.Latest.Value),
            Slot.Text("latestRef", w.Latest.Reference),
            Slot.Time("latestTime", w.Latest.EffectiveAt),
            Slot.Number("baseline", w.Baseline.Value),
            Slot.Text("baselineRef", w.Baseline.Reference),
            Slot.Time("baselineTime", w.Baseline.EffectiveAt),
            Hours("elapsed", w.ElapsedHours),
        ];
        var rise = ReferenceEquals(w.Baseline, w.Latest)
            ? Finding.Of(FindingKind.RateWindowRiseSingle, ends)
            : w.SpanTooShort
                ? Finding.Of(FindingKind.RateWindowRiseTooShort, [.. ends, Hours("minimum", options.MinimumRateSpanHours)])
                : Finding.Of(FindingKind.RateWindowRise, [.. ends, Slot.Number("rise", w.Rise)]);
        var heading = w.MeasuredOverLongerSpan
            ? Finding.Of(FindingKind.RateWindowHeadingLonger, Hours("length", w.LengthHours), Hours("elapsed", w.ElapsedHours))
            : Finding.Of(FindingKind.RateWindowHeading, Hours("length", w.LengthHours));

        var extras = new List<SlotValue>();
        void Add(Finding f) => extras.Add(new PhraseValue(f));
        if (w.Status == RateStatus.Approaching && w.Rise < w.Limit - options.ApproachingWithinMmolPerL)
        {
            Add(Finding.Of(FindingKind.RateWindowByProjection));
        }

        if (w.Status != RateStatus.AtOrPast && w.Remaining > 0)
        {
            Add(Finding.Of(FindingKind.RateWindowAllowanceLeft, Slot.Number("remaining", w.Remaining)));
        }

        if (w.HoursLeft is { } left)
        {
            Add(left > 0
                ? Finding.Of(FindingKind.RateWindowHoursLeft, Hours("hours", left), Slot.Time("end", w.End))
                : Finding.Of(FindingKind.RateWindowEnded, Slot.Time("end", w.End)));
        }

        if (w.ProjectedRise is { } projected && w.ElapsedHours > 0)
        {
            Add(Finding.Of(
                FindingKind.RateWindowProjection,
                Slot.Rounded("rate", w.Rise / w.ElapsedHours, 2),
                Slot.Number("rise", w.Rise),
                Hours("elapsed", w.ElapsedHours),
                Hours("toEnd", (w.End - w.Latest.EffectiveAt).TotalHours),
                Slot.Rounded("projected", projected, 1),
                Slot.Time("end", w.End)));
        }

        if (w.MixedSpecimens)
        {
            Add(Finding.Of(FindingKind.RateWindowMixedSpecimens));
        }

        return Finding.Of(
            FindingKind.RateWindow,
            Slot.Phrase("heading", heading),
            Slot.Phrase("span", span),
            Slot.Phrase("rise", rise),
            Slot.Phrase("label", w.LimitLabel),
            Slot.Number("limit", w.Limit),
            Slot.Phrase("status", Status(w.Status)),
            Slot.List("extras", extras, string.Empty)).RestingOn(w.Baseline.Reference, w.Latest.Reference);
    }

    /// <summary>The factors found, as one list slot ("; " between them).</summary>
    public static Slot Factors(IReadOnlyList<HighRiskFactor> factors)
        => Slot.List("factors", factors.Select(f => (SlotValue)new PhraseValue(f.Description)), "; ");

    /// <summary>The high-risk statement of a rate card (full: the factors and the stricter limits; or none found).</summary>
    public static Finding HighRisk(IReadOnlyList<HighRiskFactor> factors, CorrectionLimits limits, CorrectionRateOptions options)
    {
        Guard.NotNull(factors, nameof(factors));
        Guard.NotNull(limits, nameof(limits));
        Guard.NotNull(options, nameof(options));
        return factors.Count == 0
            ? Finding.Of(FindingKind.RateHighRiskNone, Slot.Number("nadir", options.HighRiskNadirAtOrBelow))
            : Finding.Of(FindingKind.RateHighRiskFound, Slot.Number("day", limits.HighRiskDay), Slot.Number("twoDays", limits.HighRiskTwoDays), Factors(factors))
                .RestingOn([.. factors.Select(f => f.Reference).OfType<string>()]);
    }

    /// <summary>The most high-risk factors a short caution names.</summary>
    public const int MaxFactorsNamed = 2;

    /// <summary>The short patient-specific caution for the card when the patient is at high risk; null otherwise.</summary>
    public static Finding? HighRiskCaution(IReadOnlyList<HighRiskFactor> factors, CorrectionLimits limits)
    {
        Guard.NotNull(factors, nameof(factors));
        Guard.NotNull(limits, nameof(limits));
        // Up to two factors are named; more are counted (all are named in the report), so the caution stays short.
        var day = Slot.Number("day", limits.HighRiskDay);
        var caution = factors.Count switch
        {
            0 => null,
            <= MaxFactorsNamed => Finding.Of(FindingKind.RateHighRiskCaution, Slot.List("names", factors.Select(f => (SlotValue)new PhraseValue(f.Name))), day),
            _ => Finding.Of(FindingKind.RateHighRiskCautionMany, Slot.Count("count", factors.Count), day),
        };
        return caution?.RestingOn([.. factors.Select(f => f.Reference).OfType<string>()]);
    }

    /// <summary>The stale-sodium caution: recheck before acting.</summary>
    public static Finding Stale(double staleAfterHours) => Finding.Of(FindingKind.RateStale, Hours("hours", staleAfterHours));

    /// <summary>The stale-sodium step of the report, in full.</summary>
    public static Finding StaleStep(double staleAfterHours) => Finding.Of(FindingKind.RateStaleStep, Hours("hours", staleAfterHours));

    /// <summary>A cited result after a label phrase ("Latest: …").</summary>
    public static Finding Cited(string kind, LabResult result) => Finding.Of(kind, Slot.Result("result", result)).RestingOn(result.Reference);

    public static IReadOnlyList<string> Sources(CorrectionLimits limits) =>
    [
        Markdown.Escape(limits.Source),
        HighRiskSource,
    ];
}
