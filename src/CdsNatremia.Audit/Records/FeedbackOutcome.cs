namespace CdsNatremia.Audit.Records;

/// <summary>What the clinician did with a card (CDS Hooks 2.0 feedback "outcome").</summary>
public enum FeedbackOutcome
{
    /// <summary>"accepted": one or more of the card's suggestions were taken.</summary>
    Accepted,

    /// <summary>"overridden": the card was dismissed, with or without a reason.</summary>
    Overridden,
}
