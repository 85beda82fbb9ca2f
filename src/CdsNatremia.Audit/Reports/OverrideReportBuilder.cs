using CdsNatremia.Audit.Records;

namespace CdsNatremia.Audit.Reports;

/// <summary>Counts the override report from the rows a store reads. Pure: the same rows give the same report.</summary>
public static class OverrideReportBuilder
{
    /// <summary>Builds the report.</summary>
    /// <param name="from">Start (inclusive).</param>
    /// <param name="to">End (exclusive).</param>
    /// <param name="serviceId">The service filter, for the record.</param>
    /// <param name="cardRules">Every (card, rule) of cards issued in the range.</param>
    /// <param name="feedback">Every feedback on those cards.</param>
    public static OverrideReport Build(DateTimeOffset from, DateTimeOffset to, string? serviceId, IEnumerable<CardRuleRow> cardRules, IEnumerable<CardFeedbackRow> feedback)
    {
        ArgumentNullException.ThrowIfNull(cardRules);
        ArgumentNullException.ThrowIfNull(feedback);
        if (to <= from)
        {
            throw new ArgumentException("The report range must end after it starts.", nameof(to));
        }

        var bucketDays = BucketDays(from, to);
        var buckets = (int)Math.Ceiling((to - from).TotalDays / bucketDays);
        var byCard = feedback.GroupBy(f => f.Card).ToDictionary(g => g.Key, g => g.ToList());
        var rules = new List<RuleOverrides>();
        foreach (var rule in cardRules.GroupBy(r => r.RuleId, StringComparer.Ordinal).OrderBy(g => g.Key, StringComparer.Ordinal))
        {
            var cards = rule.DistinctBy(r => r.Card).ToList();
            var shown = new int[buckets];
            var overriddenIn = new int[buckets];
            var accepted = 0;
            var overridden = 0;
            var reasons = new Dictionary<(string? System, string? Code), (string? Display, int Cards)>();
            foreach (var card in cards)
            {
                var bucket = Math.Clamp((int)((card.IssuedAt - from).TotalDays / bucketDays), 0, buckets - 1);
                shown[bucket]++;
                var entries = byCard.GetValueOrDefault(card.Card) ?? [];
                if (entries.Any(e => e.Outcome == FeedbackOutcome.Accepted))
                {
                    accepted++;
                }

                var overrides = entries.Where(e => e.Outcome == FeedbackOutcome.Overridden).ToList();
                if (overrides.Count == 0)
                {
                    continue;
                }

                overridden++;
                overriddenIn[bucket]++;
                var given = overrides.Where(e => e.Reason is not null).Select(e => e.Reason!).DistinctBy(r => (r.System, r.Code)).ToList();
                if (given.Count == 0)
                {
                    Count(reasons, null, null, null);
                }

                foreach (var reason in given)
                {
                    Count(reasons, reason.System, reason.Code, reason.Display);
                }
            }

            var series = Enumerable.Range(0, buckets)
                .Select(i => new OverridePoint(from.AddDays((double)i * bucketDays), shown[i], overriddenIn[i]))
                .ToList();
            var reasonList = reasons
                .Select(r => new ReasonCount(r.Key.System, r.Key.Code, r.Value.Display, r.Value.Cards))
                .OrderByDescending(r => r.Cards)
                .ThenBy(r => r.Code is null)
                .ThenBy(r => r.System, StringComparer.Ordinal)
                .ThenBy(r => r.Code, StringComparer.Ordinal)
                .ToList();
            rules.Add(new RuleOverrides(rule.Key, cards.Count, accepted, overridden, reasonList, series));
        }

        return new OverrideReport(from, to, serviceId, bucketDays, rules);
    }

    /// <summary>Days per series point: 1 up to 62 days, 7 up to 366 days, else 30.</summary>
    public static int BucketDays(DateTimeOffset from, DateTimeOffset to)
    {
        var days = (to - from).TotalDays;
        return days <= 62 ? 1 : days <= 366 ? 7 : 30;
    }

    private static void Count(Dictionary<(string?, string?), (string?, int)> reasons, string? system, string? code, string? display)
    {
        var key = (system, code);
        var (known, count) = reasons.GetValueOrDefault(key);
        reasons[key] = (known ?? display, count + 1);
    }
}
