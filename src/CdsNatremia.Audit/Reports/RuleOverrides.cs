namespace CdsNatremia.Audit.Reports;

/// <summary>One rule's line of the override report.</summary>
/// <param name="RuleId">The rule id, e.g. "sodium.severity".</param>
/// <param name="Shown">Cards issued that this rule produced.</param>
/// <param name="Accepted">Of those, cards with at least one "accepted" feedback.</param>
/// <param name="Overridden">Of those, cards with at least one "overridden" feedback.</param>
/// <param name="Reasons">Overridden cards per reason (a card counts once per distinct reason; "no reason given" has a null code).</param>
/// <param name="Series">Shown and overridden per time bucket, oldest first, every bucket of the range present.</param>
public sealed record RuleOverrides(string RuleId, int Shown, int Accepted, int Overridden, IReadOnlyList<ReasonCount> Reasons, IReadOnlyList<OverridePoint> Series)
{
    /// <summary>Overridden ÷ shown (0 to 1), or null when nothing was shown.</summary>
    public double? OverrideRate => Shown == 0 ? null : (double)Overridden / Shown;

    /// <summary>Accepted ÷ shown (0 to 1), or null when nothing was shown.</summary>
    public double? AcceptanceRate => Shown == 0 ? null : (double)Accepted / Shown;
}
