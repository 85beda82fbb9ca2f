using System.Security.Cryptography;
using System.Text;

namespace CdsNatremia.Audit.Records;

/// <summary>One validated CDS Hooks feedback entry.</summary>
public sealed record FeedbackEntry
{
    /// <summary>The card uuid the feedback is about.</summary>
    public required Guid Card { get; init; }

    /// <summary>Accepted or overridden.</summary>
    public required FeedbackOutcome Outcome { get; init; }

    /// <summary>Accepted suggestion uuids (non-empty when accepted, empty when overridden).</summary>
    public IReadOnlyList<Guid> AcceptedSuggestions { get; init; } = [];

    /// <summary>The coded override reason, when the clinician chose one.</summary>
    public ReasonCoding? OverrideReason { get; init; }

    /// <summary>Free-text comment on the override, when sent.</summary>
    public string? UserComment { get; init; }

    /// <summary>When the clinician acted, as sent (stored to the millisecond, UTC).</summary>
    public required DateTimeOffset OutcomeTimestamp { get; init; }

    /// <summary>
    /// The identity of this feedback: card + outcome + outcome time (UTC, to the millisecond) + accepted suggestion
    /// uuids (sorted). Two entries with the same identity are the same feedback arriving twice and are stored once;
    /// the override reason and comment are not part of it (a resend carries the same ones).
    /// </summary>
    public string IdentityKey()
    {
        var text = string.Join(
            '|',
            Card.ToString("D"),
            Outcome == FeedbackOutcome.Accepted ? "accepted" : "overridden",
            OutcomeTimestamp.ToUnixTimeMilliseconds().ToString(System.Globalization.CultureInfo.InvariantCulture),
            string.Join(',', AcceptedSuggestions.Select(s => s.ToString("D")).Order(StringComparer.Ordinal)));
        return Convert.ToHexStringLower(SHA256.HashData(Encoding.UTF8.GetBytes(text)));
    }
}
