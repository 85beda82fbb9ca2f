using CdsNatremia.Core.Cards;
using CdsNatremia.Core.Findings;
using CdsNatremia.Core.Engine;
using CdsNatremia.Core.Facts;
using CdsNatremia.Core.Sodium;
using CdsNatremia.Core.Text;

namespace CdsNatremia.Core.Assessment;

/// <summary>
/// The assessment cards for a newest sodium that is not a usable measurement, so that such a chart is never answered
/// with silence (an EHR cannot tell "no card" from "sodium is fine"):
/// <list type="bullet">
/// <item><b>a bound</b> (<c>&lt;100</c>): reasoned with (below 100 is profound; above 150 is not low), printed as "below
/// 100 mmol/L", never used for a rate;</item>
/// <item><b>unreadable</b> (impossible value, unknown unit, unparseable) while the older usable sodium is normal: a card
/// that says the newest result could not be used and why, with a recheck (info; warning when the older values were low).</item>
/// </list>
/// Rule ids <c>sodium.bounded</c> and <c>sodium.newest-unreadable</c>.
/// </summary>
public static class ImperfectSodiumCards
{
    /// <summary>Rule id of the bounded-newest card.</summary>
    public const string BoundedRuleId = "sodium.bounded";

    /// <summary>Rule id of the unreadable-newest card.</summary>
    public const string UnreadableRuleId = "sodium.newest-unreadable";

    /// <summary>
    /// Where a bound places the sodium: the band when the bound decides it ("at least" that band when more severe bands
    /// stay open), <see cref="SeverityBand.Normal"/> when it rules a low sodium out, or null when it cannot tell.
    /// </summary>
    /// <returns>The band, and whether a more severe band is still possible.</returns>
    public static (SeverityBand? Band, bool MoreSevereOpen) Place(LabResult bound, SeverityThresholds thresholds)
    {
        Guard.NotNull(bound, nameof(bound));
        Guard.NotNull(thresholds, nameof(thresholds));
        if (Bounds.IsBelow(bound, thresholds.NormalFrom) == false)
        {
            return (SeverityBand.Normal, false);
        }

        if (Bounds.IsBelow(bound, thresholds.NormalFrom) != true)
        {
            return (null, false);
        }

        // Below the normal range for certain: the band just under the bound is the least severe it can be.
        var edge = bound.Comparator == ValueComparator.LessOrEqual ? bound.Value : bound.Value - 0.05;
        var band = thresholds.Classify(edge);
        return (band, band != SeverityBand.Profound);
    }

    /// <summary>The card for a newest sodium that is a bound; null when the bound rules a low sodium out (no card, as for a normal value).</summary>
    public static Card? Bounded(DecisionContext context, LabResult bound, string producerRuleId)
    {
        Guard.NotNull(context, nameof(context));
        Guard.NotNull(bound, nameof(bound));
        var thresholds = context.Thresholds;
        var (band, moreSevereOpen) = Place(bound, thresholds);
        if (band is SeverityBand.Normal or SeverityBand.AboveRange)
        {
            return null;
        }

        var value = Slot.Phrase("value", Finding.Of(FindingKind.BoundedValue, Slot.Verbatim("bound", Bounds.Describe(bound))));
        var cite = Slot.Phrase("cite", Finding.Of(FindingKind.BoundedCite, value, Slot.Time("time", bound.EffectiveAt), Slot.Text("reference", bound.Reference)));
        var when = Slot.Time("when", bound.EffectiveAt, TimeStyle.AgeAndTime);
        var time = Slot.Time("time", bound.EffectiveAt);
        var age = Slot.Time("age", bound.EffectiveAt, TimeStyle.Age);
        var findings = new List<Finding>();
        var steps = new List<Finding>();
        CardIndicator indicator;
        Finding summary;
        Finding headline;
        if (band is { } placed)
        {
            var name = Slot.Text("band", thresholds.NameOf(placed));
            var range = Slot.Text("range", thresholds.RangeOf(placed));
            indicator = placed switch
            {
                SeverityBand.Profound => context.Options.Indicators.Profound,
                SeverityBand.Moderate => context.Options.Indicators.Moderate,
                _ => context.Options.Indicators.Mild,
            };
            if (moreSevereOpen && indicator < CardIndicator.Warning)
            {
                indicator = CardIndicator.Warning;
            }

            findings.Add(Finding.Of(moreSevereOpen ? FindingKind.BoundedFindingAtLeast : FindingKind.BoundedFinding, value, name, range).RestingOn(bound.Reference).Weighted(Weights.Culprit));
            steps.Add(Finding.Of(
                moreSevereOpen ? FindingKind.BoundedStepMoreSevere : FindingKind.BoundedStep,
                cite,
                Slot.Verbatim("bound", Bounds.Describe(bound)),
                name,
                range,
                Slot.Verbatim("source", thresholds.Source)).RestingOn(bound.Reference));
            summary = Finding.Of(moreSevereOpen ? FindingKind.BoundedSummaryAtLeast : FindingKind.BoundedSummary, value, name, when);
            headline = Finding.Of(moreSevereOpen ? FindingKind.BoundedHeadlineAtLeast : FindingKind.BoundedHeadline, value, name, time, age).RestingOn(bound.Reference);
        }
        else
        {
            indicator = CardIndicator.Info;
            findings.Add(Finding.Of(FindingKind.BoundedUnplacedFinding, value).With(Certainty.Unknown).Weighted(Weights.Culprit));
            steps.Add(Finding.Of(FindingKind.BoundedUnplacedStep, cite).With(Certainty.Unknown));
            summary = Finding.Of(FindingKind.BoundedUnplacedSummary, value);
            headline = Finding.Of(FindingKind.BoundedUnplacedHeadline, value, time, age).RestingOn(bound.Reference);
        }

        steps.Add(Finding.Of(FindingKind.BoundedNoRateStep));
        if (context.Sodium.Latest is { } older)
        {
            steps.Add(Finding.Of(FindingKind.BoundedOlderStep, Slot.Result("result", older)).RestingOn(older.Reference));
        }

        if (context.Request.Facts.SodiumHistoryUnavailable is { } history)
        {
            steps.Add(HistoryStep(history));
        }

        var content = new CardContent
        {
            Summary = summary,
            Headline = headline,
            Reasons = findings,
            Steps = steps,
            NextSteps = [Finding.Of(FindingKind.BoundedNextMeasure), Finding.Of(FindingKind.BoundedNextWorkup)],
            Sources = [thresholds.Source],
        };
        return new Card
        {
            Content = content,
            Indicator = CapForStaleness(context, bound, indicator),
            Topic = "sodium-assessment",
            RuleIds = [producerRuleId, BoundedRuleId],
            ResourcesUsed = [bound.Reference],
            Suggestions = [LabOrders.AsSuggestion(LabOrders.SerumSodium(LabOrders.Why(FindingKind.BoundedOrder)), recommended: true)],
            SelectionBehavior = SelectionBehavior.Any,
        };
    }

