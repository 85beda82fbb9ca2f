using CdsNatremia.Core.Assessment;
using CdsNatremia.Core.Cards;
using CdsNatremia.Core.Engine;
using CdsNatremia.Core.Findings;
using CdsNatremia.Core.Rendering;

namespace CdsNatremia.Core.CorrectionRate;

/// <summary>
/// Watches how fast serum sodium is rising since the nadir of the current episode, in the 24-h and 48-h windows, against
/// the configured limits (stricter at high risk of osmotic demyelination). At or past a limit: a critical card;
/// approaching it: a warning; rising more slowly than the minimum daily goal while still profound: an info card.
/// Otherwise no card, so a safe correction makes no noise. On the result hook it speaks only when a sodium arrived, and
/// only an episode whose nadir was below the normal range is watched.
/// </summary>
public sealed class CorrectionRateCardProducer : ICardProducer
{
    /// <summary>Topic code of the cards (card-topic CodeSystem).</summary>
    public const string Topic = "correction-rate";

    /// <inheritdoc />
    public string RuleId => "sodium.correction-rate";

    /// <inheritdoc />
    public IEnumerable<Card> Produce(DecisionContext context)
    {
        Guard.NotNull(context, nameof(context));
        var request = context.Request;
        if (request.Hook == HookKind.ResultArrive && request.NewResultIds.Count > 0
            && !context.Sodium.Results.Any(r => request.NewResultIds.Contains(r.ResourceId, StringComparer.Ordinal)))
        {
            return [];
        }

        var options = context.Options.CorrectionRate;
        var episode = CorrectionEpisode.Find(context.Sodium, options);
        // Only the correction of a low sodium is watched: a rise that starts at a normal value is out of scope.
        if (episode is null || episode.Nadir.Value >= context.Thresholds.NormalFrom)
        {
            return [];
        }

        var limits = options.Resolve();
        var factors = HighRiskFactors.Find(request.Facts, HighRiskFactors.LowestOfLowStretch(context.Sodium, episode.Nadir, context.Thresholds.NormalFrom), context.Knowledge, options);
        var highRisk = factors.Count > 0;
        var day = RateWindows.Measure(episode, episode.Latest.EffectiveAt, 24, limits, highRisk, request.Now, options);
        var twoDays = RateWindows.Measure(episode, episode.Latest.EffectiveAt, 48, limits, highRisk, request.Now, options);
        var worst = day.Status >= twoDays.Status ? day : twoDays;
        if (worst.Status is RateStatus.AtOrPast or RateStatus.Approaching)
        {
            return [TooFast(context, episode, day, twoDays, worst, factors, limits)];
        }

        return TooSlow(context, episode, factors, limits) is { } slow ? [slow] : [];
    }

