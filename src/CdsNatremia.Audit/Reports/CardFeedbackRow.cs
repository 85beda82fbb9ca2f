using CdsNatremia.Audit.Records;

namespace CdsNatremia.Audit.Reports;

/// <summary>One stored feedback, as the store reads it for the report.</summary>
/// <param name="Card">The card uuid.</param>
/// <param name="Outcome">Accepted or overridden.</param>
/// <param name="Reason">The coded override reason, when given.</param>
public sealed record CardFeedbackRow(Guid Card, FeedbackOutcome Outcome, ReasonCoding? Reason);