    /// <summary>The card for a newest sodium that could not be read while the latest usable one is not low.</summary>
    public static Card NewestUnreadable(DecisionContext context, LabResult latestUsable, string producerRuleId)
    {
        Guard.NotNull(context, nameof(context));
        Guard.NotNull(latestUsable, nameof(latestUsable));
        var unreadable = context.Sodium.NewerUnreadable;
        var lookback = context.Options.CorrectionRate.EpisodeLookbackHours;
        var earlierLow = context.Sodium.Results
            .Where(r => r.Value < context.Thresholds.NormalFrom && r.EffectiveAt >= latestUsable.EffectiveAt.AddHours(-lookback))
            .OrderBy(r => r.Value)
            .FirstOrDefault();
        var reasons = unreadable.Select(s => Cite.SetAside(s, context.Display)).ToList();
        var steps = new List<Finding>
        {
            Finding.Of(FindingKind.UnreadableStep, Slot.Count("count", unreadable.Count), Slot.Verbatim("reasons", string.Join("; ", reasons))).With(Certainty.CouldNotBeRead),
            Finding.Of(FindingKind.UnreadableLatestStep, Slot.Result("result", latestUsable), Slot.Text("range", context.Thresholds.RangeOf(SeverityBand.Normal))).RestingOn(latestUsable.Reference),
        };
        if (earlierLow is not null)
        {
            steps.Add(Finding.Of(FindingKind.UnreadableEarlierLowStep, Slot.Result("result", earlierLow), Slot.Number("hours", lookback)).RestingOn(earlierLow.Reference));
        }

        var first = unreadable[0];
        var reason = Slot.Text("reason", ShortReason(first.Reason));
        var sodium = Slot.Number("sodium", latestUsable.Value);
        var content = new CardContent
        {
            Summary = Finding.Of(FindingKind.UnreadableSummary, reason, sodium),
            Headline = Finding.Of(FindingKind.UnreadableHeadline, reason, sodium, Slot.Time("time", latestUsable.EffectiveAt), Slot.Time("age", latestUsable.EffectiveAt, TimeStyle.Age)),
            Reasons = [Finding.Of(FindingKind.UnreadableFinding).With(Certainty.CouldNotBeRead).Weighted(Weights.DataGap)],
            Steps = steps,
            NextSteps = [Finding.Of(FindingKind.UnreadableNext)],
            Sources = [context.Thresholds.Source],
        };
        return new Card
        {
            Content = content,
            Indicator = earlierLow is null ? CardIndicator.Info : CardIndicator.Warning,
            Topic = "sodium-assessment",
            RuleIds = [producerRuleId, UnreadableRuleId],
            ResourcesUsed = earlierLow is null ? [latestUsable.Reference] : [latestUsable.Reference, earlierLow.Reference],
            Suggestions = [LabOrders.AsSuggestion(LabOrders.SerumSodium(LabOrders.Why(FindingKind.UnreadableOrder)), recommended: true)],
            SelectionBehavior = SelectionBehavior.Any,
        };
    }

    /// <summary>The reasoning step when the sodium history could not be had: which checks could therefore not be made.</summary>
    public static Finding HistoryStep(string reason)
        => Finding.Of(FindingKind.HistoryUnavailableStep, Slot.Text("reason", reason)).With(Certainty.Unknown);

    private static CardIndicator CapForStaleness(DecisionContext context, LabResult result, CardIndicator indicator)
        => (context.Request.Now - result.EffectiveAt).TotalHours > context.Sodium.StaleAfterHours && indicator > CardIndicator.Warning
            ? CardIndicator.Warning
            : indicator;

    private static string ShortReason(string reason)
    {
        var cut = reason.IndexOfAny([':', ';', '(']);
        return (cut > 0 ? reason[..cut] : reason).Trim();
    }
}
