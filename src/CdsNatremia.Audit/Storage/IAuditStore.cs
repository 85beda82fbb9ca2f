using CdsNatremia.Audit.Records;
using CdsNatremia.Audit.Reports;

namespace CdsNatremia.Audit.Storage;

/// <summary>
/// The audit trail's storage: issued cards, feedback, the override report and the retention purge. One interface,
/// two implementations (embedded SQLite, shared PostgreSQL) that pass the same test suite. Every write is one
/// transaction that has committed durably when the returned task completes. Thread-safe.
/// </summary>
public interface IAuditStore : IAsyncDisposable
{
    /// <summary>Which database this is ("sqlite" or "postgresql"), for logs and readiness.</summary>
    string Kind { get; }

    /// <summary>Creates the schema or migrates it to the current version. Safe to call from several instances at once.</summary>
    Task InitializeAsync(CancellationToken cancellationToken);

    /// <summary>Records the cards of one hook response, all or none.</summary>
    Task RecordIssuedAsync(IReadOnlyList<IssuedCardRecord> cards, CancellationToken cancellationToken);

    /// <summary>
    /// Records one feedback request, all or none: every card must have been issued by <paramref name="serviceId"/> and
    /// every accepted suggestion must belong to its card. An entry already stored (same identity, see
    /// <see cref="FeedbackEntry.IdentityKey"/>) is not stored again.
    /// </summary>
    Task<FeedbackResult> RecordFeedbackAsync(string serviceId, IReadOnlyList<FeedbackEntry> entries, DateTimeOffset receivedAt, CancellationToken cancellationToken);

    /// <summary>
    /// When a clinician last answered (accepted or overrode) a card with <paramref name="fingerprint"/> for the patient
    /// <paramref name="patientPseudonym"/>, at or after <paramref name="since"/> (outcome time); null when never.
    /// </summary>
    Task<DateTimeOffset?> LastReviewedAsync(string patientPseudonym, string fingerprint, DateTimeOffset since, CancellationToken cancellationToken);

    /// <summary>The record of a card, or null when unknown or purged.</summary>
    Task<IssuedCardRecord?> FindCardAsync(Guid cardUuid, CancellationToken cancellationToken);

    /// <summary>
    /// The cards issued for one patient, given the patient's pseudonym under every known key with each key's id
    /// (<see cref="Pseudonyms.PatientPseudonymizer.AllPseudonyms"/>), so a look-up spans key rotations. Oldest first.
    /// </summary>
    Task<IReadOnlyList<IssuedCardRecord>> FindCardsOfPatientAsync(IReadOnlyList<Pseudonyms.KeyedPseudonym> pseudonyms, CancellationToken cancellationToken)
        => throw new NotSupportedException($"{GetType().Name} cannot look up a patient's cards.");

    /// <summary>The feedback stored for a card, oldest outcome first.</summary>
    Task<IReadOnlyList<FeedbackEntry>> FindFeedbackAsync(Guid cardUuid, CancellationToken cancellationToken);

    /// <summary>
    /// The override report for cards issued in [from, to), optionally for one service. Cards marked as test traffic
    /// are left out (and counted) unless <paramref name="includeTestTraffic"/> is true.
    /// </summary>
    Task<OverrideReport> ReportAsync(DateTimeOffset from, DateTimeOffset to, string? serviceId, bool includeTestTraffic, CancellationToken cancellationToken);

    /// <summary>Deletes cards issued before <paramref name="issuedBefore"/> with their feedback; returns the cards deleted.</summary>
    Task<int> PurgeAsync(DateTimeOffset issuedBefore, CancellationToken cancellationToken);

    /// <summary>How many issued-card and feedback records are stored.</summary>
    Task<(long Cards, long Feedback)> CountAsync(CancellationToken cancellationToken);
}