    private Card TooFast(
        DecisionContext context,
        CorrectionEpisode episode,
        RateWindow day,
        RateWindow twoDays,
        RateWindow worst,
        IReadOnlyList<HighRiskFactor> factors,
        CorrectionLimits limits)
    {
        var options = context.Options.CorrectionRate;
        var past = worst.Status == RateStatus.AtOrPast;

        // A stale latest result calls for a recheck first: at most a warning, never a critical interruption.
        var stale = context.Sodium.LatestIsStale;
        Slot[] numbers =
        [
            Slot.Number("rise", worst.Rise),
            RateText.Hours("hours", worst.ElapsedHours),
            Slot.Number("baseline", worst.Baseline.Value),
            Slot.Number("latest", worst.Latest.Value),
            Slot.Number("limit", worst.Limit),
            Slot.Phrase("label", worst.LimitLabel),
        ];
        Finding summary;
        Finding headline;
        if (worst.PassedAt is { } peak)
        {
            Slot[] peakSlots = [.. numbers, Slot.Number("peak", peak.Value), Slot.Number("peakRise", peak.Value - worst.Baseline.Value)];
            summary = Finding.Of(FindingKind.RateFastSummaryPassed, peakSlots);
            headline = Finding.Of(FindingKind.RateFastHeadlinePassed, peakSlots);
        }
        else
        {
            summary = Finding.Of(past ? FindingKind.RateFastSummaryPast : FindingKind.RateFastSummaryApproaching, numbers);
            headline = Finding.Of(past ? FindingKind.RateFastHeadlinePast : FindingKind.RateFastHeadlineApproaching, numbers);
        }

        headline = headline.RestingOn(worst.Baseline.Reference, worst.Latest.Reference);
        var reasons = new List<Finding>
        {
            RateText.Cited(FindingKind.RateFastNadir, episode.Nadir).Weighted(Weights.Context),
            RateText.Cited(FindingKind.RateLatest, episode.Latest).Weighted(Weights.Context),
            Finding.Of(FindingKind.RateFastRiseSinceNadir, Slot.Number("rise", episode.RiseSinceNadir), RateText.Hours("hours", episode.HoursSinceNadir)).Weighted(Weights.Stated),
            Finding.Of(
                FindingKind.RateFastLimit,
                Slot.Number("limit", worst.Limit),
                Slot.Phrase("label", worst.LimitLabel),
                Slot.Text("limits", limits.Name),
                Slot.Number("rise", worst.Rise),
                Slot.Phrase("status", RateText.Status(worst.Status))).Weighted(Weights.Stated),
        };
        if (worst.PassedAt is { } passed)
        {
            reasons.Add(Finding.Of(
                FindingKind.RateFastPassed,
                Slot.Result("peak", passed),
                Slot.Number("peakRise", passed.Value - worst.Baseline.Value),
                Slot.Number("baseline", worst.Baseline.Value),
                Slot.Text("baselineRef", worst.Baseline.Reference)).RestingOn(passed.Reference, worst.Baseline.Reference).Weighted(Weights.Culprit));
        }

        if (worst.HoursLeft is { } left)
        {
            reasons.Add((left > 0
                ? Finding.Of(FindingKind.RateFastHoursLeft, RateText.Hours("hours", left), Slot.Time("end", worst.End))
                : Finding.Of(FindingKind.RateFastWindowEnded, Slot.Time("end", worst.End))).Weighted(Weights.Pace));
        }

        if (worst.ProjectedRise is { } projected)
        {
            reasons.Add(Finding.Of(FindingKind.RateFastProjection, Slot.Rounded("projected", projected, 1), Slot.Time("end", worst.End)).Weighted(Weights.Pace));
        }

        var cautions = new List<Finding>();
        if (stale)
        {
            cautions.Add(RateText.Stale(context.Sodium.StaleAfterHours));
        }

        if (RateText.HighRiskCaution(factors, limits) is { } highRisk)
        {
            cautions.Add(highRisk);
        }

        var content = new CardContent
        {
            Summary = summary,
            Headline = headline,
            Reasons = reasons,
            Steps = [.. stale ? [RateText.StaleStep(context.Sodium.StaleAfterHours)] : Array.Empty<Finding>(), .. Steps(episode, day, twoDays, options), RateText.HighRisk(factors, limits, options)],
            NextSteps =
            [
                Finding.Of(FindingKind.RateFastNextPause),
                Finding.Of(FindingKind.RateFastNextPauseWhat),
                Finding.Of(past ? FindingKind.RateFastNextRelower : FindingKind.RateFastNextSlow),
                Finding.Of(FindingKind.RateFastNextRecheck),
                Finding.Of(FindingKind.RateFastNextChronic),
            ],
            Cautions = cautions,
            Sources = RateText.Sources(limits),
        };

        return new Card
        {
            Content = content,
            Indicator = past && !stale ? CardIndicator.Critical : CardIndicator.Warning,
            Topic = Topic,
            RuleIds = [RuleId],
            ResourcesUsed = [.. episode.Results.Select(r => r.Reference), .. factors.Select(f => f.Reference).OfType<string>()],
            Suggestions = [LabOrders.AsSuggestion(LabOrders.SerumSodium(PhraseCatalogue.Default.Text(FindingKind.RateFastRecheckReason)), recommended: true)],
            SelectionBehavior = SelectionBehavior.Any,
        };
    }

    private static List<Finding> Steps(CorrectionEpisode episode, RateWindow day, RateWindow twoDays, CorrectionRateOptions options)
    {
        var steps = new List<Finding>
        {
            Finding.Of(
                FindingKind.RateFastStepNadir,
                RateText.Hours("lookback", episode.LookbackHours),
                Slot.Number("nadir", episode.Nadir.Value),
                Slot.Time("time", episode.Nadir.EffectiveAt),
                Slot.Text("ref", episode.Nadir.Reference),
                Slot.Count("count", episode.Results.Count)).RestingOn(episode.Nadir.Reference),
            Finding.Of(
                FindingKind.RateFastStepRise,
                Slot.Number("latest", episode.Latest.Value),
                Slot.Number("nadir", episode.Nadir.Value),
                Slot.Number("rise", episode.RiseSinceNadir),
                RateText.Hours("hours", episode.HoursSinceNadir)).RestingOn(episode.Nadir.Reference, episode.Latest.Reference),
            RateText.Window(day, options),
            RateText.Window(twoDays, options),
        };
        if (episode.SameTimeAsLatest.Count > 0)
        {
            steps.Add(Finding.Of(
                FindingKind.RateFastStepSameTime,
                Slot.Count("count", episode.SameTimeAsLatest.Count + 1),
                Slot.Number("latest", episode.Latest.Value),
                Slot.Text("ref", episode.Latest.Reference),
                Slot.List("others", episode.SameTimeAsLatest.Select(r => (SlotValue)new PhraseValue(
                    Finding.Of(FindingKind.RateFastStepSameTimeOther, Slot.Number("value", r.Value), Slot.Text("ref", r.Reference)))))));
        }

        steps.Add(Finding.Of(FindingKind.RateFastStepResults, Slot.List("results", episode.Results.Select(r => (SlotValue)new ResultValue(r)), "; ")));
        return steps;
    }

