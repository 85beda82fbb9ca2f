using CdsNatremia.Audit.Records;

namespace CdsNatremia.Audit.Tests.Support;

/// <summary>Test data: invented card records and feedback entries.</summary>
public static class Some
{
    /// <summary>The clock of every test: the scenario library's anchor.</summary>
    public static readonly DateTimeOffset Now = new(2026, 3, 10, 12, 0, 0, TimeSpan.Zero);

    /// <summary>An invented pseudonym (64 hex characters, as HMAC-SHA256 gives).</summary>
    public const string Pseudonym = "4f2c9b0e7d1a6c3b8e5f0a2d4c6b8e1f3a5c7e9b0d2f4a6c8e0b2d4f6a8c0e2b";

    public const string ServiceId = "natremia-chart-review";

    public static IssuedCardRecord Card(
        Guid? uuid = null,
        DateTimeOffset? issuedAt = null,
        string serviceId = ServiceId,
        string[]? rules = null,
        int suggestions = 1,
        string pseudonym = Pseudonym)
    {
        var suggestionUuids = Enumerable.Range(0, suggestions).ToDictionary(i => $"order-{i}", _ => Guid.NewGuid(), StringComparer.Ordinal);
        return new IssuedCardRecord
        {
            CardUuid = uuid ?? Guid.NewGuid(),
            ServiceId = serviceId,
            Hook = "patient-view",
            HookInstance = Guid.NewGuid(),
            PatientPseudonym = pseudonym,
            RuleIds = rules ?? ["sodium.severity"],
            KnowledgeVersion = "kb-test-1",
            SoftwareVersion = "0.1.0-test",
            Indicator = "critical",
            Topic = "sodium-assessment",
            Summary = "Sodium 124 mmol/L (profound hyponatremia, 10 Mar 07:40 UTC).",
            ResourcesUsed = ["Observation/na-1", "Observation/na-0"],
            SuggestionUuids = suggestionUuids,
            IssuedAt = issuedAt ?? Now,
        };
    }

    public static FeedbackEntry Accepted(IssuedCardRecord card, DateTimeOffset? at = null)
        => new()
        {
            Card = card.CardUuid,
            Outcome = FeedbackOutcome.Accepted,
            AcceptedSuggestions = [card.SuggestionUuids.Values.First()],
            OutcomeTimestamp = at ?? card.IssuedAt.AddMinutes(2),
        };

    public static FeedbackEntry Overridden(IssuedCardRecord card, string? reasonCode = null, DateTimeOffset? at = null, string? comment = null)
        => new()
        {
            Card = card.CardUuid,
            Outcome = FeedbackOutcome.Overridden,
            OverrideReason = reasonCode is null ? null : new ReasonCoding(ReasonSystem, reasonCode, null),
            UserComment = comment,
            OutcomeTimestamp = at ?? card.IssuedAt.AddMinutes(3),
        };

    public const string ReasonSystem = "https://cdsnatremia.example.org/fhir/CodeSystem/override-reason";
}
