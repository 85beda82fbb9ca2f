using CdsNatremia.Core.Cards;
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

        var value = Invariant.Format($"{Bounds.Describe(bound)} mmol/L");
        var cite = Invariant.Format($"Sodium {value} at {context.Display.Time(bound.EffectiveAt)} ({Markdown.Escape(bound.Reference)}; reported with a comparator: a bound, not a measurement)");
        var findings = new List<string>();
        var steps = new List<string>();
        CardIndicator indicator;
        string summary;
        if (band is { } placed)
        {
            var name = thresholds.NameOf(placed);
            var atLeast = moreSevereOpen ? "at least " : string.Empty;
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

            findings.Add(Invariant.Format($"Newest sodium {value}: **{atLeast}{name} hyponatremia** ({thresholds.RangeOf(placed)})."));
            steps.Add(Invariant.Format(
                $"**Severity from a bound**: {cite}. Every value {Bounds.Describe(bound)} mmol/L is in the {name} band{(moreSevereOpen ? " or a more severe one" : string.Empty)} ({thresholds.RangeOf(placed)}; {thresholds.Source})."));
            summary = Invariant.Format($"Sodium {value} ({atLeast}{name} hyponatremia, {context.Display.AgeAndTime(bound.EffectiveAt)}) — a bound: measure it, assess symptoms now.");
        }
        else
        {
            indicator = CardIndicator.Info;
            findings.Add(Invariant.Format($"Newest sodium {value}: a bound that does not tell whether the sodium is low."));
            steps.Add(Invariant.Format($"**Severity from a bound**: {cite}; the bound spans the normal range and the low bands, so no band can be given."));
            summary = Invariant.Format($"Newest sodium is a bound ({value}) that cannot be placed; no assessment made — measure sodium.");
        }

        steps.Add("**No rate from a bound**: a bound is not a value, so no rise, fall or correction rate is computed from it; the correction-rate watch uses measured results only.");
        if (context.Sodium.Latest is { } older)
        {
            steps.Add("**Latest measured sodium** (older than the bound): " + Cite.Result(older, context.Display) + ".");
        }

        if (context.Request.Facts.SodiumHistoryUnavailable is { } history)
        {
            steps.Add(Rendering.PhraseCatalogue.Default.Render(HistoryStep(history), context.Display));
        }

        var detail = new DetailWriter()
            .Paragraph(Invariant.Format($"**Low sodium work-up** as of {context.Display.Time(context.Request.Now)}. Advisory only."))
            .Bullets("Findings", findings)
            .Numbered("Reasoning (with the data each step used)", steps)
            .Bullets("What clinicians usually consider next",
            [
                "Measure the sodium again now (the laboratory can often dilute the sample to report a value), and assess for severe symptoms (vomiting, seizures, drowsiness, cardiorespiratory distress); severe symptoms are an emergency under local protocol.",
                "The full work-up (tonicity, urine studies, causes) and the correction-rate watch need a measured value.",
            ]);
        CardFooter.Write(detail, context.Request.Facts, [thresholds.Source], context.Display);
        return new Card
        {
            Summary = Summary.Fit(summary),
            Indicator = CapForStaleness(context, bound, indicator),
            Detail = detail.ToString(),
            Topic = "sodium-assessment",
            RuleIds = [producerRuleId, BoundedRuleId],
            ResourcesUsed = [bound.Reference],
            Suggestions = [LabOrders.AsSuggestion(LabOrders.SerumSodium("The newest sodium is a bound, not a measurement; measure it."), recommended: true)],
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
        var steps = new List<string>
        {
            Invariant.Format($"**Newest sodium could not be used**: {unreadable.Count} sodium result(s) newer than the latest usable one were set aside: {string.Join("; ", reasons)}. A value outside physiological plausibility is never taken as the latest."),
            "**Latest usable sodium**: " + Cite.Result(latestUsable, context.Display) + Invariant.Format($", in the normal range ({context.Thresholds.RangeOf(SeverityBand.Normal)}); the newest may differ."),
        };
        if (earlierLow is not null)
        {
            steps.Add(Invariant.Format(
                $"**Earlier low value**: {Cite.Result(earlierLow, context.Display)} within the {Invariant.Number(lookback)} h before it; the sodium was recently low, so the unreadable newest result matters more."));
        }

        var detail = new DetailWriter()
            .Paragraph(Invariant.Format($"**Sodium check** as of {context.Display.Time(context.Request.Now)}. Advisory only."))
            .Bullets("Findings", ["The **newest sodium result could not be used** (see below); this is not a statement that the sodium is normal."])
            .Numbered("Reasoning (with the data each step used)", steps)
            .Bullets("What clinicians usually consider next", ["Check the newest result in the laboratory system and repeat the sodium."]);
        CardFooter.Write(detail, context.Request.Facts, [context.Thresholds.Source], context.Display);
        var first = unreadable[0];
        var summary = Invariant.Format($"Newest sodium could not be used ({ShortReason(first.Reason)}); last usable {Invariant.Number(latestUsable.Value)} mmol/L — recheck sodium.");
        return new Card
        {
            Summary = Summary.Fit(summary),
            Indicator = earlierLow is null ? CardIndicator.Info : CardIndicator.Warning,
            Detail = detail.ToString(),
            Topic = "sodium-assessment",
            RuleIds = [producerRuleId, UnreadableRuleId],
            ResourcesUsed = earlierLow is null ? [latestUsable.Reference] : [latestUsable.Reference, earlierLow.Reference],
            Suggestions = [LabOrders.AsSuggestion(LabOrders.SerumSodium("The newest sodium could not be used; repeat it."), recommended: true)],
            SelectionBehavior = SelectionBehavior.Any,
        };
    }

    /// <summary>The reasoning step when the sodium history could not be had: which checks could therefore not be made.</summary>
    public static Findings.Finding HistoryStep(string reason)
        => Findings.Finding.Of(Findings.FindingKind.HistoryUnavailableStep, Findings.Slot.Text("reason", reason));

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