    private Card? TooSlow(DecisionContext context, CorrectionEpisode episode, IReadOnlyList<HighRiskFactor> factors, CorrectionLimits limits)
    {
        var latest = episode.Latest;
        if (latest.Value >= context.Thresholds.ModerateFrom)
        {
            return null;
        }

        // The result about a day earlier: the last one at least 24 h before the latest, if no more than 48 h before.
        var earlier = context.Sodium.Results
            .Where(r => r.EffectiveAt <= latest.EffectiveAt.AddHours(-24) && r.EffectiveAt >= latest.EffectiveAt.AddHours(-48))
            .OrderBy(r => r.EffectiveAt)
            .LastOrDefault();
        if (earlier is null)
        {
            return null;
        }

        var highRisk = factors.Count > 0;
        var goal = limits.MinimumGoal(highRisk);
        var hours = (latest.EffectiveAt - earlier.EffectiveAt).TotalHours;
        var change = latest.Value - earlier.Value;
        var perDay = change / hours * 24;
        if (perDay >= goal)
        {
            return null;
        }

        var options = context.Options.CorrectionRate;
        var band = Slot.Text("band", context.Thresholds.NameOf(Sodium.SeverityBand.Profound));
        var summaryKind = change > 0 ? FindingKind.RateSlowSummaryRose : change < 0 ? FindingKind.RateSlowSummaryFell : FindingKind.RateSlowSummaryUnchanged;
        Slot[] numbers =
        [
            band,
            Slot.Number("latest", latest.Value),
            Slot.Number("earlier", earlier.Value),
            Slot.Number("change", Math.Abs(change)),
            RateText.Hours("hours", hours),
            Slot.Number("goal", goal),
            Slot.Rounded("perDay", perDay, 1),
        ];
        var content = new CardContent
        {
            Summary = Finding.Of(summaryKind, numbers),
            Headline = Finding.Of(FindingKind.RateSlowHeadline, numbers).RestingOn(earlier.Reference, latest.Reference),
            Reasons =
            [
                RateText.Cited(FindingKind.RateSlowEarlier, earlier).Weighted(Weights.Context),
                RateText.Cited(FindingKind.RateLatest, latest).Weighted(Weights.Context),
                Finding.Of(FindingKind.RateSlowBand, band, Slot.Number("moderate", context.Thresholds.ModerateFrom)).Weighted(Weights.Pace),
            ],
            Steps =
            [
                Finding.Of(FindingKind.RateSlowStepChange, Slot.Number("latest", latest.Value), Slot.Number("earlier", earlier.Value), Slot.Number("change", change), RateText.Hours("hours", hours)),
                Finding.Of(
                    highRisk ? FindingKind.RateSlowStepPerDayHighRisk : FindingKind.RateSlowStepPerDay,
                    Slot.Number("change", change),
                    RateText.Hours("hours", hours),
                    Slot.Rounded("perDay", perDay, 1),
                    Slot.Number("goal", goal),
                    Slot.Text("limits", limits.Name)),
                RateText.HighRisk(factors, limits, options),
            ],
            NextSteps = [Finding.Of(FindingKind.RateSlowNextRecheck), Finding.Of(FindingKind.RateSlowNextTreatment)],
            Cautions = RateText.HighRiskCaution(factors, limits) is { } caution ? [caution] : [],
            Sources = RateText.Sources(limits),
        };
        return new Card
        {
            Content = content,
            Indicator = CardIndicator.Info,
            Topic = Topic,
            RuleIds = [RuleId, RuleId + ".slow"],
            ResourcesUsed = [earlier.Reference, latest.Reference],
        };
    }
}
