using CdsNatremia.Core.Assessment;
using CdsNatremia.Core.Cards;
using CdsNatremia.Core.Engine;
using CdsNatremia.Core.Facts;
using CdsNatremia.Core.Text;

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
        var factors = HighRiskFactors.Find(request.Facts, HighRiskFactors.LowestOfLowStretch(context.Sodium, episode.Nadir, context.Thresholds.NormalFrom), context.Knowledge, options, context.Display);
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
        var summary = worst.PassedAt is { } peak
            ? Summary.Fit(Invariant.Format(
                $"Sodium reached {Invariant.Number(peak.Value)} from {Invariant.Number(worst.Baseline.Value)} ({RateText.Mmol(peak.Value - worst.Baseline.Value)}): the {Invariant.Number(worst.Limit)} mmol/L limit was passed; now {Invariant.Number(worst.Latest.Value)}."))
            : Summary.Fit(Invariant.Format(
                $"Sodium rose {RateText.Mmol(worst.Rise)} in {RateText.Hours(worst.ElapsedHours)} h ({Invariant.Number(worst.Baseline.Value)} → {Invariant.Number(worst.Latest.Value)}): {(past ? "at or past" : "approaching")} the {Invariant.Number(worst.Limit)} mmol/L limit ({worst.LimitLabel})."));

        var findings = new List<string>
        {
            "Start (nadir of this episode): " + Cite.Result(episode.Nadir, context.Display),
            "Latest: " + Cite.Result(episode.Latest, context.Display),
            Invariant.Format($"Rise since the nadir: {RateText.Mmol(episode.RiseSinceNadir)} in {RateText.Hours(episode.HoursSinceNadir)} h."),
            Invariant.Format($"Limit reached or approached: {RateText.Mmol(worst.Limit)} ({worst.LimitLabel}, {Markdown.Escape(limits.Name)}); rise in that window {RateText.Mmol(worst.Rise)}; {RateText.Status(worst.Status)}."),
        };
        if (worst.PassedAt is { } passed)
        {
            findings.Add(Invariant.Format(
                $"**The limit was passed**: {Cite.Result(passed, context.Display)} is {RateText.Mmol(passed.Value - worst.Baseline.Value)} above {Invariant.Number(worst.Baseline.Value)} mmol/L ({Markdown.Escape(worst.Baseline.Reference)}); sodium has come down since."));
        }

        if (worst.HoursLeft is { } left)
        {
            findings.Add(left > 0
                ? Invariant.Format($"Hours left in that window: {RateText.Hours(left)} h (it ends {context.Display.Time(worst.End)}).")
                : Invariant.Format($"That window ended at {context.Display.Time(worst.End)}."));
        }

        if (worst.ProjectedRise is { } projected)
        {
            findings.Add(Invariant.Format($"If the current rate goes on, the rise would be {RateText.MmolRounded(projected)} by {context.Display.Time(worst.End)}."));
        }

        findings.Add(RateText.HighRisk(factors, limits));

        var detail = new DetailWriter()
            .Paragraph(Invariant.Format($"**Correction-rate watch** as of {context.Display.Time(context.Request.Now)}. Advisory only."))
            .Bullets("Findings", findings)
            .Numbered("Computation (with its inputs)", Steps(episode, day, twoDays, options, context.Display))
            .Bullets("Sodium results in this episode", episode.Results.Select(r => Cite.Result(r, context.Display)))
            .Bullets("Options clinicians usually discuss (with a senior clinician, under local protocol; not orders)",
            [
                "Pausing or stopping therapy that raises sodium (hypertonic or isotonic saline, vasopressin-receptor antagonists, oral salt or urea) and reviewing urine output, since a large dilute urine output can raise sodium quickly.",
                past
                    ? "Re-lowering the sodium (for example with electrolyte-free water, with or without desmopressin) is described in local protocols once a limit has been passed; whether to do it is a decision for a senior clinician."
                    : "Slowing the correction before the limit is reached, as local protocol describes.",
                "Checking sodium again soon and often while the rise is this fast, at the interval local protocol sets.",
                "The limits are for chronic hyponatremia (present 48 h or more, or of unknown duration; 2014 European guideline); where it is documented to be acute, the balance of risks differs, and a senior clinician weighs it.",
            ]);
        CardFooter.Write(detail, context, RateText.Sources(limits));

        // A stale latest result calls for a recheck first: at most a warning, never a critical interruption.
        var stale = context.Sodium.LatestIsStale;
        if (stale)
        {
            findings.Insert(0, Invariant.Format($"The latest sodium is **stale** (older than {RateText.Hours(context.Sodium.StaleAfterHours)} h): recheck before acting on this rate."));
        }

        return new Card
        {
            Summary = summary,
            Indicator = past && !stale ? CardIndicator.Critical : CardIndicator.Warning,
            Detail = detail.ToString(),
            Topic = Topic,
            RuleIds = [RuleId],
            ResourcesUsed = [.. episode.Results.Select(r => r.Reference), .. factors.Select(f => f.Reference).OfType<string>()],
            Suggestions = [LabOrders.AsSuggestion(LabOrders.SerumSodium("Sodium is rising fast; a recheck shows where the correction stands."), recommended: true)],
            SelectionBehavior = SelectionBehavior.Any,
        };
    }

    private static List<string> Steps(CorrectionEpisode episode, RateWindow day, RateWindow twoDays, CorrectionRateOptions options, TimeDisplay display)
    {
        var steps = new List<string>
        {
            Invariant.Format(
                $"**Nadir**: the lowest usable sodium in the {RateText.Hours(episode.LookbackHours)} h before the latest result: {Invariant.Number(episode.Nadir.Value)} mmol/L at {display.Time(episode.Nadir.EffectiveAt)} ({Markdown.Escape(episode.Nadir.Reference)}); {episode.Results.Count} result(s) from then on."),
            Invariant.Format(
                $"**Rise since the nadir** = {Invariant.Number(episode.Latest.Value)} − {Invariant.Number(episode.Nadir.Value)} = {RateText.Mmol(episode.RiseSinceNadir)} over {RateText.Hours(episode.HoursSinceNadir)} h."),
            RateText.Window(day, options, display),
            RateText.Window(twoDays, options, display),
        };
        if (episode.SameTimeAsLatest.Count > 0)
        {
            steps.Add(Invariant.Format(
                $"{episode.SameTimeAsLatest.Count + 1} results share the latest minute; the highest ({Invariant.Number(episode.Latest.Value)} mmol/L, {Markdown.Escape(episode.Latest.Reference)}) is taken as the latest, the cautious choice for this check. Others: {string.Join(", ", episode.SameTimeAsLatest.Select(r => Invariant.Number(r.Value) + " mmol/L (" + Markdown.Escape(r.Reference) + ")"))}."));
        }

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

        var band = context.Thresholds.NameOf(Sodium.SeverityBand.Profound);
        var changeWord = change > 0 ? "rose" : change < 0 ? "fell" : "did not change";
        var summary = Summary.Fit(Invariant.Format(
            $"Sodium still {band} at {Invariant.Number(latest.Value)} mmol/L: {changeWord} {RateText.Mmol(Math.Abs(change))} in {RateText.Hours(hours)} h, below the minimum goal of {Invariant.Number(goal)} mmol/L a day."));
        var detail = new DetailWriter()
            .Paragraph(Invariant.Format($"**Correction-rate watch** as of {context.Display.Time(context.Request.Now)}. Advisory only."))
            .Bullets("Findings",
            [
                "About a day earlier: " + Cite.Result(earlier, context.Display),
                "Latest: " + Cite.Result(latest, context.Display),
                Invariant.Format($"The sodium is still in the {band} band (below {Invariant.Number(context.Thresholds.ModerateFrom)} mmol/L), so a slow or absent rise may leave a dangerous state for longer."),
                RateText.HighRisk(factors, limits),
            ])
            .Numbered("Computation (with its inputs)",
            [
                Invariant.Format($"Change = {Invariant.Number(latest.Value)} − {Invariant.Number(earlier.Value)} = {RateText.Mmol(change)} over {RateText.Hours(hours)} h."),
                Invariant.Format($"Per 24 h = {RateText.Mmol(change)} / {RateText.Hours(hours)} h × 24 = {RateText.MmolRounded(perDay)}; minimum goal {RateText.Mmol(goal)} per day{(highRisk ? " (high risk)" : string.Empty)} ({Markdown.Escape(limits.Name)})."),
            ])
            .Bullets("Options clinicians usually discuss (with a senior clinician, under local protocol; not orders)",
            [
                "Whether the current treatment matches the cause found by the work-up, and whether symptoms call for faster correction within the limits.",
                "Checking sodium again at the interval local protocol sets.",
            ]);
        CardFooter.Write(detail, context, RateText.Sources(limits));
        return new Card
        {
            Summary = summary,
            Indicator = CardIndicator.Info,
            Detail = detail.ToString(),
            Topic = Topic,
            RuleIds = [RuleId, RuleId + ".slow"],
            ResourcesUsed = [earlier.Reference, latest.Reference],
        };
    }
}
