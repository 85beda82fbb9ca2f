namespace CdsNatremia.Audit.Reports;

/// <summary>
/// Per rule, for cards issued in [<see cref="From"/>, <see cref="To"/>): how many were shown, accepted and overridden,
/// why they were overridden, and the override rate over time. A card counts once per rule that produced it; a card
/// with both accepted and overridden feedback (clinicians may act on a card more than once) counts in both.
/// </summary>
/// <param name="From">Start of the range (inclusive, UTC).</param>
/// <param name="To">End of the range (exclusive, UTC).</param>
/// <param name="ServiceId">The service the report is limited to, or null for all.</param>
/// <param name="BucketDays">Length of one point of <see cref="RuleOverrides.Series"/>, in days (1, 7 or 30 by range length).</param>
/// <param name="Rules">One row per rule, ordered by rule id.</param>
public sealed record OverrideReport(DateTimeOffset From, DateTimeOffset To, string? ServiceId, int BucketDays, IReadOnlyList<RuleOverrides> Rules)
{
    /// <summary>True when cards marked as test traffic are counted; false (the default) when they are left out.</summary>
    public bool TestTrafficIncluded { get; init; }

    /// <summary>Cards marked as test traffic in the range (and service) that the report left out; 0 when they are included.</summary>
    public long TestCardsExcluded { get; init; }
}
